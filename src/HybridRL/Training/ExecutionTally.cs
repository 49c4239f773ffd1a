using HybridRL.Models;

namespace HybridRL.Training;

/// <summary>
/// Moves what the models' circuit engines counted — circuit executions and shots actually
/// simulated, and hardware-equivalent executions (what a device would have needed: one per
/// measurement setting and row forward, plus the parameter-shift evaluations of every gradient
/// row) — into the trainer's counters, as deltas since the last call.
/// </summary>
public sealed class ExecutionTally
{
    private readonly IAgentModel[] _models;
    private readonly long[] _executions, _shots, _hardware;

    public ExecutionTally(params IAgentModel[] models)
    {
        _models = models;
        _executions = new long[models.Length];
        _shots = new long[models.Length];
        _hardware = new long[models.Length];
        Resync();
    }

    /// <summary>Adds everything counted since the last call.</summary>
    public void Apply(TrainingCounters counters)
    {
        for (int i = 0; i < _models.Length; i++)
        {
            var c = _models[i].Counters;
            if (c is null) continue;
            long e = c.CircuitExecutions, s = c.Shots, h = c.HardwareExecutions;
            counters.CircuitExecutions += e - _executions[i];
            counters.Shots += s - _shots[i];
            counters.HardwareExecutions += h - _hardware[i];
            _executions[i] = e;
            _shots[i] = s;
            _hardware[i] = h;
        }
    }

    /// <summary>Forgets deltas (after a checkpoint restore the trainer's counters are authoritative).</summary>
    public void Resync()
    {
        for (int i = 0; i < _models.Length; i++)
        {
            var c = _models[i].Counters;
            _executions[i] = c?.CircuitExecutions ?? 0;
            _shots[i] = c?.Shots ?? 0;
            _hardware[i] = c?.HardwareExecutions ?? 0;
        }
    }
}
