using System.CommandLine;
using HybridRL.Diagnostics;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl about`: versions, SIMD, cores, native tensor library and Slurm availability.</summary>
public static class AboutCommand
{
    public static Command Create()
    {
        var command = new Command("about", "Show versions, SIMD support, cores, whether the native tensor library loads, and whether sbatch is available. Run this first on a new node.");
        command.SetAction(_ =>
        {
            var report = SystemReport.Collect();
            foreach (var line in report.ToLines()) Console.WriteLine(line);
            return report.Torch.Loaded ? ExitCodes.Done : ExitCodes.Failure;
        });
        return command;
    }
}
