using System.Text.Json;
using HybridRL.Checkpoints;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Training;

/// <summary>
/// The NaN/Inf guard through the real CLI: a deep-Q run whose squared TD loss overflows to infinity stops with exit
/// code 1, a message naming the environment step, failed.json, no summary.json, and its last good checkpoint kept.
/// <para>
/// No learning rate the config accepts (≤ 10) overflows a bounded-step optimiser (Adam, RMSProp) within a test's
/// budget, so the divergence is forced the other way: an external task (a small script) pays an absurd but finite
/// reward of 1e308 from step 80 on, and (r − Q)² overflows as soon as such a transition is replayed.
/// </para>
/// </summary>
public sealed class DivergenceGuardCliTests
{
    private const string Script = """
        import json, sys
        steps = 0
        for line in sys.stdin:
            m = json.loads(line)
            op = m.get("op")
            if op == "hello":
                print(json.dumps({"name": "overflowing-line", "observation_size": 2, "action_count": 2, "deterministic": True, "binary_observation": False}), flush=True)
            elif op == "reset":
                print(json.dumps({"observation": [0.0, 1.0]}), flush=True)
            elif op == "step":
                steps += 1
                reward = 1e308 if steps >= 80 else 0.0
                print(json.dumps({"observation": [steps % 2, 1.0], "reward": reward, "terminal": False, "truncated": steps % 20 == 0}), flush=True)
            elif op == "close":
                break
        """;

    [Fact]
    public void Overflowing_run_exits_1_with_failed_json_and_keeps_last_good_checkpoint()
    {
        using var dir = new TempDirectory();
        File.WriteAllText(dir.Combine("overflow.py"), Script);
        File.WriteAllText(dir.Combine("run.yaml"), $"""
            experiment:
              name: overflow
              seed: 3
              budget:
                env_steps: 400
            environment:
              kind: external
              command: python3 {dir.Combine("overflow.py")}
            model:
              kind: classical
              classical:
                hidden_sizes: [8]
            trainer:
              kind: dqn
              dqn:
                replay_capacity: 400
                warmup_steps: 50
                batch_size: 16
                loss: squared
                gradient_clip_norm: 0
                eval_every: 0
            logging:
              metrics_every_steps: 25
              checkpoint_every_steps: 50
              final_eval_episodes: 0
            """);
        var (code, stdout, stderr) = CliProcess.Run(["train", dir.Combine("run.yaml"), "--runs-dir", dir.Combine("runs"), "--run-id", "r1"], TimeSpan.FromMinutes(3));
        string output = stdout + stderr;
        Assert.True(code == 1, $"exit code {code}\n{output}");
        string run = dir.Combine("runs", "overflow", "r1");
        Assert.True(File.Exists(Path.Combine(run, "failed.json")), output);
        Assert.False(File.Exists(Path.Combine(run, "summary.json")));
        using var failed = JsonDocument.Parse(File.ReadAllText(Path.Combine(run, "failed.json")));
        string message = failed.RootElement.GetProperty("message").GetString()!;
        var match = System.Text.RegularExpressions.Regex.Match(message, @"NaN or infinite at environment step (\d+)");
        Assert.True(match.Success, message);
        long step = long.Parse(match.Groups[1].Value);
        // Rewards of 1e308 start at step 80, so the overflow can only come after it.
        Assert.True(step >= 80, message);
        Assert.Contains($"environment step {step}", output);
        using var newest = CheckpointStore.OpenNewestValid(Path.Combine(run, "checkpoints"), out _);
        Assert.NotNull(newest);
        Assert.True(newest!.Header.Step < step && newest.Header.Step >= 50, $"newest checkpoint at step {newest.Header.Step}, divergence at {step}");
    }
}
