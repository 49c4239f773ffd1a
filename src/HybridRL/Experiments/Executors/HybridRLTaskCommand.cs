using System.Reflection;

namespace HybridRL.Experiments.Executors;

/// <summary>
/// <c>&lt;hybridrl&gt; sweep task FILE [--index I]</c>, where <c>&lt;hybridrl&gt;</c> is <see cref="Prefix"/> — the executable, or
/// <c>dotnet path/HybridRL.Cli.dll</c> when running through the dotnet host.
/// </summary>
public sealed class HybridRLTaskCommand(IReadOnlyList<string> prefix) : ITaskCommand
{
    /// <summary>Program and leading arguments that start the HybridRL command-line tool.</summary>
    public IReadOnlyList<string> Prefix { get; } = prefix.Count > 0 ? prefix : throw new ArgumentException("the command prefix needs at least the program", nameof(prefix));

    /// <summary>The running program: <see cref="Environment.ProcessPath"/>, plus the entry assembly when that is the dotnet host.</summary>
    public static HybridRLTaskCommand FromCurrentProcess()
    {
        string exe = Environment.ProcessPath ?? throw new InvalidOperationException("the path of the running executable is unknown");
        string stem = Path.GetFileNameWithoutExtension(exe);
        if (string.Equals(stem, "dotnet", StringComparison.OrdinalIgnoreCase))
        {
            string dll = Assembly.GetEntryAssembly()?.Location ?? throw new InvalidOperationException("running under dotnet without an entry assembly");
            return new HybridRLTaskCommand([exe, dll]);
        }
        return new HybridRLTaskCommand([exe]);
    }

    public IReadOnlyList<string> ForIndex(string sweepFile, int index) =>
        [.. Prefix, "sweep", "task", sweepFile, "--index", index.ToString(System.Globalization.CultureInfo.InvariantCulture)];

    public IReadOnlyList<string> ForArrayTask(string sweepFile) => [.. Prefix, "sweep", "task", sweepFile];
}
