namespace HybridRL.Quantum.Circuits;

public enum AngleKind
{
    /// <summary>A fixed number.</summary>
    Constant,
    /// <summary>A trainable parameter w[i].</summary>
    Parameter,
    /// <summary>An input feature times a scale: scale·f(x[i]), scale constant or a trainable parameter.</summary>
    Input,
    /// <summary>A product of two input features times a constant scale: scale·x[i]·x[j].</summary>
    InputProduct,
    /// <summary>An angle computed from the whole input row by a circuit-level <see cref="IInputAngleMap"/>.</summary>
    Mapped,
}
