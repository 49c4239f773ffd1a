using System.Buffers;
using System.Diagnostics;
using System.Text;
using System.Text.Json;

namespace HybridRL.Environments;

/// <summary>
/// Bridge to an environment written in any language: the child process named by <c>command</c> speaks line-delimited
/// JSON on stdin/stdout (protocol in examples/bridge/PROTOCOL.md: hello → sizes, reset, step, close). The child's
/// stderr is drained continuously and its last lines are quoted in errors. A crashed child, a reply later than
/// <c>timeout_seconds</c> (the child is then killed), malformed JSON, missing fields and wrong-sized observations all
/// raise <see cref="ExternalEnvironmentException"/> naming the problem.
/// <para>State save/restore: when the child declares <c>"deterministic": true</c> in its handshake, the bridge records
/// the episode's seed and actions; <see cref="SaveState"/> writes them and <see cref="LoadState"/> replays them into the
/// child (reset with the seed, resend the actions) and checks that the replay reproduces the saved observation.
/// Otherwise <see cref="SupportsStateSave"/> is false and saving throws <see cref="NotSupportedException"/>.</para>
/// </summary>
public sealed class ExternalEnvironment : IEnvironment
{
    public const int ProtocolVersion = 1;
    private const int FormatVersion = 1;
    private readonly ExternalEnvironmentSettings _settings;
    private readonly Process _process;
    private readonly Stream _stdin;
    private readonly ChildLineReader _reader;
    private readonly Queue<string> _stderr = new();
    private readonly ArrayBufferWriter<byte> _out = new(256);
    private readonly Utf8JsonWriter _json;
    private readonly double[] _lastObservation;
    private readonly List<int> _actions = new(1024);
    private ulong _episodeSeed;
    private bool _episodeStarted;
    private bool _done;
    private bool _broken;
    private bool _disposed;
    private int _steps;
    private int _stateIndex = -1;
    private string _lastRequest = "hello";

    public ExternalEnvironment(ExternalEnvironmentSettings settings)
    {
        _settings = settings ?? throw new ArgumentNullException(nameof(settings));
        var psi = new ProcessStartInfo
        {
            FileName = settings.CommandWords[0],
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            CreateNoWindow = true,
        };
        for (int i = 1; i < settings.CommandWords.Count; i++) psi.ArgumentList.Add(settings.CommandWords[i]);
        if (settings.WorkingDirectory.Length > 0) psi.WorkingDirectory = settings.WorkingDirectory;
        psi.StandardInputEncoding = new UTF8Encoding(false);
        _process = new Process { StartInfo = psi };
        _process.ErrorDataReceived += OnStderr;
        try
        {
            if (!_process.Start()) throw new InvalidOperationException("process did not start");
        }
        catch (Exception e) when (e is System.ComponentModel.Win32Exception or InvalidOperationException or FileNotFoundException)
        {
            throw new ExternalEnvironmentException(BridgeFailure.StartFailed, $"external environment: could not start command '{settings.Command}': {e.Message}", e);
        }
        _process.BeginErrorReadLine();
        _stdin = _process.StandardInput.BaseStream;
        _reader = new ChildLineReader(_process.StandardOutput.BaseStream);
        _json = new Utf8JsonWriter(_out);
        try
        {
            Handshake(out int obsSize, out int actionCount, out string name, out bool deterministic, out bool binary, out int stateCount);
            ObservationSize = obsSize;
            ActionCount = actionCount;
            ChildName = name;
            SupportsStateSave = deterministic;
            ObservationIsBinary = binary;
            StateCount = stateCount;
            _lastObservation = new double[obsSize];
        }
        catch
        {
            Kill();
            throw;
        }
    }

    public string Name => ExternalEnvironmentSettings.KindName;
    /// <summary>The name the child gave in its handshake (may be empty).</summary>
    public string ChildName { get; }
    public int ObservationSize { get; }
    public int ActionCount { get; }
    public bool ObservationIsBinary { get; }
    public int StateCount { get; }
    public int StateIndex => _stateIndex;
    public bool SupportsStateSave { get; }
    public int StepCount => _steps;

    /// <summary>The child's last stderr lines (at most <c>stderr_lines</c>).</summary>
    public IReadOnlyList<string> RecentStderr { get { lock (_stderr) return _stderr.ToArray(); } }

    private void OnStderr(object sender, DataReceivedEventArgs e)
    {
        if (e.Data is null || _settings.StderrLines == 0) return;
        lock (_stderr)
        {
            _stderr.Enqueue(e.Data);
            while (_stderr.Count > _settings.StderrLines) _stderr.Dequeue();
        }
    }

