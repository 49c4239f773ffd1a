using System.Diagnostics;
using System.Text;

namespace HybridRL.Tests.Support;

/// <summary>Runs the real `hybridrl` program (built next to the tests) as a child process.</summary>
public sealed class CliProcess : IDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _stdout = new();
    private readonly StringBuilder _stderr = new();

    private CliProcess(Process process)
    {
        _process = process;
    }

    /// <summary>Path of hybridrl.dll in the test output folder.</summary>
    public static string DllPath => Path.Combine(AppContext.BaseDirectory, "hybridrl.dll");

    /// <summary>The program and leading arguments that run the CLI (for sweep executors).</summary>
    public static IReadOnlyList<string> CommandPrefix => [DotNet, DllPath];

    public static string DotNet => Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } p ? p : "dotnet";

    public static CliProcess Start(IEnumerable<string> args, string? workingDirectory = null, IDictionary<string, string>? environment = null)
    {
        var psi = new ProcessStartInfo(DotNet)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
            WorkingDirectory = workingDirectory ?? Environment.CurrentDirectory,
        };
        psi.ArgumentList.Add(DllPath);
        foreach (var a in args) psi.ArgumentList.Add(a);
        psi.Environment["DOTNET_NOLOGO"] = "1";
        if (environment is not null)
            foreach (var (k, v) in environment) psi.Environment[k] = v;
        var p = new Process { StartInfo = psi };
        var cli = new CliProcess(p);
        p.OutputDataReceived += (_, e) => { if (e.Data is not null) lock (cli._stdout) cli._stdout.AppendLine(e.Data); };
        p.ErrorDataReceived += (_, e) => { if (e.Data is not null) lock (cli._stderr) cli._stderr.AppendLine(e.Data); };
        p.Start();
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        p.StandardInput.Close();
        return cli;
    }

    /// <summary>Runs to completion (or kills after <paramref name="timeout"/>) and returns exit code and output.</summary>
    public static (int ExitCode, string Stdout, string Stderr) Run(IEnumerable<string> args, TimeSpan? timeout = null, string? workingDirectory = null, IDictionary<string, string>? environment = null)
    {
        using var cli = Start(args, workingDirectory, environment);
        int code = cli.WaitForExit(timeout ?? TimeSpan.FromMinutes(5));
        return (code, cli.Stdout, cli.Stderr);
    }

    public int Id => _process.Id;
    public bool HasExited => _process.HasExited;

    public string Stdout { get { lock (_stdout) return _stdout.ToString(); } }
    public string Stderr { get { lock (_stderr) return _stderr.ToString(); } }

    /// <summary>Waits for exit; kills the process tree and throws on timeout.</summary>
    public int WaitForExit(TimeSpan timeout)
    {
        if (!_process.WaitForExit(timeout))
        {
            try { _process.Kill(entireProcessTree: true); } catch (InvalidOperationException) { }
            throw new TimeoutException($"hybridrl did not exit within {timeout}; stderr:\n{Stderr}");
        }
        _process.WaitForExit(); // drain the output handlers
        return _process.ExitCode;
    }

    /// <summary>Sends a POSIX signal (e.g. 15 for SIGTERM, 9 for SIGKILL) to the process.</summary>
    public void Signal(int signal)
    {
        if (kill(_process.Id, signal) != 0) throw new InvalidOperationException($"kill({_process.Id}, {signal}) failed");
    }

    [System.Runtime.InteropServices.DllImport("libc", SetLastError = true)]
    private static extern int kill(int pid, int sig);

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            try { _process.Kill(entireProcessTree: true); } catch (InvalidOperationException) { }
        }
        _process.Dispose();
    }
}
