using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Encodings;

/// <summary>
/// Basis encoding: input 0 is an integer state index s; qubit k receives RX(π·bit_k(s)), which is X up to the
/// global phase −i, so the register holds |s⟩ (qubit 0 = least significant bit).
/// </summary>
public static class BasisEncoding
{
    public static void Append(CircuitBuilder b)
    {
        ArgumentNullException.ThrowIfNull(b);
        int map = b.AddInputMap(new BasisAngleMap(b.Qubits));
        for (int q = 0; q < b.Qubits; q++) b.RX(q, Angle.Mapped(map, q));
    }
}
