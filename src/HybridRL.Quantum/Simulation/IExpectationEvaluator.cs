using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// Expectations of a fixed list of observables for a batch of input rows, and their vector–Jacobian
/// product with respect to parameters and inputs. Not safe for concurrent calls on one instance.
/// </summary>
public interface IExpectationEvaluator
{
    int InputCount { get; }
    int ParameterCount { get; }
    int OutputCount { get; }
    SimulationMode Mode { get; }
    GradientMethod GradientMethod { get; }
    ExecutionCounters Counters { get; }

    /// <summary>
    /// inputs: batch·InputCount row-major; parameters: ParameterCount (shared) or batch·ParameterCount
    /// (<paramref name="perRowParameters"/>); outputs: batch·OutputCount.
    /// </summary>
    void Forward(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, int batch, bool perRowParameters, Span<double> outputs);

    /// <summary>
    /// Vector–Jacobian product. gradParameters: ParameterCount (summed over rows) or batch·ParameterCount
    /// (per row); gradInputs: batch·InputCount (may be empty to skip). Both are overwritten.
    /// </summary>
    void Backward(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, int batch, bool perRowParameters,
        ReadOnlySpan<double> gradOutputs, Span<double> gradParameters, Span<double> gradInputs);

    /// <summary>Seed and call counter, for checkpoints (shot and trajectory streams derive from both).</summary>
    EvaluatorRandomState GetState();
    void SetState(EvaluatorRandomState state);

    /// <summary>Training progress t ∈ [0, 1] that noise schedules follow (ignored without noise).</summary>
    double NoiseProgress { get; set; }
}
