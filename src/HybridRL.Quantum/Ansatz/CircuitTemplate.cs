using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Encodings;

namespace HybridRL.Quantum.Ansatz;

/// <summary>Builds layered variational circuits from a <see cref="LayeredCircuitSpec"/>.</summary>
public static class CircuitTemplate
{
    public static Circuit Build(LayeredCircuitSpec spec, int inputCount) => BuildLayout(spec, inputCount).Circuit;

    public static TemplateLayout BuildLayout(LayeredCircuitSpec spec, int inputCount, Action<string>? warning = null)
    {
        ArgumentNullException.ThrowIfNull(spec);
        spec.Validate(inputCount);
        var b = new CircuitBuilder(spec.Qubits, inputCount);
        var rotations = new List<int>();
        var scales = new List<int>();
        void Encode() => scales.AddRange(AngleEncoding.Append(b, inputCount, spec.EncodingAxis, spec.InputSquash, spec.InputScale, spec.TrainableInputScale));
        switch (spec.Encoding)
        {
            case EncodingKind.Basis:
                if ((1L << spec.Qubits) < 2) throw new ArgumentException("basis encoding needs at least one qubit");
                BasisEncoding.Append(b);
                break;
            case EncodingKind.Angle: Encode(); break;
            case EncodingKind.Amplitude: AmplitudeEncoding.Append(b, inputCount, warning); break;
            case EncodingKind.ProductZZ: ProductEncoding.Append(b, inputCount, spec.InputScale); break;
            case EncodingKind.ReUploading: break;
            default: throw new ArgumentOutOfRangeException(nameof(spec), spec.Encoding, "unknown encoding kind");
        }
        for (int l = 0; l < spec.Layers; l++)
        {
            if (spec.Encoding == EncodingKind.ReUploading) Encode();
            rotations.AddRange(VariationalLayer.Append(b, spec.RotationAxes, spec.Entangler, spec.EntanglingGate));
        }
        return new TemplateLayout(b.Build(), rotations, scales, spec.InputScale);
    }
}
