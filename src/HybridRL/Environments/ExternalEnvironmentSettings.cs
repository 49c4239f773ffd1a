namespace HybridRL.Environments;

/// <summary>
/// Settings of the <c>external</c> kind: an environment in another language, run as a child process speaking the
/// line-delimited JSON protocol of examples/bridge/PROTOCOL.md (see <see cref="ExternalEnvironment"/>). Keys starting
/// with <c>child.</c> are passed (without the prefix) to the child in the handshake.
/// </summary>
public sealed class ExternalEnvironmentSettings : EnvironmentSettings
{
    public const string KindName = "external";
    public const string ChildPrefix = "child.";

    public static readonly IReadOnlyDictionary<string, string> Defaults = new SortedDictionary<string, string>(StringComparer.Ordinal)
    {
        ["command"] = "",
        ["working_directory"] = "",
        ["timeout_seconds"] = "10",
        ["stderr_lines"] = "20",
    };

    private ExternalEnvironmentSettings(IReadOnlyDictionary<string, string> values) : base(KindName, values) { }

    /// <summary>The command line as given (program and arguments; quotes group words).</summary>
    public string Command { get; private init; } = "";
    /// <summary>Program and arguments after splitting <see cref="Command"/>.</summary>
    public IReadOnlyList<string> CommandWords { get; private init; } = [];
    public string WorkingDirectory { get; private init; } = "";
    /// <summary>Longest wait for any reply of the child (handshake, reset, step).</summary>
    public TimeSpan Timeout { get; private init; }
    /// <summary>How many of the child's last stderr lines are kept for error messages.</summary>
    public int StderrLines { get; private init; }
    /// <summary>Parameters for the child (the <c>child.</c> keys without their prefix).</summary>
    public IReadOnlyDictionary<string, string> ChildParameters { get; private init; } = new Dictionary<string, string>();

    public static ExternalEnvironmentSettings Parse(IReadOnlyDictionary<string, string> parameters)
    {
        var p = new ParameterReader(KindName, Defaults, parameters, ChildPrefix);
        string command = p.String("command", allowEmpty: false);
        IReadOnlyList<string> words;
        try { words = CommandLineWords.Split(command); }
        catch (FormatException e) { throw new EnvironmentConfigException("command", $"parameter 'command' of environment '{KindName}': {e.Message}", e); }
        if (words.Count == 0) throw new EnvironmentConfigException("command", $"parameter 'command' of environment '{KindName}' is required and must not be empty");
        string wd = p.String("working_directory");
        if (wd.Length > 0 && !Directory.Exists(wd))
            throw new EnvironmentConfigException("working_directory", $"parameter 'working_directory' of environment '{KindName}': directory '{wd}' does not exist");
        double timeout = p.Double("timeout_seconds", 0, 86_400, minExclusive: true);
        int lines = p.Int("stderr_lines", 0, 10_000);
        var child = new SortedDictionary<string, string>(StringComparer.Ordinal);
        foreach (var (k, v) in p.Resolved)
            if (k.StartsWith(ChildPrefix, StringComparison.Ordinal)) child[k[ChildPrefix.Length..]] = v;
        return new ExternalEnvironmentSettings(p.Resolved)
        {
            Command = command,
            CommandWords = words,
            WorkingDirectory = wd,
            Timeout = TimeSpan.FromSeconds(timeout),
            StderrLines = lines,
            ChildParameters = child,
        };
    }

    public override IEnvironment CreateEnvironment() => new ExternalEnvironment(this);
}