    private void Handshake(out int obsSize, out int actionCount, out string name, out bool deterministic, out bool binary, out int stateCount)
    {
        BeginMessage("hello");
        _json.WriteNumber("protocol", ProtocolVersion);
        _json.WriteStartObject("parameters");
        foreach (var (k, v) in _settings.ChildParameters) _json.WriteString(k, v);
        _json.WriteEndObject();
        Send();
        var line = Receive();
        obsSize = -1; actionCount = -1; name = ""; deterministic = false; binary = false; stateCount = 0;
        try
        {
            var reader = new Utf8JsonReader(line);
            StartObject(ref reader, line);
            while (NextProperty(ref reader, line))
            {
                if (reader.ValueTextEquals("observation_size"u8)) { reader.Read(); obsSize = ReadInt(ref reader, "observation_size", line); }
                else if (reader.ValueTextEquals("action_count"u8)) { reader.Read(); actionCount = ReadInt(ref reader, "action_count", line); }
                else if (reader.ValueTextEquals("name"u8)) { reader.Read(); name = reader.TokenType == JsonTokenType.String ? reader.GetString() ?? "" : throw Malformed("'name' must be a string", line); }
                else if (reader.ValueTextEquals("deterministic"u8)) { reader.Read(); deterministic = ReadBool(ref reader, "deterministic", line); }
                else if (reader.ValueTextEquals("binary_observation"u8)) { reader.Read(); binary = ReadBool(ref reader, "binary_observation", line); }
                else if (reader.ValueTextEquals("state_count"u8)) { reader.Read(); stateCount = ReadInt(ref reader, "state_count", line); }
                else if (reader.ValueTextEquals("error"u8)) { reader.Read(); throw ChildError(ref reader); }
                else { reader.Read(); reader.Skip(); }
            }
        }
        catch (JsonException e) { throw Malformed($"invalid JSON ({e.Message})", line, e); }
        finally { _reader.Release(); }
        if (obsSize < 0 || actionCount < 0) throw Fail(BridgeFailure.MalformedMessage, "the handshake reply lacks 'observation_size' or 'action_count'");
        if (obsSize < 1 || obsSize > 1_000_000) throw Fail(BridgeFailure.WrongSize, $"the handshake declared observation_size {obsSize}; allowed 1..1000000");
        if (actionCount < 1 || actionCount > 1_000_000) throw Fail(BridgeFailure.WrongSize, $"the handshake declared action_count {actionCount}; allowed 1..1000000");
        if (stateCount < 0) throw Fail(BridgeFailure.WrongSize, $"the handshake declared state_count {stateCount}; must be 0 or more");
    }

    public void Reset(ulong seed, Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        SendReset(seed);
        ReadReply(observation, stepReply: false, out _);
        _episodeSeed = seed;
        _episodeStarted = true;
        _actions.Clear();
        _steps = 0;
        _done = false;
    }

    public StepResult Step(int action, Span<double> observation)
    {
        if (!_episodeStarted) throw new InvalidOperationException($"{Name}: call Reset before Step");
        if (_done) throw new InvalidOperationException($"{Name}: the episode is over; call Reset");
        if ((uint)action >= (uint)ActionCount) throw new ArgumentOutOfRangeException(nameof(action), action, $"actions are 0..{ActionCount - 1}");
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        SendStep(action);
        ReadReply(observation, stepReply: true, out var result);
        if (SupportsStateSave) _actions.Add(action);
        _steps++;
        _done = result.Done;
        return result;
    }

    private void SendReset(ulong seed)
    {
        BeginMessage("reset");
        _json.WriteNumber("seed", seed);
        Send();
    }

    private void SendStep(int action)
    {
        BeginMessage("step");
        _json.WriteNumber("action", action);
        Send();
    }

