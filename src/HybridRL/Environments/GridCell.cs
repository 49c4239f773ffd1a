namespace HybridRL.Environments;

/// <summary>
/// Cell kinds of a text grid map. Legend (our own): <c>.</c> floor, <c>#</c> blocked (shelf rack or wall),
/// <c>o</c> hole (open floor hatch: the episode ends), <c>R</c> start (robot or drone), <c>D</c> goal
/// (charging dock or survey target).
/// </summary>
public enum GridCell : byte
{
    Floor,
    Blocked,
    Hole,
    Start,
    Goal,
}
