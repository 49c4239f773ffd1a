namespace HybridRL.Experiments.Config;

/// <summary>Two-qubit entangling gate (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum EntanglingGate
{
    Cnot,
    Cz,
}
