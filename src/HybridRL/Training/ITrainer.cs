namespace HybridRL.Training;

/// <summary>
/// One interface for gradient (deep Q) and evolutionary trainers, so that both are driven,
/// budgeted, logged and checkpointed by the same <see cref="TrainingLoop"/>.
/// Work happens in units: one environment step (with its learning) for deep Q, one generation for evolution.
/// A checkpoint is only ever taken between units, so a resumed run continues exactly.
/// </summary>
public interface ITrainer : IDisposable
{
    /// <summary>Trainer kind as written in the config (dqn, genetic, evolution_strategies, cma_es).</summary>
    string Kind { get; }

    TrainingCounters Counters { get; }

    /// <summary>Total trainable parameters of the agent.</summary>
    long ParameterCount { get; }

    /// <summary>Performs one unit of work and updates <see cref="Counters"/>.</summary>
    void RunUnit(TrainingBudget budget);

    /// <summary>Fills the trainer-specific cells of a metrics row (returns, loss or fitness, ε or σ).</summary>
    MetricsRow Metrics(MetricsRow counters);

    /// <summary>Latest greedy evaluation return, if one was made.</summary>
    double? LatestEvaluation { get; }

    /// <summary>Flat parameters of the agent to deploy (online network, or the search distribution's centre / elite).</summary>
    double[] AgentParameters();

    /// <summary>Writes every part of the trainer's state as named sections.</summary>
    void Save(Action<string, Action<BinaryWriter>> addSection);

    /// <summary>Restores state written by <see cref="Save"/>.</summary>
    void Load(Func<string, BinaryReader> section);

    /// <summary>Throws <see cref="DivergenceException"/> when loss, parameters or fitness are not finite.</summary>
    void CheckFinite();
}
