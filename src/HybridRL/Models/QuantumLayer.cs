using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using TorchSharp;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// A TorchSharp module that evaluates a variational circuit (one autograd node, <see cref="QuantumLayerFunction"/>) and
/// maps the observable expectations to outputs with trainable weights and biases
/// (Skolik, Jerbi &amp; Dunjko 2022, Quantum 6, 720: trainable input and output scaling).
/// <para>
/// Input [B, circuit inputs] float64 → output [B, outputs]. Readout per_action: out_a = w_a·⟨O_a⟩ + b_a
/// (w initialised to 1, b to 0); linear: out = W⟨O⟩ + b (W uniform in ±1/√n_obs, b = 0).
/// Flat parameter order (one parameter tensor <c>weights</c>): circuit parameters (the circuit's own
/// numbering), then readout weights (per_action: [A]; linear: [A, n_obs] row-major), then readout biases [A].
/// Circuit parameters that are input scales start at 1; rotation angles uniform in [−π, π) (common practice).
/// With a fixed read-out (<c>trainableReadout: false</c>) the read-out keeps its initial values (per_action: w = 1, b = 0;
/// linear: the seeded W, b = 0) and has no parameters: the flat vector holds the circuit parameters only.
/// </para>
/// Not safe for concurrent calls (the evaluator is not).
/// </summary>
public sealed class QuantumLayer : nn.Module<Tensor, Tensor>
{
    private readonly Parameter _weights;
    private readonly int _circuitCount, _readoutWeightCount;
    private readonly double[]? _fixedReadout; // read-out weights then biases when the read-out is not trained

    /// <summary>Builds a layer for any circuit and observables (library use).</summary>
    /// <param name="isScaleParameter">Optional: which circuit parameters are input scales (initialised to 1).</param>
    /// <param name="trainableReadout">False: the read-out stays at its initial values and is not a parameter.</param>
    public QuantumLayer(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, ReadoutKind readout,
        int outputCount, RandomStream random, Func<int, bool>? isScaleParameter = null, bool trainableReadout = true)
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
        if (!trainableReadout)
        {
            _fixedReadout = values[_circuitCount..];
            values = values[.._circuitCount];
        }
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
    public int ReadoutParameterCount => _fixedReadout is null ? _readoutWeightCount + OutputCount : 0;
    public int ParameterCount => _circuitCount + ReadoutParameterCount;
    public Parameter Weights => _weights;

    /// <summary>Hardware circuit executions one input row's gradient would cost (parameter shift × measurement settings).</summary>
    public long HardwareExecutionsPerGradientRow { get; }

    public override Tensor forward(Tensor input) => Forward(input);

    /// <summary>[B, inputs] → [B, outputs] through one autograd node (<see cref="QuantumLayerFunction"/>).</summary>
    public Tensor Forward(Tensor input) => QuantumLayerFunction.apply(input, _weights, this);

    private double[] _gradBuffer = [];
    private double[]? _readoutGradSink; // discarded read-out gradients of a fixed read-out

    /// <summary>Reusable buffer for the gradient with respect to the expectations (grows, never shrinks).</summary>
    internal Span<double> GradientBuffer(int length)
    {
        if (_gradBuffer.Length < length) _gradBuffer = new double[length];
        return _gradBuffer.AsSpan(0, length);
    }

    /// <summary>
    /// Read-out backward for a batch: writes ∂L/∂(readout weights, biases) into <paramref name="gradReadout"/>
    /// (same layout as the parameters; empty and untouched for a fixed read-out) and ∂L/∂E into <paramref name="gradExpectations"/>.
    /// </summary>
    internal void ReadoutBackward(ReadOnlySpan<double> readout, ReadOnlySpan<double> expectations, ReadOnlySpan<double> gradOutput, int batch,
        Span<double> gradReadout, Span<double> gradExpectations)
    {
        int nObs = Observables.Count, a = OutputCount;
        if (_fixedReadout is not null)
        {
            readout = _fixedReadout;
            gradReadout = _readoutGradSink ??= new double[_fixedReadout.Length];
        }
        var w = readout[.._readoutWeightCount];
        var gw = gradReadout[.._readoutWeightCount];
        var gb = gradReadout.Slice(_readoutWeightCount, a);
        gradReadout.Clear();
        gradExpectations.Clear();
        for (int b = 0; b < batch; b++)
        {
            var g = gradOutput.Slice(b * a, a);
            var e = expectations.Slice(b * nObs, nObs);
            var ge = gradExpectations.Slice(b * nObs, nObs);
            for (int k = 0; k < a; k++)
            {
                double gk = g[k];
                gb[k] += gk;
                if (Readout == ReadoutKind.PerAction)
                {
                    gw[k] += gk * e[k];
                    ge[k] = gk * w[k];
                }
                else
                {
                    var row = w.Slice(k * nObs, nObs);
                    var grow = gw.Slice(k * nObs, nObs);
                    for (int j = 0; j < nObs; j++)
                    {
                        grow[j] += gk * e[j];
                        ge[j] += gk * row[j];
                    }
                }
            }
        }
    }

    /// <summary>
    /// Expectations → outputs for one row with read-out parameters from <paramref name="readout"/> (weights then biases;
    /// ignored, and may be empty, for a fixed read-out).
    /// </summary>
    internal void ReadoutRow(ReadOnlySpan<double> readout, ReadOnlySpan<double> expectations, Span<double> output)
    {
        if (_fixedReadout is not null) readout = _fixedReadout;
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
