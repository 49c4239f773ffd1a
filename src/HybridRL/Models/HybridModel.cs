using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Noise;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using TorchSharp;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// Compressor (optional) → variational circuit → trainable read-out.
/// <para>
/// Flat parameter order: the compressor's weights (see <see cref="MpsCompressor"/> / <see cref="DenseNetwork"/>),
/// then the quantum layer's weights (see <see cref="QuantumLayer"/>: circuit parameters in the circuit's
/// numbering — per layer the input scales, then the rotation angles, see <see cref="ModelCircuit"/> — then
/// read-out weights, then read-out biases). <see cref="ParameterCounts"/> keys: compressor (if any),
/// input_scaling, circuit (rotation angles), readout.
/// </para>
/// </summary>
public sealed class HybridModel : nn.Module<Tensor, Tensor>, IAgentModel, ISimulatedModel
{
    private readonly IModelStage? _compressor;
    private readonly QuantumLayer _layer;
    private readonly Dictionary<string, int> _counts = new();
    private double[] _features = [], _expectations = [], _theta = [], _scratch;
    private readonly int _compressorCount, _featureCount;

    public HybridModel(ModelSettings settings, int observationSize, int actionCount, ulong seed)
        : base("hybrid_model")
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (observationSize < 1) throw new ArgumentOutOfRangeException(nameof(observationSize), observationSize, "observation size must be positive");
        if (actionCount < 1) throw new ArgumentOutOfRangeException(nameof(actionCount), actionCount, "action count must be positive");
        ObservationSize = observationSize;
        OutputCount = actionCount;
        var init = RandomStream.FromRoot(seed, "model.init");
        var cs = settings.Compressor;
        int capacity = ModelCircuit.Capacity(settings.Circuit.Encoding, settings.Circuit.Qubits);
        int features = observationSize;
        if (cs.Kind != CompressorKind.None && settings.Circuit.Encoding == EncodingKind.Basis)
            throw new ModelConfigurationException("basis encoding reads an integer state index; a compressor cannot produce one", "model.compressor.kind", "model.circuit.encoding");
        if (cs.Kind != CompressorKind.None)
        {
            features = cs.OutputSize == 0 ? capacity : cs.OutputSize;
            if (features > capacity)
                throw new ModelConfigurationException(
                    $"model.compressor.output_size = {features} exceeds what a {settings.Circuit.Encoding} encoding on {settings.Circuit.Qubits} qubits holds ({capacity})",
                    "model.compressor.output_size", "model.circuit.qubits", "model.circuit.encoding");
            if (features < 1) throw new ModelConfigurationException($"model.compressor.output_size = {features} must be positive", "model.compressor.output_size");
            var rc = init.Derive("compressor");
            if (cs.Kind == CompressorKind.Mps)
                _compressor = new MpsCompressor(observationSize, cs.BondDimension, features, cs.FeatureMap, rc);
            else
                _compressor = new DenseNetwork("compressor", observationSize, cs.Hidden, features, cs.Activation, rc);
        }
        _featureCount = features;
        CircuitDesign = ModelCircuit.Build(settings.Circuit, features, actionCount);
        var options = SimulationOptionsFor(settings.Simulation, settings.Circuit.Qubits, seed);
        _layer = new QuantumLayer(CircuitDesign.Circuit, CircuitDesign.Observables, options, settings.Circuit.Readout, actionCount,
            init.Derive("circuit"), CircuitDesign.IsScaleParameter, settings.Circuit.TrainableReadout);
        if (_compressor is not null)
        {
            register_module("compressor", (nn.Module)_compressor);
            _compressorCount = _compressor.ParameterCount;
            _counts["compressor"] = _compressorCount;
        }
        register_module("quantum_layer", _layer);
        _counts["input_scaling"] = CircuitDesign.ScaleParameterCount;
        _counts["circuit"] = CircuitDesign.RotationParameterCount;
        _counts["readout"] = _layer.ReadoutParameterCount;
        ParameterCount = _compressorCount + _layer.ParameterCount;
        DeterministicOutputs = options.Shots == 0 && options.Mode is SimulationMode.StateVector or SimulationMode.DensityMatrix;
        _scratch = new double[_compressor?.ScratchSize ?? 0];
    }

    /// <summary>Maps simulation settings to engine options; errors name the config keys.</summary>
    public static SimulationOptions SimulationOptionsFor(SimulationSettings s, int qubits, ulong seed)
    {
        var rules = new List<NoiseRule>();
        // Strengths follow the configured schedule over training progress (the trainers set NoiseProgress).
        StrengthSchedule S(double v) => s.Schedule switch
        {
            ScheduleKind.LinearDrift => StrengthSchedule.LinearDrift(v, Math.Clamp(v * s.EndScale, 0, 1)),
            ScheduleKind.Step => StrengthSchedule.Step(v, Math.Clamp(v * s.EndScale, 0, 1), s.StepAt),
            _ => StrengthSchedule.Constant(v),
        };
        if (s.Depolarizing > 0) rules.Add(new NoiseRule(NoiseChannelKind.Depolarizing, S(s.Depolarizing)));
        if (s.TwoQubitDepolarizing > 0) rules.Add(new NoiseRule(NoiseChannelKind.Depolarizing2, S(s.TwoQubitDepolarizing), NoiseRule.TwoQubitGates));
        if (s.AmplitudeDamping > 0) rules.Add(new NoiseRule(NoiseChannelKind.AmplitudeDamping, S(s.AmplitudeDamping)));
        if (s.PhaseDamping > 0) rules.Add(new NoiseRule(NoiseChannelKind.PhaseDamping, S(s.PhaseDamping)));
        if (s.BitFlip > 0) rules.Add(new NoiseRule(NoiseChannelKind.BitFlip, S(s.BitFlip)));
        if (s.PhaseFlip > 0) rules.Add(new NoiseRule(NoiseChannelKind.PhaseFlip, S(s.PhaseFlip)));
        var readout = s.Readout > 0 ? ReadoutError.Uniform(qubits, s.Readout, s.Readout) : null;
        NoiseModel? noise = rules.Count > 0 || readout is not null ? new NoiseModel(rules, readout) : null;
        if (s.Mode == SimulationMode.StateVector && noise is not null)
            throw new ModelConfigurationException("noise strengths are set but model.simulation.mode is exact; use density_matrix or trajectories (or shots for read-out error only)",
                "model.simulation.mode", "model.simulation.noise");
        if (s.Mode == SimulationMode.StateVector && s.Shots > 0)
            throw new ModelConfigurationException($"model.simulation.shots = {s.Shots} with the exact mode; use mode shots", "model.simulation.mode", "model.simulation.shots");
        if (s.Mode == SimulationMode.Shots && s.Shots <= 0)
            throw new ModelConfigurationException("model.simulation.mode is shots but model.simulation.shots is not positive", "model.simulation.shots");
        if (s.Gradient == GradientMethod.Adjoint && s.Mode != SimulationMode.StateVector)
            throw new ModelConfigurationException($"adjoint gradients need the exact mode, not {s.Mode}; use parameter_shift", "model.simulation.gradient", "model.simulation.mode");
        return new SimulationOptions
        {
            Mode = s.Mode,
            Shots = s.Shots,
            Trajectories = s.Trajectories,
            Noise = noise,
            Seed = RandomStream.SeedFor(seed, "model.simulation", 0),
            Threads = s.Threads,
            Gradient = s.Gradient,
        };
    }

    public int ObservationSize { get; }
    public int OutputCount { get; }
    public int ParameterCount { get; }
    public IReadOnlyDictionary<string, int> ParameterCounts => _counts;
    public ModelCircuit CircuitDesign { get; }
    public QuantumLayer QuantumLayer => _layer;
    /// <summary>The compressor module (MpsCompressor or DenseNetwork), or null.</summary>
    public nn.Module? Compressor => (nn.Module?)_compressor;
    public bool DeterministicOutputs { get; }
    public ExecutionCounters? Counters => _layer.Evaluator.Counters;
    public long HardwareExecutionsPerGradientRow => _layer.HardwareExecutionsPerGradientRow;

    public EvaluatorRandomState GetSimulationState() => _layer.Evaluator.GetState();
    public void SetSimulationState(EvaluatorRandomState state) => _layer.Evaluator.SetState(state);
    public double NoiseProgress
    {
        get => _layer.Evaluator.NoiseProgress;
        set => _layer.Evaluator.NoiseProgress = value;
    }

    public override Tensor forward(Tensor input) => Forward(input);

    public Tensor Forward(Tensor observations)
    {
        if (observations.dim() != 2 || observations.shape[1] != ObservationSize)
            throw new ArgumentException($"observations must be [batch, {ObservationSize}], got [{string.Join(", ", observations.shape)}]", nameof(observations));
        if (_compressor is null) return _layer.Forward(observations);
        using var scope = torch.NewDisposeScope();
        var y = _layer.Forward(_compressor.Forward(observations));
        return y.MoveToOuterDisposeScope();
    }

    public IEnumerable<Parameter> Parameters()
    {
        if (_compressor is not null) yield return _compressor.Weights;
        yield return _layer.Weights;
    }

    public void GetFlat(Span<double> destination)
    {
        if (destination.Length != ParameterCount) throw new ArgumentException($"flat vector needs {ParameterCount} entries, got {destination.Length}", nameof(destination));
        if (_compressor is not null) TensorMemory.AsSpan(_compressor.Weights).CopyTo(destination);
        TensorMemory.AsSpan(_layer.Weights).CopyTo(destination[_compressorCount..]);
    }

    public void SetFlat(ReadOnlySpan<double> source)
    {
        if (source.Length != ParameterCount) throw new ArgumentException($"flat vector needs {ParameterCount} entries, got {source.Length}", nameof(source));
        using var _ = torch.no_grad();
        if (_compressor is not null) source[.._compressorCount].CopyTo(TensorMemory.AsSpan(_compressor.Weights));
        source[_compressorCount..].CopyTo(TensorMemory.AsSpan(_layer.Weights));
    }

    private static void Ensure(ref double[] buffer, int length)
    {
        if (buffer.Length < length) buffer = new double[length];
    }

    public void ForwardNoGrad(ReadOnlySpan<double> observations, int batch, Span<double> output)
    {
        CheckSizes(observations.Length, batch, output.Length);
        var layerWeights = TensorMemory.AsSpan(_layer.Weights);
        ReadOnlySpan<double> features;
        if (_compressor is not null)
        {
            Ensure(ref _features, batch * _featureCount);
            var cw = TensorMemory.AsSpan(_compressor.Weights);
            for (int b = 0; b < batch; b++)
                _compressor.ForwardRow(cw, observations.Slice(b * ObservationSize, ObservationSize), _features.AsSpan(b * _featureCount, _featureCount), _scratch);
            features = _features.AsSpan(0, batch * _featureCount);
        }
        else features = observations;
        int nObs = _layer.Evaluator.OutputCount;
        Ensure(ref _expectations, batch * nObs);
        _layer.Evaluator.Forward(features, layerWeights[.._layer.CircuitParameterCount], batch, false, _expectations.AsSpan(0, batch * nObs));
        var readout = layerWeights[_layer.CircuitParameterCount..];
        for (int b = 0; b < batch; b++)
            _layer.ReadoutRow(readout, _expectations.AsSpan(b * nObs, nObs), output.Slice(b * OutputCount, OutputCount));
    }

    public void PopulationForward(ReadOnlySpan<double> flatParametersPerMember, ReadOnlySpan<double> observationsPerMember, int members, Span<double> outputs)
    {
        CheckSizes(observationsPerMember.Length, members, outputs.Length);
        if (flatParametersPerMember.Length != members * ParameterCount)
            throw new ArgumentException($"population parameters need {members}×{ParameterCount} entries, got {flatParametersPerMember.Length}", nameof(flatParametersPerMember));
        int p = ParameterCount, pq = _layer.CircuitParameterCount;
        ReadOnlySpan<double> features;
        if (_compressor is not null)
        {
            Ensure(ref _features, members * _featureCount);
            for (int k = 0; k < members; k++)
                _compressor.ForwardRow(flatParametersPerMember.Slice(k * p, _compressorCount), observationsPerMember.Slice(k * ObservationSize, ObservationSize),
                    _features.AsSpan(k * _featureCount, _featureCount), _scratch);
            features = _features.AsSpan(0, members * _featureCount);
        }
        else features = observationsPerMember;
        Ensure(ref _theta, members * pq);
        for (int k = 0; k < members; k++)
            flatParametersPerMember.Slice(k * p + _compressorCount, pq).CopyTo(_theta.AsSpan(k * pq, pq));
        int nObs = _layer.Evaluator.OutputCount;
        Ensure(ref _expectations, members * nObs);
        _layer.Evaluator.Forward(features, _theta.AsSpan(0, members * pq), members, true, _expectations.AsSpan(0, members * nObs));
        for (int k = 0; k < members; k++)
            _layer.ReadoutRow(flatParametersPerMember.Slice(k * p + _compressorCount + pq, _layer.ReadoutParameterCount),
                _expectations.AsSpan(k * nObs, nObs), outputs.Slice(k * OutputCount, OutputCount));
    }

    private void CheckSizes(int observationLength, int rows, int outputLength)
    {
        if (rows < 0) throw new ArgumentOutOfRangeException(nameof(rows), rows, "row count must be non-negative");
        if (observationLength != rows * ObservationSize)
            throw new ArgumentException($"observations need {rows}×{ObservationSize} entries, got {observationLength}");
        if (outputLength != rows * OutputCount)
            throw new ArgumentException($"outputs need {rows}×{OutputCount} entries, got {outputLength}");
    }
}
