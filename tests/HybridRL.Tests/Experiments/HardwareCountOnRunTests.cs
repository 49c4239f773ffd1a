using HybridRL.Analysis.Ledger;
using HybridRL.Experiments;
using HybridRL.Experiments.Config;
using HybridRL.Native;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Experiments;

/// <summary>
/// The engine's hardware-equivalent count on a real (tiny) deep-Q run against the analytic count of
/// <see cref="HardwareCount"/>, for the parameter-shift gradient with inputs that feed constant-scale gates.
/// </summary>
public sealed class HardwareCountOnRunTests
{
    private const string Config = """
        experiment:
          name: ledger
          seed: 3
          budget:
            env_steps: 120
        environment:
          kind: slippery-warehouse
          map: dock-3x4
          observation: binary
          max_steps: 20
        model:
          circuit:
            qubits: 4
            layers: 2
            trainable_input_scaling: false
          simulation:
            gradient: parameter_shift
        trainer:
          kind: dqn
          dqn:
            replay_capacity: 200
            warmup_steps: 40
            batch_size: 4
            double_dqn: false
            epsilon_start: 0
            epsilon_end: 0
            eval_every: 0
        """;

    [Fact]
    public void DeepQWithParameterShift_CountsOnlyShiftsOfParameterAngles()
    {
        TorchRuntime.EnsureLoaded();
        using var dir = new TempDirectory();
        string file = dir.Combine("ledger.yaml");
        File.WriteAllText(file, Config);
        var spec = ExperimentSpecLoader.Load([file], [], new Dictionary<string, string>());
        using var components = ExperimentComponents.Build(spec);
        var trainer = components.Trainer;
        while (components.Budget.ReachedBy(trainer.Counters) is null) trainer.RunUnit(components.Budget);

        // Hand-worked from DeepQTrainer: T = 120 greedy steps (ε = 0) = 120 forward rows; U = T − warmup = 80 updates of
        // B = 4 rows, each row a target next-state forward and the online forward with gradient (no Double DQN) = 2 rows,
        // plus its parameter-shift gradient: 2 evaluations (Mitarai et al. 2018) per trainable rotation,
        // 4 qubits × 2 layers × 2 rotations (ry, rz) = 16. The RX encoding gates have constant scale and the
        // observations need no gradient, so a device would not shift them. One measurement setting (Z on each qubit).
        var c = trainer.Counters;
        Assert.Equal(80, c.Updates);
        var expected = HardwareCount.ForTraining(HardwareCount.ShiftTerms(16, 0), batch: 4, updates: 80,
            forwardExecutionsPerStep: 1, steps: 120, forwardExecutionsPerSample: 2);
        Assert.Equal(120 + 80 * 4 * (2 + 32), expected.Total);   // hand-worked: 11 000
        Assert.Equal(expected.Total, c.HardwareExecutions);
        // With parameter shift the simulator runs every shifted circuit itself: simulated = hardware-equivalent.
        Assert.Equal(expected.Total, c.CircuitExecutions);
    }
}
