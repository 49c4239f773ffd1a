using System.Diagnostics;
using System.Text.Json;
using HybridRL.Checkpoints;
using HybridRL.Environments;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Environments;

/// <summary>
/// The child-process bridge (examples/bridge/PROTOCOL.md) with the shipped example, examples/bridge/greenhouse_vents.py,
/// and with small misbehaving scripts: determinism, save/restore by replay, and every failure mode the protocol
/// document lists (crash mid-episode, hang, malformed or wrong-sized reply, error reply, stderr noise, start failure).
/// </summary>
public sealed class ExternalEnvironmentTests : IDisposable
{
    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    private static string Greenhouse
    {
        get
        {
            var dir = new DirectoryInfo(AppContext.BaseDirectory);
            while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "examples", "bridge", "greenhouse_vents.py"))) dir = dir.Parent;
            return Path.Combine(dir?.FullName ?? throw new FileNotFoundException("examples/bridge/greenhouse_vents.py not found above the test folder"),
                "examples", "bridge", "greenhouse_vents.py");
        }
    }

    private static ExternalEnvironment Open(string command, params (string Key, string Value)[] extra)
    {
        var p = new Dictionary<string, string> { ["command"] = command };
        foreach (var (k, v) in extra) p[k] = v;
        return new ExternalEnvironment(ExternalEnvironmentSettings.Parse(p));
    }

    /// <summary>A child that answers the handshake (3 observations, 2 actions) and reset normally, and steps with <paramref name="stepReply"/> (Python).</summary>
    private string Script(string name, string stepReply, bool deterministic = true)
    {
        string path = _dir.Combine(name + ".py");
        File.WriteAllText(path, $$"""
            import json, sys, time
            for line in sys.stdin:
                m = json.loads(line)
                op = m.get("op")
                if op == "hello":
                    print(json.dumps({"observation_size": 3, "action_count": 2, "deterministic": {{(deterministic ? "True" : "False")}}}), flush=True)
                elif op == "reset":
                    print(json.dumps({"observation": [0.0, 0.5, 1.0]}), flush=True)
                elif op == "step":
            {{string.Join("\n", stepReply.Split('\n').Select(l => "        " + l))}}
                elif op == "close":
                    break
            """);
        return $"python3 {path}";
    }

    private static (double[] Observations, double[] Rewards) Episode(ExternalEnvironment env, ulong seed, int[] actions)
    {
        var obs = new double[env.ObservationSize];
        env.Reset(seed, obs);
        var seen = new List<double>(obs);
        var rewards = new List<double>();
        foreach (int a in actions)
        {
            var r = env.Step(a, obs);
            seen.AddRange(obs);
            rewards.Add(r.Reward);
            if (r.Terminal || r.Truncated) break;
        }
        return (seen.ToArray(), rewards.ToArray());
    }

    [Fact]
    public void Example_child_hands_shakes_and_repeats_an_episode_under_its_seed()
    {
        using var env = Open($"python3 {Greenhouse}", ("child.max_steps", "30"));
        Assert.Equal((3, 3, "greenhouse-vents"), (env.ObservationSize, env.ActionCount, env.ChildName));
        Assert.True(env.SupportsStateSave); // the handshake declared "deterministic": true
        int[] actions = Enumerable.Range(0, 40).Select(i => i % 3).ToArray();
        var a = Episode(env, 7, actions);
        var b = Episode(env, 7, actions);
        var c = Episode(env, 8, actions);
        Assert.Equal(a.Observations, b.Observations);
        Assert.Equal(a.Rewards, b.Rewards);
        Assert.NotEqual(a.Observations, c.Observations);
        Assert.True(a.Rewards.Length <= 30); // child.max_steps reached the child: truncated at 30 at the latest
    }

    [Fact]
    public void Saved_state_is_restored_by_replay_into_a_fresh_child()
    {
        using var env = Open($"python3 {Greenhouse}", ("child.max_steps", "100"));
        var obs = new double[3];
        env.Reset(11, obs);
        for (int i = 0; i < 12; i++) env.Step(i % 2 == 0 ? 0 : 2, obs);
        var saved = new MemoryStream();
        env.SaveState(new BinaryWriter(saved));
        var expected = new List<double>();
        for (int i = 0; i < 6; i++) { env.Step(1, obs); expected.AddRange(obs); }

        using var fresh = Open($"python3 {Greenhouse}", ("child.max_steps", "100"));
        saved.Position = 0;
        fresh.LoadState(new BinaryReader(saved));
        Assert.Equal(12, fresh.StepCount);
        var got = new List<double>();
        for (int i = 0; i < 6; i++) { fresh.Step(1, obs); got.AddRange(obs); }
        Assert.Equal(expected, got);
    }

    [Fact]
    public void Child_dying_mid_episode_is_a_crash_naming_its_exit_code_and_stderr()
    {
        using var env = Open($"python3 {Greenhouse} --die-after-steps 3", ("child.max_steps", "100"));
        var obs = new double[3];
        env.Reset(1, obs);
        for (int i = 0; i < 3; i++) env.Step(0, obs);
        var ex = Assert.Throws<ExternalEnvironmentException>(() => env.Step(0, obs));
        Assert.Equal(BridgeFailure.Crashed, ex.Failure);
        Assert.Contains("reply to 'step'", ex.Message);
        Assert.Contains("exit code 3", ex.Message);
        Assert.Contains("simulated sensor failure", ex.Message); // the child's last stderr line is quoted
        // the bridge is unusable afterwards, with a message that says why
        Assert.Equal(BridgeFailure.Broken, Assert.Throws<ExternalEnvironmentException>(() => env.Reset(2, obs)).Failure);
    }

    [Fact]
    public void Hung_child_is_killed_after_the_timeout()
    {
        using var env = Open(Script("hangs", "time.sleep(60)"), ("timeout_seconds", "0.5"));
        var obs = new double[3];
        env.Reset(1, obs);
        var clock = Stopwatch.StartNew();
        var ex = Assert.Throws<ExternalEnvironmentException>(() => env.Step(0, obs));
        Assert.Equal(BridgeFailure.TimedOut, ex.Failure);
        Assert.Contains("no reply to 'step' within 0.5 s (timeout_seconds); the child was killed", ex.Message);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(20), $"took {clock.Elapsed}");
    }

    [Theory]
    [InlineData("print('not json at all', flush=True)", BridgeFailure.MalformedMessage, "malformed reply to 'step'", "the line was: not json at all")]
    [InlineData("print(json.dumps({'observation': [1.0, 2.0], 'reward': 0, 'terminal': False}), flush=True)", BridgeFailure.WrongSize, "observation of 2 entries; the handshake declared 3", "")]
    [InlineData("print(json.dumps({'observation': [1.0, 2.0, 3.0], 'terminal': False}), flush=True)", BridgeFailure.MalformedMessage, "reply to 'step' lacks 'reward'", "")]
    [InlineData("print(json.dumps({'observation': [1.0, 2.0, 3.0], 'reward': 'high', 'terminal': False}), flush=True)", BridgeFailure.MalformedMessage, "'reward' must be a number", "")]
    [InlineData("print(json.dumps({'error': 'valve controller offline'}), flush=True)", BridgeFailure.ChildError, "reported an error in reply to 'step': valve controller offline", "")]
    public void Bad_replies_name_the_problem(string stepReply, BridgeFailure failure, string expected, string alsoExpected)
    {
        using var env = Open(Script("bad", stepReply));
        var obs = new double[3];
        env.Reset(1, obs);
        var ex = Assert.Throws<ExternalEnvironmentException>(() => env.Step(1, obs));
        Assert.Equal(failure, ex.Failure);
        Assert.Contains(expected, ex.Message);
        Assert.Contains(alsoExpected, ex.Message);
        Assert.Contains("bad.py", ex.Message); // names the command
    }

    [Fact]
    public void Stderr_noise_is_drained_and_does_not_disturb_the_protocol()
    {
        using var env = Open($"python3 {Greenhouse} --stderr-noise", ("child.max_steps", "50"), ("stderr_lines", "5"));
        using var quiet = Open($"python3 {Greenhouse}", ("child.max_steps", "50"));
        int[] actions = Enumerable.Range(0, 50).Select(i => i % 3).ToArray();
        var (expectedObs, expectedRewards) = Episode(quiet, 3, actions);
        var (obs, rewards) = Episode(env, 3, actions);
        Assert.Equal(expectedObs, obs);
        Assert.Equal(expectedRewards, rewards);
        Thread.Sleep(200); // stderr is read asynchronously
        var lines = env.RecentStderr;
        Assert.InRange(lines.Count, 1, 5);
        Assert.Contains(lines, l => l.StartsWith("greenhouse: received", StringComparison.Ordinal));
    }

    [Fact]
    public void A_command_that_cannot_start_says_so()
    {
        var ex = Assert.Throws<ExternalEnvironmentException>(() => Open(_dir.Combine("no-such-program")));
        Assert.Equal(BridgeFailure.StartFailed, ex.Failure);
        Assert.Contains("could not start command", ex.Message);
    }

    [Fact]
    public void Deep_q_run_on_a_child_that_is_not_deterministic_stops_at_its_first_checkpoint_with_the_reason()
    {
        string script = Script("undeclared", "print(json.dumps({'observation': [0.0, 0.5, 1.0], 'reward': 0.0, 'terminal': False}), flush=True)", deterministic: false);
        var (output, _) = TrainExpectingFailure("undeclared", script, hidden: 4, envSteps: 200, "metrics_every_steps: 50");
        Assert.Contains("cannot checkpoint this deep-Q run: environment 'external' cannot save its state mid-episode", output);
        Assert.Contains("\"deterministic\": true", output);
    }

    /// <summary>
    /// Trains a small deep-Q run on <paramref name="command"/> through the real CLI and checks what every failed run shows:
    /// exit code 1, a plain message (no "unexpected failure", no stack trace) and failed.json. Returns the output and the run folder.
    /// </summary>
    private (string Output, string RunDir) TrainExpectingFailure(string name, string command, int hidden, int envSteps, string logging)
    {
        File.WriteAllText(_dir.Combine("run.yaml"), $"""
            experiment:
              name: {name}
              seed: 2
              budget:
                env_steps: {envSteps}
            environment:
              kind: external
              command: {command}
            model:
              kind: classical
              classical:
                hidden_sizes: [{hidden}]
            trainer:
              kind: dqn
              dqn:
                replay_capacity: 400
                warmup_steps: 40
                batch_size: 8
                eval_every: 0
            logging:
              {logging}
              checkpoint_every_steps: 50
              final_eval_episodes: 0
            """);
        var (code, stdout, stderr) = CliProcess.Run(["train", _dir.Combine("run.yaml"), "--runs-dir", _dir.Combine("runs"), "--run-id", "r1"], TimeSpan.FromMinutes(3));
        string output = stdout + stderr;
        Assert.True(code == 1, $"exit code {code}\n{output}");
        Assert.DoesNotContain("unexpected failure", output);
        Assert.DoesNotContain("   at ", output); // no stack trace
        string run = _dir.Combine("runs", name, "r1");
        Assert.True(File.Exists(Path.Combine(run, "failed.json")), output);
        Assert.False(File.Exists(Path.Combine(run, "summary.json")));
        return (output, run);
    }

    [Fact]
    public void Training_run_whose_child_dies_exits_1_with_a_clear_message_and_keeps_its_checkpoints()
    {
        // Counts steps over all episodes and dies at step 230: after the checkpoints at 50 … 200.
        string script = _dir.Combine("dies.py");
        File.WriteAllText(script, """
            import json, sys
            steps = 0
            for line in sys.stdin:
                m = json.loads(line)
                op = m.get("op")
                if op == "hello":
                    print(json.dumps({"observation_size": 2, "action_count": 2, "deterministic": True}), flush=True)
                elif op == "reset":
                    print(json.dumps({"observation": [0.0, 1.0]}), flush=True)
                elif op == "step":
                    steps += 1
                    if steps > 230:
                        sys.stderr.write("conveyor line: motor driver fault\n"); sys.stderr.flush()
                        sys.exit(5)
                    print(json.dumps({"observation": [steps % 2, 1.0], "reward": 0.1 * (m["action"] == steps % 2), "terminal": False, "truncated": steps % 20 == 0}), flush=True)
                elif op == "close":
                    break
            """);
        var (output, run) = TrainExpectingFailure("child-dies", $"python3 {script}", hidden: 8, envSteps: 400, "metrics_every_steps: 25");
        Assert.Contains("the child closed its output while the bridge waited for a reply to 'step' (exit code 5)", output);
        Assert.Contains("motor driver fault", output);
        using (var failed = JsonDocument.Parse(File.ReadAllText(Path.Combine(run, "failed.json"))))
            Assert.Contains("exit code 5", failed.RootElement.GetProperty("message").GetString());
        // the JSON log records the progress lines too (the first update always is), and the failure
        string log = File.ReadAllText(Path.Combine(run, "log.json"));
        Assert.Contains("\"ProgressLine\":true", log);
        Assert.Contains("motor driver fault", log);
        using var newest = CheckpointStore.OpenNewestValid(Path.Combine(run, "checkpoints"), out var rejected);
        Assert.Empty(rejected);
        Assert.NotNull(newest);
        Assert.Equal(200, newest!.Header.Step); // the last checkpoint before the crash at step 231
    }
}
