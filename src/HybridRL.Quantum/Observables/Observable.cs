using System.Globalization;

namespace HybridRL.Quantum.Observables;

/// <summary>
/// A Hermitian observable written as a real-weighted sum of Pauli strings.
/// Text form: terms separated by '+' or '-', each an optional weight and '*' followed by
/// letters with qubit indices, e.g. "0.5*Z0Z1 + X2 - 0.25*Y0" ("I" or a bare number is the identity).
/// </summary>
public sealed class Observable
{
    private readonly PauliTerm[] _terms;

    public Observable(IEnumerable<PauliTerm> terms)
    {
        ArgumentNullException.ThrowIfNull(terms);
        // Merge equal strings so that each string appears once, in first-seen order.
        var list = new List<PauliTerm>();
        foreach (var t in terms)
        {
            if (!double.IsFinite(t.Weight)) throw new ArgumentException($"observable weight must be finite, got {t.Weight}", nameof(terms));
            int i = list.FindIndex(u => u.XMask == t.XMask && u.ZMask == t.ZMask);
            if (i >= 0) list[i] = list[i] with { Weight = list[i].Weight + t.Weight };
            else list.Add(t);
        }
        if (list.Count == 0) throw new ArgumentException("an observable needs at least one term", nameof(terms));
        _terms = [.. list];
    }

    public IReadOnlyList<PauliTerm> Terms => _terms;
    internal ReadOnlySpan<PauliTerm> TermSpan => _terms;

    /// <summary>Highest qubit index used, or -1 for the identity.</summary>
    public int MaxQubit => _terms.Max(t => t.MaxQubit);

    public static Observable ZOn(int qubit) => ZProduct(qubit);

    /// <summary>Z⊗Z⊗… on the given (distinct) qubits.</summary>
    public static Observable ZProduct(params int[] qubits)
    {
        ArgumentNullException.ThrowIfNull(qubits);
        if (qubits.Length == 0) throw new ArgumentException("a Z product needs at least one qubit", nameof(qubits));
        ulong z = 0;
        foreach (int q in qubits)
        {
            CheckQubit(q);
            if (((z >> q) & 1) != 0) throw new ArgumentException($"qubit {q} appears twice in a Z product", nameof(qubits));
            z |= 1UL << q;
        }
        return new Observable([new PauliTerm(1.0, 0, z)]);
    }

    /// <summary>A single Pauli string such as "XZIY" read with qubit 0 first (character i acts on qubit i).</summary>
    public static Observable PauliString(string letters, double weight = 1.0)
    {
        ArgumentNullException.ThrowIfNull(letters);
        ulong x = 0, z = 0;
        for (int q = 0; q < letters.Length; q++)
        {
            CheckQubit(q);
            switch (char.ToUpperInvariant(letters[q]))
            {
                case 'I': break;
                case 'X': x |= 1UL << q; break;
                case 'Y': x |= 1UL << q; z |= 1UL << q; break;
                case 'Z': z |= 1UL << q; break;
                default: throw new FormatException($"Pauli string '{letters}': unknown letter '{letters[q]}' at position {q} (use I, X, Y, Z)");
            }
        }
        return new Observable([new PauliTerm(weight, x, z)]);
    }

    /// <summary>One Z observable per qubit 0..qubits-1 (the usual read-out of a layered circuit).</summary>
    public static IReadOnlyList<Observable> ZOnEach(int qubits)
    {
        if (qubits < 1) throw new ArgumentOutOfRangeException(nameof(qubits), qubits, "need at least one qubit");
        return Enumerable.Range(0, qubits).Select(ZOn).ToArray();
    }

    public static Observable operator +(Observable a, Observable b) => new(a._terms.Concat(b._terms));
    public static Observable operator *(double w, Observable a) => new(a._terms.Select(t => t with { Weight = w * t.Weight }));

    private static void CheckQubit(int q)
    {
        if (q < 0 || q >= 64) throw new ArgumentOutOfRangeException(nameof(q), q, "qubit index must be between 0 and 63");
    }

    /// <summary>Parses text such as "0.5*Z0Z1 + X2 - 0.25*Y0*Y1" (see the class summary).</summary>
    public static Observable Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var terms = new List<PauliTerm>();
        string s = text.Replace(" ", "", StringComparison.Ordinal).Replace("\t", "", StringComparison.Ordinal);
        if (s.Length == 0) throw new FormatException("observable text is empty");
        int pos = 0;
        while (pos < s.Length)
        {
            double sign = 1.0;
            if (s[pos] == '+' || s[pos] == '-')
            {
                if (s[pos] == '-') sign = -1.0;
                pos++;
            }
            else if (terms.Count > 0) throw new FormatException($"observable '{text}': expected '+' or '-' at position {pos}");
            int start = pos;
            // A term runs to the next '+'/'-' that is not part of an exponent.
            while (pos < s.Length && !((s[pos] == '+' || s[pos] == '-') && pos > start && char.ToUpperInvariant(s[pos - 1]) != 'E')) pos++;
            terms.Add(ParseTerm(s[start..pos], sign, text));
        }
        return new Observable(terms);
    }

    private static PauliTerm ParseTerm(string term, double sign, string text)
    {
        if (term.Length == 0) throw new FormatException($"observable '{text}': empty term");
        double weight = 1.0;
        int i = 0;
        // Optional numeric weight.
        int j = 0;
        while (j < term.Length && (char.IsDigit(term[j]) || term[j] == '.' || char.ToUpperInvariant(term[j]) == 'E' && j > 0 && (char.IsDigit(term[j - 1]) || term[j - 1] == '.') || (term[j] == '-' || term[j] == '+') && j > 0 && char.ToUpperInvariant(term[j - 1]) == 'E')) j++;
        if (j > 0)
        {
            if (!double.TryParse(term[..j], NumberStyles.Float, CultureInfo.InvariantCulture, out weight))
                throw new FormatException($"observable '{text}': bad weight '{term[..j]}'");
            i = j;
            if (i < term.Length && term[i] == '*') i++;
        }
        ulong x = 0, z = 0;
        while (i < term.Length)
        {
            if (term[i] == '*') { i++; continue; }
            char p = char.ToUpperInvariant(term[i]);
            if (p == 'I' && (i + 1 >= term.Length || !char.IsDigit(term[i + 1]))) { i++; continue; }
            if (p != 'X' && p != 'Y' && p != 'Z' && p != 'I')
                throw new FormatException($"observable '{text}': unknown Pauli letter '{term[i]}' in term '{term}' (use X, Y, Z, I)");
            i++;
            int k = i;
            while (k < term.Length && char.IsDigit(term[k])) k++;
            if (k == i) throw new FormatException($"observable '{text}': Pauli letter '{p}' in term '{term}' needs a qubit index, e.g. {p}0");
            int q = int.Parse(term[i..k], CultureInfo.InvariantCulture);
            if (q >= 64) throw new FormatException($"observable '{text}': qubit index {q} too large (maximum 63)");
            i = k;
            ulong bit = 1UL << q;
            if (((x | z) & bit) != 0) throw new FormatException($"observable '{text}': qubit {q} appears twice in term '{term}'");
            if (p == 'X') x |= bit;
            else if (p == 'Y') { x |= bit; z |= bit; }
            else if (p == 'Z') z |= bit;
        }
        return new PauliTerm(sign * weight, x, z);
    }

    public override string ToString() => string.Join(" + ", _terms.Select(t => t.ToString()));
}
