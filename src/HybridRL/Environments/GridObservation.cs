namespace HybridRL.Environments;

/// <summary>How a warehouse robot's position is presented: one-hot over states, the state index in binary digits (for basis encoding), or normalised row/column coordinates.</summary>
public enum GridObservation
{
    OneHot,
    Binary,
    Coordinates,
}
