using HybridRL.Experiments.Executors;

namespace HybridRL.Tests.Sweeps;

/// <summary>What a failing Slurm test prints: the queue, Slurm's view of the array element, its output file and the controller log tail.</summary>
public static class SlurmDiagnostics
{
    private const string ControllerLog = "/tmp/hybridrl-slurm/log/slurmctld.log"; // where scripts/local-slurm.sh puts it

    public static string Describe(string job, int index, string outputFile)
    {
        static string Try(string program, params string[] args)
        {
            try
            {
                var r = ProcessCommandRunner.Instance.Run(program, args, TimeSpan.FromSeconds(20));
                return $"(exit {r.ExitCode}) {r.StandardOutput}{r.StandardError}";
            }
            catch (ExecutorException e)
            {
                return e.Message;
            }
        }

        string log = File.Exists(ControllerLog) ? string.Join("\n", File.ReadLines(ControllerLog).Where(l => l.Contains(job)).TakeLast(30)) : "(no controller log)";
        return $"""

            squeue: {Try("squeue", "-h", "-o", "%i %T %r")}
            scontrol show job {job}_{index}: {Try("scontrol", "show", "job", $"{job}_{index}")}
            {outputFile}: {(File.Exists(outputFile) ? File.ReadAllText(outputFile) : "(none)")}
            slurmctld.log lines naming {job}:
            {log}
            """;
    }
}
