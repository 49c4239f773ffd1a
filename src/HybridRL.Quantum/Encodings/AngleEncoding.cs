using HybridRL.Quantum.Ansatz;
using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Encodings;

/// <summary>Angle encoding: feature f enters as a rotation about the chosen axis on qubit f mod n.</summary>
public static class AngleEncoding
{
    /// <summary>
    /// Appends one rotation per feature with angle scale·squash(x_f); with <paramref name="trainableScale"/>
    /// each feature gets its own new trainable scale parameter (returned; initialise them to <paramref name="scale"/>).
    /// </summary>
    public static int[] Append(CircuitBuilder b, int inputCount, RotationAxis axis, InputSquash squash = InputSquash.None, double scale = 1.0, bool trainableScale = false)
    {
        ArgumentNullException.ThrowIfNull(b);
        if (inputCount < 1) throw new ArgumentOutOfRangeException(nameof(inputCount), inputCount, "angle encoding needs at least one input feature");
        var scales = new List<int>();
        for (int f = 0; f < inputCount; f++)
        {
            Angle a;
            if (trainableScale)
            {
                int p = b.NextParameter();
                scales.Add(p);
                a = Angle.ScaledInput(f, p, squash);
            }
            else a = Angle.Input(f, scale, squash);
            int q = f % b.Qubits;
            switch (axis)
            {
                case RotationAxis.X: b.RX(q, a); break;
                case RotationAxis.Y: b.RY(q, a); break;
                case RotationAxis.Z: b.RZ(q, a); break;
                default: throw new ArgumentOutOfRangeException(nameof(axis), axis, "unknown rotation axis");
            }
        }
        b.ReserveInputs(inputCount);
        return [.. scales];
    }
}
