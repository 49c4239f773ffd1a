namespace HybridRL.Environments;

/// <summary>One outcome of taking an action in a tabular model: next state, its probability, and the reward received.</summary>
public readonly record struct Transition(int NextState, double Probability, double Reward);
