using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;

namespace HybridRL.Models;

/// <summary>
/// The layered variational circuit of a hybrid model, built from <see cref="CircuitSettings"/>.
/// <para>
/// Layer ℓ = 0..L-1: (if ℓ = 0 or re-uploading) the encoding of every input feature, each as a rotation
/// whose angle is s·squash(x) with s a trainable scale (or the constant 1); then, for each qubit in order,
/// one trainable rotation per configured axis; then the entangler. Parameters are numbered in the order
/// they are created: per layer, first the encoding scales (feature order), then the rotations (qubit-major,
/// axis order). Read-out: Z on qubit a for action a (per_action), or Z on every qubit (linear).
/// </para>
/// </summary>
public sealed class ModelCircuit
{
    private ModelCircuit(Circuit circuit, IReadOnlyList<Observable> observables, bool[] isScale)
    {
        Circuit = circuit;
        Observables = observables;
        _isScale = isScale;
        ScaleParameterCount = isScale.Count(b => b);
    }

    private readonly bool[] _isScale;

    public Circuit Circuit { get; }
    public IReadOnlyList<Observable> Observables { get; }
    /// <summary>Whether circuit parameter i is an input scale (otherwise a rotation angle).</summary>
    public bool IsScaleParameter(int i) => _isScale[i];
    public int ScaleParameterCount { get; }
    public int RotationParameterCount => Circuit.ParameterCount - ScaleParameterCount;

    /// <summary>Number of features the encoding can hold on <paramref name="qubits"/> qubits.</summary>
    public static int Capacity(EncodingKind encoding, int qubits) => encoding == EncodingKind.DenseAngle ? 2 * qubits : qubits;

    /// <summary>Builds the circuit for <paramref name="features"/> inputs and <paramref name="actions"/> outputs.</summary>
    public static ModelCircuit Build(CircuitSettings s, int features, int actions)
    {
        if (s.Qubits < 1 || s.Qubits > Circuit.MaxQubits)
            throw new ModelConfigurationException($"model.circuit.qubits = {s.Qubits} is outside 1..{Circuit.MaxQubits}", "model.circuit.qubits");
        if (s.Layers < 1) throw new ModelConfigurationException($"model.circuit.layers = {s.Layers} must be at least 1", "model.circuit.layers");
        int capacity = Capacity(s.Encoding, s.Qubits);
        if (features > capacity)
            throw new ModelConfigurationException(
                $"{features} features do not fit a {s.Encoding} encoding on {s.Qubits} qubits (it holds {capacity}); " +
                "use a compressor, more qubits or a denser encoding", "model.compressor.kind", "model.circuit.qubits", "model.circuit.encoding");
        if (features < 1) throw new ModelConfigurationException("the circuit needs at least one input feature", "model.compressor.output_size");
        if (s.Readout == ReadoutKind.PerAction && actions > s.Qubits)
            throw new ModelConfigurationException(
                $"per_action read-out needs one qubit per action: {actions} actions, {s.Qubits} qubits", "model.circuit.readout", "model.circuit.qubits");
        if (s.Rotations.Count == 0 && s.Layers > 0)
            throw new ModelConfigurationException("model.circuit.rotations is empty: the circuit would have no trainable angles", "model.circuit.rotations");

        var b = new CircuitBuilder(s.Qubits, features);
        var isScale = new List<bool>();
        Angle Feature(int f)
        {
            if (!s.TrainableInputScaling) return Angle.Input(f, 1.0, s.InputSquash);
            int p = b.NextParameter();
            isScale.Add(true);
            return Angle.ScaledInput(f, p, s.InputSquash);
        }
        for (int layer = 0; layer < s.Layers; layer++)
        {
            if (layer == 0 || s.Reupload)
            {
                for (int q = 0; q < s.Qubits; q++)
                {
                    switch (s.Encoding)
                    {
                        case EncodingKind.AngleX:
                            if (q < features) b.RX(q, Feature(q));
                            break;
                        case EncodingKind.AngleY:
                            if (q < features) b.RY(q, Feature(q));
                            break;
                        case EncodingKind.DenseAngle:
                            if (2 * q < features) b.RY(q, Feature(2 * q));
                            if (2 * q + 1 < features) b.RZ(q, Feature(2 * q + 1));
                            break;
                    }
                }
            }
            for (int q = 0; q < s.Qubits; q++)
            {
                foreach (var axis in s.Rotations)
                {
                    var a = Angle.Parameter(b.NextParameter());
                    isScale.Add(false);
                    switch (axis)
                    {
                        case RotationAxis.X: b.RX(q, a); break;
                        case RotationAxis.Y: b.RY(q, a); break;
                        default: b.RZ(q, a); break;
                    }
                }
            }
            foreach (var (i, j) in Pairs(s.Entangler, s.Qubits))
            {
                if (s.EntanglingGate == EntanglingGate.CZ) b.CZ(i, j);
                else b.CNOT(i, j);
            }
        }
        var circuit = b.Build();
        var observables = s.Readout == ReadoutKind.PerAction
            ? Enumerable.Range(0, actions).Select(Observable.ZOn).ToArray()
            : Observable.ZOnEach(s.Qubits);
        return new ModelCircuit(circuit, observables, [.. isScale]);
    }

    private static IEnumerable<(int, int)> Pairs(EntanglerPattern pattern, int n)
    {
        switch (pattern)
        {
            case EntanglerPattern.Linear:
            case EntanglerPattern.Ring:
                for (int i = 0; i + 1 < n; i++) yield return (i, i + 1);
                if (pattern == EntanglerPattern.Ring && n > 2) yield return (n - 1, 0);
                break;
            case EntanglerPattern.AllPairs:
                for (int i = 0; i < n; i++)
                    for (int j = i + 1; j < n; j++) yield return (i, j);
                break;
        }
    }
}