    private void ReadReply(Span<double> observation, bool stepReply, out StepResult result)
    {
        var line = Receive();
        int count = 0;
        bool haveObs = false, haveReward = false, haveTerminal = false;
        double reward = 0;
        bool terminal = false, truncated = false;
        int stateIndex = -1;
        try
        {
            var reader = new Utf8JsonReader(line);
            StartObject(ref reader, line);
            while (NextProperty(ref reader, line))
            {
                if (reader.ValueTextEquals("observation"u8))
                {
                    reader.Read();
                    if (reader.TokenType != JsonTokenType.StartArray) throw Malformed("'observation' must be an array of numbers", line);
                    while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                    {
                        if (reader.TokenType != JsonTokenType.Number) throw Malformed("'observation' must be an array of numbers", line);
                        if (count >= ObservationSize)
                            throw Fail(BridgeFailure.WrongSize, $"reply to '{_lastRequest}' has an observation with more than the {ObservationSize} entries declared in the handshake");
                        double v = reader.GetDouble();
                        if (!double.IsFinite(v)) throw Malformed("observation entries must be finite", line);
                        observation[count++] = v;
                    }
                    haveObs = true;
                }
                else if (reader.ValueTextEquals("reward"u8))
                {
                    reader.Read();
                    if (reader.TokenType != JsonTokenType.Number) throw Malformed("'reward' must be a number", line);
                    reward = reader.GetDouble();
                    if (!double.IsFinite(reward)) throw Malformed("'reward' must be finite", line);
                    haveReward = true;
                }
                else if (reader.ValueTextEquals("terminal"u8)) { reader.Read(); terminal = ReadBool(ref reader, "terminal", line); haveTerminal = true; }
                else if (reader.ValueTextEquals("truncated"u8)) { reader.Read(); truncated = ReadBool(ref reader, "truncated", line); }
                else if (reader.ValueTextEquals("state_index"u8)) { reader.Read(); stateIndex = ReadInt(ref reader, "state_index", line); }
                else if (reader.ValueTextEquals("error"u8)) { reader.Read(); throw ChildError(ref reader); }
                else { reader.Read(); reader.Skip(); }
            }
        }
        catch (JsonException e) { throw Malformed($"invalid JSON ({e.Message})", line, e); }
        catch (InvalidOperationException e) { throw Malformed($"unexpected value ({e.Message})", line, e); }
        finally { _reader.Release(); }
        if (!haveObs) throw Fail(BridgeFailure.MalformedMessage, $"reply to '{_lastRequest}' lacks 'observation'");
        if (count != ObservationSize)
            throw Fail(BridgeFailure.WrongSize, $"reply to '{_lastRequest}' has an observation of {count} entries; the handshake declared {ObservationSize}");
        if (stepReply && (!haveReward || !haveTerminal))
            throw Fail(BridgeFailure.MalformedMessage, $"reply to 'step' lacks {(haveReward ? "'terminal'" : "'reward'")}");
        if (StateCount > 0 && (stateIndex < 0 || stateIndex >= StateCount))
            throw Fail(BridgeFailure.WrongSize, $"reply to '{_lastRequest}' has state_index {stateIndex}; the handshake declared state_count {StateCount}");
        _stateIndex = StateCount > 0 ? stateIndex : -1;
        observation[..ObservationSize].CopyTo(_lastObservation);
        result = new StepResult(reward, terminal, truncated);
    }

    public void WriteObservation(Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        _lastObservation.AsSpan().CopyTo(observation);
    }

    public void SaveState(BinaryWriter writer)
    {
        if (!SupportsStateSave)
            throw new NotSupportedException($"external environment '{_settings.Command}' cannot be checkpointed: its handshake did not declare \"deterministic\": true, so the bridge cannot restore it by replaying the episode's seed and actions");
        StateFormat.WriteHeader(writer, Name, FormatVersion);
        writer.Write(_episodeStarted);
        writer.Write(_episodeSeed);
        writer.Write(_done);
        writer.Write(_steps);
        writer.Write(_actions.Count);
        foreach (int a in _actions) writer.Write(a);
        writer.Write(_lastObservation.Length);
        foreach (double v in _lastObservation) writer.Write(v);
    }

    public void LoadState(BinaryReader reader)
    {
        if (!SupportsStateSave)
            throw new NotSupportedException($"external environment '{_settings.Command}' cannot be restored from a checkpoint: its handshake did not declare \"deterministic\": true");
        StateFormat.ReadHeader(reader, Name, FormatVersion);
        bool started = reader.ReadBoolean();
        ulong seed = reader.ReadUInt64();
        bool done = reader.ReadBoolean();
        int steps = reader.ReadInt32();
        int n = reader.ReadInt32();
        var actions = new int[n];
        for (int i = 0; i < n; i++) actions[i] = reader.ReadInt32();
        int len = reader.ReadInt32();
        if (len != ObservationSize) throw new InvalidDataException($"{Name}: saved observation has {len} entries, the child declares {ObservationSize}");
        var saved = new double[len];
        for (int i = 0; i < len; i++) saved[i] = reader.ReadDouble();
        if (!started) { _episodeStarted = false; saved.CopyTo(_lastObservation, 0); return; }
        // Replay the episode into the child.
        var obs = new double[ObservationSize];
        Reset(seed, obs);
        foreach (int a in actions) Step(a, obs);
        if (!obs.AsSpan().SequenceEqual(saved))
            throw Fail(BridgeFailure.ReplayMismatch, $"replaying seed {seed} and {n} recorded actions did not reproduce the saved observation; the child declared \"deterministic\": true but is not");
        _steps = steps;
        _done = done;
    }

    private void BeginMessage(string op)
    {
        if (_disposed) throw new ObjectDisposedException(nameof(ExternalEnvironment));
        if (_broken) throw new ExternalEnvironmentException(BridgeFailure.Broken, $"external environment '{_settings.Command}' is unusable after an earlier failure");
        _lastRequest = op;
        _out.ResetWrittenCount();
        _json.Reset(_out);
        _json.WriteStartObject();
        _json.WriteString("op"u8, op);
    }

