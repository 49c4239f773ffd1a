namespace HybridRL.Models;

/// <summary>Bounded map applied to each circuit input before the (trainable) input scaling (config key <c>model.circuit.input_squash</c>).</summary>
public enum InputSquash
{
    /// <summary>Identity.</summary>
    None,
    /// <summary>tanh(z), range (-1, 1).</summary>
    Tanh,
    /// <summary>atan(z), range (-π/2, π/2).</summary>
    Arctan,
}
