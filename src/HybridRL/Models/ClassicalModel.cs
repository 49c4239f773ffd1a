using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Randomness;
using TorchSharp;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// Classical baseline: a fully connected network from observations to action values.
/// Flat parameter order: that of <see cref="DenseNetwork"/> (per layer weight [out, in] row-major, then bias).
/// <see cref="ParameterCounts"/> key: network.
/// </summary>
public sealed class ClassicalModel : nn.Module<Tensor, Tensor>, IAgentModel
{
    private readonly DenseNetwork _network;
    private readonly Dictionary<string, int> _counts;
    private readonly double[] _scratch;

    public ClassicalModel(ClassicalSettings settings, int observationSize, int actionCount, ulong seed)
        : base("classical_model")
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (observationSize < 1) throw new ArgumentOutOfRangeException(nameof(observationSize), observationSize, "observation size must be positive");
        if (actionCount < 1) throw new ArgumentOutOfRangeException(nameof(actionCount), actionCount, "action count must be positive");
        foreach (int h in settings.Hidden)
            if (h < 1) throw new ModelConfigurationException($"model.classical.hidden contains {h}; hidden sizes must be positive", "model.classical.hidden");
        _network = new DenseNetwork("network", observationSize, settings.Hidden, actionCount, settings.Activation,
            RandomStream.FromRoot(seed, "model.init").Derive("network"));
        register_module("network", _network);
        _counts = new Dictionary<string, int> { ["network"] = _network.ParameterCount };
        _scratch = new double[_network.ScratchSize];
    }

    public int ObservationSize => _network.InputSize;
    public int OutputCount => _network.OutputSize;
    public int ParameterCount => _network.ParameterCount;
    public IReadOnlyDictionary<string, int> ParameterCounts => _counts;
    public DenseNetwork Network => _network;
    public bool DeterministicOutputs => true;
    public ExecutionCounters? Counters => null;
    public long HardwareExecutionsPerGradientRow => 0;

    public override Tensor forward(Tensor input) => Forward(input);

    public Tensor Forward(Tensor observations)
    {
        if (observations.dim() != 2 || observations.shape[1] != ObservationSize)
            throw new ArgumentException($"observations must be [batch, {ObservationSize}], got [{string.Join(", ", observations.shape)}]", nameof(observations));
        return _network.Forward(observations);
    }

    public IEnumerable<Parameter> Parameters()
    {
        yield return _network.Weights;
    }

    public void GetFlat(Span<double> destination)
    {
        if (destination.Length != ParameterCount) throw new ArgumentException($"flat vector needs {ParameterCount} entries, got {destination.Length}", nameof(destination));
        TensorMemory.AsSpan(_network.Weights).CopyTo(destination);
    }

    public void SetFlat(ReadOnlySpan<double> source)
    {
        if (source.Length != ParameterCount) throw new ArgumentException($"flat vector needs {ParameterCount} entries, got {source.Length}", nameof(source));
        using var _ = torch.no_grad();
        source.CopyTo(TensorMemory.AsSpan(_network.Weights));
    }

    public void ForwardNoGrad(ReadOnlySpan<double> observations, int batch, Span<double> output)
    {
        if (observations.Length != batch * ObservationSize || output.Length != batch * OutputCount)
            throw new ArgumentException($"expected {batch}×{ObservationSize} observations and {batch}×{OutputCount} outputs");
        var w = TensorMemory.AsSpan(_network.Weights);
        for (int b = 0; b < batch; b++)
            _network.ForwardRow(w, observations.Slice(b * ObservationSize, ObservationSize), output.Slice(b * OutputCount, OutputCount), _scratch);
    }

    public void PopulationForward(ReadOnlySpan<double> flatParametersPerMember, ReadOnlySpan<double> observationsPerMember, int members, Span<double> outputs)
    {
        int p = ParameterCount;
        if (flatParametersPerMember.Length != members * p || observationsPerMember.Length != members * ObservationSize || outputs.Length != members * OutputCount)
            throw new ArgumentException($"expected {members}×{p} parameters, {members}×{ObservationSize} observations and {members}×{OutputCount} outputs");
        for (int k = 0; k < members; k++)
            _network.ForwardRow(flatParametersPerMember.Slice(k * p, p), observationsPerMember.Slice(k * ObservationSize, ObservationSize),
                outputs.Slice(k * OutputCount, OutputCount), _scratch);
    }
}
