using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using TorchSharp;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// A TorchSharp module that evaluates a variational circuit (through <see cref="CircuitFunction"/>) and
/// maps the observable expectations to outputs with trainable weights and biases
/// (Skolik, Jerbi &amp; Dunjko 2022, Quantum 6, 720: trainable input and output scaling).
/// <para>
/// Input [B, circuit inputs] float64 → output [B, outputs]. Readout per_action: out_a = w_a·⟨O_a⟩ + b_a
/// (w initialised to 1, b to 0); linear: out = W⟨O⟩ + b (W uniform in ±1/√n_obs, b = 0).
/// Flat parameter order (one parameter tensor <c>weights</c>): circuit parameters (the circuit's own
/// numbering), then readout weights (per_action: [A]; linear: [A, n_obs] row-major), then readout biases [A].
/// Circuit parameters that are input scales start at 1; rotation angles uniform in [−π, π) (common practice).
/// </para>
/// Not safe for concurrent calls (the evaluator is not).
/// </summary>
public sealed class QuantumLayer : nn.Module<Tensor, Tensor>
{
    private readonly Parameter _weights;
    private readonly int _circuitCount, _readoutWeightCount;

    /// <summary>Builds a layer for any circuit and observables (library use).</summary>
    /// <param name="isScaleParameter">Optional: which circuit parameters are input scales (initialised to 1).</param>
    public QuantumLayer(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, ReadoutKind readout,
        int outputCount, RandomStream random, Func<int, bool>? isScaleParameter = null)
        : base("quantum_layer")
    {
        ArgumentNullException.ThrowIfNull(circuit);
        ArgumentNullException.ThrowIfNull(observables);
        Circuit = circuit;
        Observables = observables;
        Evaluator = ExpectationEvaluatorFactory.Create(circuit, observables, options);
        Readout = readout;
        OutputCount = outputCount;
        if (readout == ReadoutKind.PerAction && observables.Count != outputCount)
            throw new ArgumentException($"per-action read-out needs one observable per output: {observables.Count} observables, {outputCount} outputs");
        _circuitCount = Evaluator.ParameterCount;
        _readoutWeightCount = readout == ReadoutKind.PerAction ? outputCount : outputCount * observables.Count;
        var values = new double[_circuitCount + _readoutWeightCount + outputCount];
        for (int i = 0; i < _circuitCount; i++)
            values[i] = isScaleParameter?.Invoke(i) == true ? 1.0 : Math.PI * (2.0 * random.NextDouble() - 1.0);
        double bound = 1.0 / Math.Sqrt(observables.Count);
        for (int i = 0; i < _readoutWeightCount; i++)
            values[_circuitCount + i] = readout == ReadoutKind.PerAction ? 1.0 : bound * (2.0 * random.NextDouble() - 1.0);
        _weights = TensorMemory.NewParameter(values, values.Length);
        register_parameter("weights", _weights);
        HardwareExecutionsPerGradientRow = GradientCost.HardwareExecutionsPerGradient(circuit, observables);
    }

    public Circuit Circuit { get; }
    public IReadOnlyList<Observable> Observables { get; }
    public IExpectationEvaluator Evaluator { get; }
    public ReadoutKind Readout { get; }
    public int InputCount => Evaluator.InputCount;
    public int OutputCount { get; }
    public int CircuitParameterCount => _circuitCount;
    public int ReadoutParameterCount => _readoutWeightCount + OutputCount;
    public int ParameterCount => _circuitCount + _readoutWeightCount + OutputCount;
    public Parameter Weights => _weights;

    /// <summary>Hardware circuit executions one input row's gradient would cost (parameter shift × measurement settings).</summary>
    public long HardwareExecutionsPerGradientRow { get; }

    public override Tensor forward(Tensor input) => Forward(input);

    public Tensor Forward(Tensor input)
    {
        using var scope = torch.NewDisposeScope();
        var theta = _weights.narrow(0, 0, _circuitCount);
        var expectations = CircuitFunction.apply(input, theta, Evaluator);
        var w = _weights.narrow(0, _circuitCount, _readoutWeightCount);
        var b = _weights.narrow(0, _circuitCount + _readoutWeightCount, OutputCount);
        var y = Readout == ReadoutKind.PerAction
            ? expectations * w + b
            : nn.functional.linear(expectations, w.view(OutputCount, Observables.Count), b);
        return y.MoveToOuterDisposeScope();
    }

    /// <summary>Expectations → outputs for one row with read-out parameters from <paramref name="readout"/> (weights then biases).</summary>
    internal void ReadoutRow(ReadOnlySpan<double> readout, ReadOnlySpan<double> expectations, Span<double> output)
    {
        var w = readout[.._readoutWeightCount];
        var b = readout.Slice(_readoutWeightCount, OutputCount);
        int nObs = Observables.Count;
        for (int a = 0; a < OutputCount; a++)
        {
            if (Readout == ReadoutKind.PerAction)
            {
                output[a] = expectations[a] * w[a] + b[a];
            }
            else
            {
                double s = b[a];
                var row = w.Slice(a * nObs, nObs);
                for (int j = 0; j < nObs; j++) s += row[j] * expectations[j];
                output[a] = s;
            }
        }
    }
}
