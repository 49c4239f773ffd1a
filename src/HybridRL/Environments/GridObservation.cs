namespace HybridRL.Environments;

/// <summary>How a warehouse robot's position is presented: one-hot over states, the state index in binary digits, the state index itself as one value (for basis encoding), or normalised row/column coordinates.</summary>
public enum GridObservation
{
    OneHot,
    Binary,
    Coordinates,
    Index,
}
