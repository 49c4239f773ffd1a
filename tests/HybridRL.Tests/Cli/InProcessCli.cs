using HybridRL.Cli;

namespace HybridRL.Tests.Cli;

/// <summary>
/// Runs the `hybridrl` command tree inside the test process (no child process start-up), capturing
/// the console. Console redirection is process-wide, so tests using it belong to <see cref="ConsoleCollection"/>.
/// </summary>
public static class InProcessCli
{
    private static readonly object Gate = new();

    public static (int ExitCode, string Stdout, string Stderr) Run(params string[] args)
    {
        lock (Gate)
        {
            var oldOut = Console.Out;
            var oldErr = Console.Error;
            using var stdout = new StringWriter();
            using var stderr = new StringWriter();
            Console.SetOut(stdout);
            Console.SetError(stderr);
            try
            {
                int code = CliApplication.Run(args);
                return (code, stdout.ToString(), stderr.ToString());
            }
            finally
            {
                Console.SetOut(oldOut);
                Console.SetError(oldErr);
            }
        }
    }
}
