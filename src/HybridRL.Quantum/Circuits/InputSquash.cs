namespace HybridRL.Quantum.Circuits;

/// <summary>Optional squashing of an unbounded input feature before it is used as an angle.</summary>
public enum InputSquash
{
    /// <summary>angle = scale · x.</summary>
    None,
    /// <summary>angle = scale · arctan(x), bounded by ±scale·π/2.</summary>
    Arctan,
}
