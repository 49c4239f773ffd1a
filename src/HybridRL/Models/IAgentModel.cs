using HybridRL.Quantum.Circuits;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// A function approximator from observations to one value per action, trainable through TorchSharp
/// autograd and through its flat parameter vector. Implementations are not safe for concurrent calls.
/// </summary>
public interface IAgentModel : IDisposable
{
    int ObservationSize { get; }
    /// <summary>Outputs per observation (= action count).</summary>
    int OutputCount { get; }
    int ParameterCount { get; }
    /// <summary>Parameter count per component, in flat order (e.g. compressor, input_scaling, circuit, readout).</summary>
    IReadOnlyDictionary<string, int> ParameterCounts { get; }

    /// <summary>[B, obs] float64 → [B, actions], autograd-capable.</summary>
    Tensor Forward(Tensor observations);

    /// <summary>Trainable parameters for a TorchSharp optimiser (together they hold the flat vector, in order).</summary>
    IEnumerable<Parameter> Parameters();

    void GetFlat(Span<double> destination);
    void SetFlat(ReadOnlySpan<double> source);

    /// <summary>Acting path: no autograd, no allocation once buffers have grown to the batch size.</summary>
    void ForwardNoGrad(ReadOnlySpan<double> observations, int batch, Span<double> output);

    /// <summary>
    /// Evaluates member k's parameters (row k of <paramref name="flatParametersPerMember"/>, K×P) on member k's
    /// observation (row k of <paramref name="observationsPerMember"/>, K×obs) into row k of <paramref name="outputs"/> (K×actions).
    /// Equals K separate <see cref="ForwardNoGrad"/> calls bit for bit (exact simulation).
    /// </summary>
    void PopulationForward(ReadOnlySpan<double> flatParametersPerMember, ReadOnlySpan<double> observationsPerMember, int members, Span<double> outputs);

    /// <summary>
    /// True when the outputs are a fixed function of the parameters and the observation (no shot or trajectory sampling),
    /// so a greedy action computed once may be reused for the same observation under the same parameters.
    /// </summary>
    bool DeterministicOutputs { get; }

    /// <summary>Circuit executions and shots so far; null for classical models.</summary>
    ExecutionCounters? Counters { get; }

    /// <summary>Hardware circuit executions one observation row's gradient would cost (0 for classical models).</summary>
    long HardwareExecutionsPerGradientRow { get; }
}
