namespace HybridRL.Models;

/// <summary>Which qubit pairs are entangled at the end of each layer (config key <c>model.circuit.entangler</c>).</summary>
public enum EntanglerPattern
{
    None,
    /// <summary>(0,1), (1,2), …, (n-2, n-1).</summary>
    Linear,
    /// <summary>Linear plus (n-1, 0) when n &gt; 2.</summary>
    Ring,
    /// <summary>Every pair (i, j), i &lt; j.</summary>
    AllPairs,
}
