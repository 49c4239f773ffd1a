namespace HybridRL.Experiments.Config;

/// <summary>Checks that a model fits an environment's shape (observation size, actions, discrete states).</summary>
public static class EncodingCompatibility
{
    /// <summary>Problems as (key, message); empty when the model fits.</summary>
    public static IReadOnlyList<(string Key, string Message)> Check(ModelSettings model, string environmentKind, EnvironmentShape shape)
    {
        var problems = new List<(string, string)>();
        if (model.Kind != ModelKind.Hybrid || model.Circuit is null || model.Compressor is null) return problems;
        var circuit = model.Circuit;
        var encoding = ChoiceNames.ToName(circuit.Encoding);
        if (circuit.Encoding == EncodingKind.Basis)
        {
            if (shape.DiscreteStateCount is not { } states)
            {
                problems.Add(("model.circuit.encoding",
                    $"basis encoding needs a discrete environment (one with a finite state index), but environment '{environmentKind}' has continuous observations; use encoding angle, reuploading, product_zz or amplitude"));
            }
            else if (states > circuit.FeatureCapacity)
            {
                var needed = (int)Math.Ceiling(Math.Log2(states));
                problems.Add(("model.circuit.qubits",
                    $"basis encoding of {states} states needs at least {needed} qubits (2^{circuit.Qubits} = {circuit.FeatureCapacity} < {states}); raise model.circuit.qubits"));
            }
            if (shape.DiscreteStateCount is not null && shape.ObservationSize != 1)
            {
                problems.Add(("model.circuit.encoding",
                    $"basis encoding reads one feature, the state index, but environment '{environmentKind}' gives {shape.ObservationSize} observation values; set the environment's observation to the state index (slippery-warehouse: observation: index) or use encoding angle"));
            }
        }
        else if (model.Compressor.Kind == CompressorKind.None && shape.ObservationSize > circuit.FeatureCapacity)
        {
            var capacity = circuit.Encoding == EncodingKind.Amplitude
                ? $"2^{circuit.Qubits} = {circuit.FeatureCapacity} values"
                : $"one value per qubit ({circuit.Qubits})";
            problems.Add(("model.circuit.encoding",
                $"the observation of '{environmentKind}' has {shape.ObservationSize} values but {encoding} encoding on {circuit.Qubits} qubits takes {capacity}; add a compressor (model.compressor.kind: mps or dense) or raise model.circuit.qubits"));
        }
        if (circuit.Readout == ReadoutKind.PerAction && shape.ActionCount > circuit.Qubits)
        {
            problems.Add(("model.circuit.readout",
                $"per_action readout measures one qubit per action: {shape.ActionCount} actions need at least {shape.ActionCount} qubits (have {circuit.Qubits}); use model.circuit.readout: linear or more qubits"));
        }
        return problems;
    }
}