    private void Send()
    {
        _json.WriteEndObject();
        _json.Flush();
        try
        {
            _stdin.Write(_out.WrittenSpan);
            _stdin.WriteByte((byte)'\n');
            _stdin.Flush();
        }
        catch (IOException e)
        {
            throw Fail(BridgeFailure.Crashed, $"could not send '{_lastRequest}' to the child ({e.Message}){ExitNote()}", e);
        }
    }

    private ReadOnlySpan<byte> Receive()
    {
        var outcome = _reader.Wait(_settings.Timeout, out var line);
        switch (outcome)
        {
            case ChildLineReader.Outcome.Line:
                return line;
            case ChildLineReader.Outcome.Timeout:
                Kill();
                throw Fail(BridgeFailure.TimedOut, $"no reply to '{_lastRequest}' within {_settings.Timeout.TotalSeconds:R} s (timeout_seconds); the child was killed");
            default:
                throw Fail(BridgeFailure.Crashed, $"the child closed its output while the bridge waited for a reply to '{_lastRequest}'{ExitNote()}");
        }
    }

    private string ExitNote()
    {
        try
        {
            if (_process.WaitForExit(2000))
            {
                _process.WaitForExit(); // flush the asynchronous stderr reader
                return $" (exit code {_process.ExitCode})";
            }
        }
        catch (InvalidOperationException) { }
        return "";
    }

    private ExternalEnvironmentException Fail(BridgeFailure failure, string problem, Exception? inner = null)
    {
        _broken = true;
        var sb = new StringBuilder();
        sb.Append("external environment '").Append(_settings.Command).Append("': ").Append(problem);
        var lines = RecentStderr;
        if (lines.Count > 0)
        {
            sb.Append(". Last stderr lines of the child:");
            foreach (var l in lines) sb.Append("\n  | ").Append(l);
        }
        return inner is null ? new ExternalEnvironmentException(failure, sb.ToString()) : new ExternalEnvironmentException(failure, sb.ToString(), inner);
    }

    private ExternalEnvironmentException Malformed(string what, ReadOnlySpan<byte> line, Exception? inner = null)
    {
        string text = Encoding.UTF8.GetString(line.Length > 200 ? line[..200] : line);
        return Fail(BridgeFailure.MalformedMessage, $"malformed reply to '{_lastRequest}': {what}; the line was: {text}{(line.Length > 200 ? "…" : "")}", inner);
    }

    private ExternalEnvironmentException ChildError(ref Utf8JsonReader reader)
    {
        string message = reader.TokenType == JsonTokenType.String ? reader.GetString() ?? "" : "(non-string error)";
        return Fail(BridgeFailure.ChildError, $"the child reported an error in reply to '{_lastRequest}': {message}");
    }

    private void StartObject(ref Utf8JsonReader reader, ReadOnlySpan<byte> line)
    {
        if (!reader.Read() || reader.TokenType != JsonTokenType.StartObject) throw Malformed("expected one JSON object per line", line);
    }

    private bool NextProperty(ref Utf8JsonReader reader, ReadOnlySpan<byte> line)
    {
        if (!reader.Read()) throw Malformed("incomplete JSON object", line);
        if (reader.TokenType == JsonTokenType.EndObject) return false;
        if (reader.TokenType != JsonTokenType.PropertyName) throw Malformed("expected a property name", line);
        return true;
    }

    private int ReadInt(ref Utf8JsonReader reader, string key, ReadOnlySpan<byte> line)
    {
        if (reader.TokenType != JsonTokenType.Number || !reader.TryGetInt32(out int v)) throw Malformed($"'{key}' must be an integer", line);
        return v;
    }

    private bool ReadBool(ref Utf8JsonReader reader, string key, ReadOnlySpan<byte> line)
    {
        return reader.TokenType switch
        {
            JsonTokenType.True => true,
            JsonTokenType.False => false,
            _ => throw Malformed($"'{key}' must be true or false", line),
        };
    }

    private void Kill()
    {
        try { if (!_process.HasExited) _process.Kill(entireProcessTree: true); }
        catch (InvalidOperationException) { }
        catch (System.ComponentModel.Win32Exception) { }
    }

    public void Dispose()
    {
        if (_disposed) return;
        if (!_broken)
        {
            try
            {
                BeginMessage("close");
                Send();
            }
            catch (ExternalEnvironmentException) { }
        }
        _disposed = true;
        try { _stdin.Close(); } catch (IOException) { }
        try
        {
            if (!_process.WaitForExit(2000)) Kill();
        }
        catch (InvalidOperationException) { }
        _reader.Stop();
        _json.Dispose();
        _process.Dispose();
    }
}
