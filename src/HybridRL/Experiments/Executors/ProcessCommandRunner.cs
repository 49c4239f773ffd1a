using System.Diagnostics;

namespace HybridRL.Experiments.Executors;

/// <summary><see cref="ICommandRunner"/> over <see cref="Process"/>.</summary>
public sealed class ProcessCommandRunner : ICommandRunner
{
    public static readonly ProcessCommandRunner Instance = new();

    public CommandResult Run(string program, IReadOnlyList<string> arguments, TimeSpan timeout)
    {
        var psi = new ProcessStartInfo(program)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        foreach (var a in arguments) psi.ArgumentList.Add(a);
        Process p;
        try
        {
            p = Process.Start(psi) ?? throw new ExecutorException($"could not start '{program}'");
        }
        catch (System.ComponentModel.Win32Exception e)
        {
            throw new ExecutorException($"could not start '{program}': {e.Message}", e);
        }
        using (p)
        {
            p.StandardInput.Close();
            var stdout = p.StandardOutput.ReadToEndAsync();
            var stderr = p.StandardError.ReadToEndAsync();
            if (!p.WaitForExit(timeout))
            {
                try { p.Kill(entireProcessTree: true); } catch (InvalidOperationException) { }
                throw new ExecutorException($"'{program} {string.Join(" ", arguments)}' did not finish within {timeout.TotalSeconds:0} s");
            }
            p.WaitForExit();
            return new CommandResult(p.ExitCode, stdout.Result, stderr.Result);
        }
    }

    public bool IsAvailable(string program) => FindOnPath(program) is not null;

    /// <summary>Full path of <paramref name="program"/> on PATH, or null.</summary>
    public static string? FindOnPath(string program)
    {
        if (program.Contains('/')) return File.Exists(program) ? Path.GetFullPath(program) : null;
        foreach (var dir in (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
        {
            string candidate = Path.Combine(dir, program);
            if (File.Exists(candidate)) return candidate;
        }
        return null;
    }
}
