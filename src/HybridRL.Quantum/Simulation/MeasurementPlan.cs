using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// The observables' Pauli terms, grouped greedily (in first-seen order) into measurement settings
/// whose qubit-wise bases agree. Each setting is one circuit execution on hardware.
/// </summary>
internal sealed class MeasurementPlan
{
    internal readonly record struct Entry(int Output, double Weight, ulong Support, ulong XMask, ulong ZMask);

    internal sealed class Setting
    {
        public ulong XBasis;  // qubits measured in the X basis
        public ulong YBasis;  // qubits measured in the Y basis
        public ulong ZBasis;  // qubits measured in the Z basis
        public List<Entry> Entries { get; } = [];
        public Entry[] EntryArray = [];
    }

    public MeasurementPlan(IReadOnlyList<Observable> observables, int qubits)
    {
        ArgumentNullException.ThrowIfNull(observables);
        if (observables.Count == 0) throw new ArgumentException("at least one observable is needed", nameof(observables));
        OutputCount = observables.Count;
        Constant = new double[OutputCount];
        var terms = new List<Entry>();
        var settings = new List<Setting>();
        for (int k = 0; k < observables.Count; k++)
        {
            var obs = observables[k] ?? throw new ArgumentException($"observable {k} is null", nameof(observables));
            if (obs.MaxQubit >= qubits)
                throw new ArgumentException($"observable {k} ({obs}) acts on qubit {obs.MaxQubit}, but the circuit has {qubits} qubits");
            foreach (var t in obs.Terms)
            {
                if (t.Support == 0) { Constant[k] += t.Weight; continue; }
                var e = new Entry(k, t.Weight, t.Support, t.XMask, t.ZMask);
                terms.Add(e);
                ulong xb = t.XMask & ~t.ZMask, yb = t.XMask & t.ZMask, zb = t.ZMask & ~t.XMask;
                Setting? target = null;
                foreach (var s in settings)
                {
                    ulong sx = s.XBasis, sy = s.YBasis, sz = s.ZBasis;
                    bool clash = (xb & (sy | sz)) != 0 || (yb & (sx | sz)) != 0 || (zb & (sx | sy)) != 0;
                    if (!clash) { target = s; break; }
                }
                if (target == null) { target = new Setting(); settings.Add(target); }
                target.XBasis |= xb; target.YBasis |= yb; target.ZBasis |= zb;
                target.Entries.Add(e);
            }
        }
        foreach (var s in settings) s.EntryArray = [.. s.Entries];
        Terms = [.. terms];
        Settings = [.. settings];
    }

    public int OutputCount { get; }
    /// <summary>Identity parts of each observable.</summary>
    public double[] Constant { get; }
    public Entry[] Terms { get; }
    public Setting[] Settings { get; }
    /// <summary>Circuit executions per row evaluation (at least one, even for identity-only observables).</summary>
    public int SettingCount => Math.Max(1, Settings.Length);
}
