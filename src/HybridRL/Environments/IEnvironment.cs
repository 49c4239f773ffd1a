namespace HybridRL.Environments;

/// <summary>
/// One episodic task with a discrete action set. Observations are written into caller-owned
/// buffers of length <see cref="ObservationSize"/>, so stepping allocates nothing.
/// Each environment owns its random stream, seeded in <see cref="Reset"/>.
/// </summary>
public interface IEnvironment : IDisposable
{
    /// <summary>Descriptive name of the task (its kind, e.g. <c>slippery-warehouse</c>).</summary>
    string Name { get; }

    /// <summary>Number of doubles in an observation.</summary>
    int ObservationSize { get; }

    /// <summary>Number of discrete actions; actions are 0 .. ActionCount-1.</summary>
    int ActionCount { get; }

    /// <summary>True when every observation entry is exactly 0 or 1 (e.g. one-hot), so it can be stored as bytes.</summary>
    bool ObservationIsBinary { get; }

    /// <summary>Number of discrete states when the task is tabular (for basis encoding); 0 otherwise.</summary>
    int StateCount { get; }

    /// <summary>Index of the current discrete state in [0, StateCount) when tabular; -1 otherwise.</summary>
    int StateIndex { get; }

    /// <summary>
    /// True when the observation is a fixed function of <see cref="StateIndex"/> (a tabular task whose observation carries
    /// nothing else, such as a step count); then a deterministic policy's action may be cached per state.
    /// </summary>
    bool ObservationIsFunctionOfState => false;

    /// <summary>True when <see cref="SaveState"/>/<see cref="LoadState"/> can reproduce the exact state.</summary>
    bool SupportsStateSave { get; }

    /// <summary>Number of steps taken in the current episode.</summary>
    int StepCount { get; }

    /// <summary>Starts a new episode; the random stream is re-seeded from <paramref name="seed"/>.</summary>
    void Reset(ulong seed, Span<double> observation);

    /// <summary>Applies one action and writes the next observation.</summary>
    StepResult Step(int action, Span<double> observation);

    /// <summary>Writes the observation last produced by Reset or Step (also valid right after LoadState).</summary>
    void WriteObservation(Span<double> observation);

    /// <summary>Writes the full state (task state, step counter, random stream, last observation).</summary>
    void SaveState(BinaryWriter writer);

    /// <summary>Restores a state written by <see cref="SaveState"/> of an environment built from the same settings.</summary>
    void LoadState(BinaryReader reader);
}
