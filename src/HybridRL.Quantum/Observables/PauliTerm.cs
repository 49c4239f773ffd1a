using System.Globalization;
using System.Numerics;
using System.Text;

namespace HybridRL.Quantum.Observables;

/// <summary>
/// One weighted Pauli string w·P, stored as bit masks: qubit q carries X when bit q of XMask is set
/// and Z bit clear, Z when only the Z bit is set, Y when both are set. An empty string is the identity.
/// </summary>
public readonly record struct PauliTerm(double Weight, ulong XMask, ulong ZMask)
{
    /// <summary>Qubits with a non-identity factor.</summary>
    public ulong Support => XMask | ZMask;
    public int YCount => BitOperations.PopCount(XMask & ZMask);
    public bool IsDiagonal => XMask == 0;

    /// <summary>The Pauli letter on qubit q: 'I', 'X', 'Y' or 'Z'.</summary>
    public char On(int q)
    {
        bool x = ((XMask >> q) & 1) != 0, z = ((ZMask >> q) & 1) != 0;
        return x ? (z ? 'Y' : 'X') : (z ? 'Z' : 'I');
    }

    public int MaxQubit => Support == 0 ? -1 : 63 - BitOperations.LeadingZeroCount(Support);

    public override string ToString()
    {
        var sb = new StringBuilder();
        sb.Append(Weight.ToString("R", CultureInfo.InvariantCulture));
        if (Support == 0) return sb.ToString();
        sb.Append('*');
        for (int q = 0; q < 64; q++)
            if (((Support >> q) & 1) != 0) sb.Append(On(q)).Append(q.ToString(CultureInfo.InvariantCulture));
        return sb.ToString();
    }
}
