using HybridRL.Models;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Training;

/// <summary>
/// The circuit engines' random state (seed and call counter, from which shot and trajectory samples are
/// derived) of a trainer's models, as one checkpoint section, so that sampled simulations resume exactly.
/// Classical models have no such state and are written as absent.
/// </summary>
public static class ModelRandomState
{
    /// <summary>Checkpoint section name.</summary>
    public const string Section = "model.random";

    public static void Save(BinaryWriter w, IReadOnlyList<IAgentModel> models)
    {
        w.Write(models.Count);
        foreach (var m in models)
        {
            var evaluator = EvaluatorOf(m);
            w.Write(evaluator is not null);
            if (evaluator is null) continue;
            var s = evaluator.GetState();
            w.Write(s.Seed);
            w.Write(s.CallCounter);
        }
    }

    /// <summary>
    /// Restores the states written by <see cref="Save"/>. When the checkpoint holds a different number of models
    /// (an evolution run resumed with another worker count), nothing is restored and false is returned.
    /// </summary>
    public static bool Load(BinaryReader r, IReadOnlyList<IAgentModel> models)
    {
        int n = r.ReadInt32();
        if (n != models.Count) return false;
        foreach (var m in models)
        {
            bool has = r.ReadBoolean();
            if (!has) continue;
            var state = new EvaluatorRandomState(r.ReadUInt64(), r.ReadInt64());
            EvaluatorOf(m)?.SetState(state);
        }
        return true;
    }

    private static IExpectationEvaluator? EvaluatorOf(IAgentModel m) => m is HybridModel h ? h.QuantumLayer.Evaluator : null;
}
