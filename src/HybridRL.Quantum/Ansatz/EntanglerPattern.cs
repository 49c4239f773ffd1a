namespace HybridRL.Quantum.Ansatz;

/// <summary>Which qubit pairs a layer entangles.</summary>
public enum EntanglerPattern
{
    /// <summary>(0,1), (1,2), …, (n−2, n−1).</summary>
    Chain,
    /// <summary>Chain plus (n−1, 0) when n &gt; 2.</summary>
    Ring,
    /// <summary>Every pair i &lt; j.</summary>
    AllToAll,
    None,
}
