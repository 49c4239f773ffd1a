namespace HybridRL.Models;

/// <summary>Hidden-layer nonlinearity of the dense networks.</summary>
public enum Activation
{
    Relu,
    Tanh,
}
