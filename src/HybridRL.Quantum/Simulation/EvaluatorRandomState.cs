namespace HybridRL.Quantum.Simulation;

/// <summary>Checkpointable random state of an evaluator: its seed and the number of Forward/Backward calls made.</summary>
public readonly record struct EvaluatorRandomState(ulong Seed, long CallCounter);
