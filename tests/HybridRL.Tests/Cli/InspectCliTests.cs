using System.Text.Json;
using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>`hybridrl inspect`: counts checked by hand against the quickstart's circuit, and against a real run's counters.</summary>
[Collection(ConsoleCollection.Name)]
public sealed class InspectCliTests
{
    private static readonly string Quickstart = ConfigTestPaths.SmallWarehouseDqn;

    private static JsonElement InspectJson(params string[] args)
    {
        var (code, stdout, stderr) = InProcessCli.Run(["inspect", .. args, "--json"]);
        Assert.True(code == 0, stderr);
        return JsonDocument.Parse(stdout).RootElement;
    }

    [Fact]
    public void Quickstart_counts_match_a_hand_count_of_its_circuit()
    {
        var j = InspectJson(Quickstart);
        // Hand count (ModelCircuit layout): 4 qubits, 2 layers, angle encoding in layer 0 only with a trainable
        // scale per bit (4), rotations ry+rz per qubit per layer (4·2·2 = 16), per_action read-out w_a, b_a (4 + 4).
        var pc = j.GetProperty("parameter_counts");
        Assert.Equal(4, pc.GetProperty("input_scaling").GetInt32());
        Assert.Equal(16, pc.GetProperty("circuit").GetInt32());
        Assert.Equal(8, pc.GetProperty("readout").GetInt32());
        Assert.Equal(28, j.GetProperty("parameter_count").GetInt64());
        var c = j.GetProperty("circuit");
        Assert.Equal(4, c.GetProperty("gates_by_kind").GetProperty("RX").GetInt32());
        Assert.Equal(8, c.GetProperty("gates_by_kind").GetProperty("RY").GetInt32());
        Assert.Equal(8, c.GetProperty("gates_by_kind").GetProperty("RZ").GetInt32());
        Assert.Equal(8, c.GetProperty("two_qubit_gates").GetInt32());      // ring on 4 qubits = 4 CZ per layer, 2 layers
        // Depth by hand: RX,RY,RZ (3), ring CZ01,CZ12,CZ23,CZ30 chained through shared qubits (7); layer 2 on q0
        // RY,RZ (9), then CZ01 (10), CZ12 (11), CZ23 (12), CZ30 (13).
        Assert.Equal(13, c.GetProperty("depth").GetInt32());
        // Two-term parameter-shift rule (Mitarai et al. 2018): 2 evaluations per variable rotation, 20 of them.
        Assert.Equal(40, c.GetProperty("shift_evaluations_per_row").GetInt32());
        Assert.Equal(1, c.GetProperty("measurement_settings").GetInt32()); // Z on every qubit commutes qubit-wise
        var e = j.GetProperty("executions");
        // Batch 16, Double DQN (default on): 16 target + 16 online rows for the next states, 16 rows with gradient.
        Assert.Equal(48, e.GetProperty("forward_rows_per_update").GetInt64());
        Assert.Equal(64, e.GetProperty("executions_per_update").GetInt64());           // adjoint: +1 backward sweep per row
        Assert.Equal(48 + 16 * 40, e.GetProperty("hardware_executions_per_update").GetInt64());
        var m = j.GetProperty("memory");
        // Binary observation of 4 bits stored as bytes: 2·4 + action int32 4 + reward 8 + terminal 1 = 21 bytes.
        Assert.Equal(21, m.GetProperty("replay_bytes_per_transition").GetInt64());
        Assert.Equal(21 * 3000, m.GetProperty("replay_bytes").GetInt64());
        Assert.True(m.GetProperty("fits").GetBoolean());
    }

    [Fact]
    public void Text_report_draws_one_line_per_qubit_and_qasm_on_request()
    {
        var (code, stdout, stderr) = InProcessCli.Run("inspect", Quickstart, "--qasm");
        Assert.True(code == 0, stderr);
        var wires = stdout.Split('\n').Where(l => l.StartsWith('q') && l.Contains(": -")).ToList();
        Assert.Equal(4, wires.Count);
        Assert.All(wires, w => Assert.Equal(wires[0].Length, w.Length));
        Assert.StartsWith("q0: -RX(w0*atan(x0))", wires[0]);
        Assert.Contains("OPENQASM 3.0;", stdout);
        Assert.Equal(8, stdout.Split('\n').Count(l => l.StartsWith("cz ")));
        Assert.Contains("fits", stdout);
    }

    [Fact]
    public void Classical_model_has_no_circuit_and_evolution_counts_per_generation()
    {
        var classical = InspectJson(Path.Combine(ConfigTestPaths.ConfigsFolder, "classical-baseline.yaml"));
        Assert.False(classical.TryGetProperty("circuit", out _));
        Assert.False(classical.TryGetProperty("executions", out _));

        var es = InspectJson(Path.Combine(ConfigTestPaths.ConfigsFolder, "cartpole-es.yaml"));
        var e = es.GetProperty("executions");
        // configs/cartpole-es.yaml: population 30, 1 episode per member, episodes cut at 500 steps.
        Assert.Equal(30, e.GetProperty("population").GetInt32());
        Assert.Equal(500, e.GetProperty("max_steps_per_episode").GetInt32());
        Assert.Equal(30L * 500, e.GetProperty("forward_rows_per_generation").GetInt64());
        Assert.False(es.GetProperty("memory").TryGetProperty("replay_bytes", out _));
    }

    [Fact]
    public void Predicted_executions_match_what_a_run_counts()
    {
        using var tmp = new TempDirectory();
        // Always greedy (ε = 0), no periodic or final evaluation: every environment step is one forward row, every update
        // the inspected cost, so the run's counters are exactly steps·1 + updates·(per update).
        string[] sets =
        [
            "--set", "experiment.budget.env_steps=260", "--set", "trainer.dqn.epsilon_start=0", "--set", "trainer.dqn.epsilon_end=0",
            "--set", "trainer.dqn.epsilon_decay=linear", "--set", "trainer.dqn.eval_every=0", "--set", "logging.final_eval_episodes=0",
        ];
        var e = InspectJson([Quickstart, .. sets]).GetProperty("executions");
        var (code, stdout, stderr) = CliProcess.Run(["train", Quickstart, .. sets, "--runs-dir", tmp.Combine("runs"), "--quiet"]);
        Assert.True(code == 0, stderr);
        string dir = stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)[0];
        var s = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "summary.json"))).RootElement;
        long steps = s.GetProperty("env_steps").GetInt64(), updates = s.GetProperty("updates").GetInt64();
        Assert.Equal(60, updates);                                                   // 260 steps − 200 warm-up, one update per step
        Assert.Equal(steps * e.GetProperty("acting_executions_per_step").GetInt64() + updates * e.GetProperty("executions_per_update").GetInt64(),
            s.GetProperty("circuit_executions").GetInt64());
        Assert.Equal(steps * e.GetProperty("acting_executions_per_step").GetInt64() + updates * e.GetProperty("hardware_executions_per_update").GetInt64(),
            s.GetProperty("hardware_executions").GetInt64());
    }

    [Fact]
    public void Bad_config_exits_2()
    {
        var (code, _, stderr) = InProcessCli.Run("inspect", Quickstart, "--set", "model.circuit.qubits=0");
        Assert.Equal(2, code);
        Assert.Contains("model.circuit.qubits", stderr);
    }
}
