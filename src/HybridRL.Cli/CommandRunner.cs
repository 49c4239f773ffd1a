using System.CommandLine;
using System.CommandLine.Invocation;
using HybridRL.Checkpoints;
using HybridRL.Environments;
using HybridRL.Experiments;
using HybridRL.Experiments.Config;
using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Runs;
using HybridRL.Experiments.Sweeps;
using HybridRL.Models;
using HybridRL.Native;

namespace HybridRL.Cli;

/// <summary>Parses and runs a command line; maps known failures to HybridRL's exit codes with one clear message.</summary>
public static class CommandRunner
{
    public static int Invoke(RootCommand root, string[] args)
    {
        ExperimentSpecLoader.DefaultEnvironmentValidator ??= new EnvironmentKeyValidator();
        var result = root.Parse(args);
        if (result.Errors.Count > 0)
        {
            foreach (var error in result.Errors) Console.Error.WriteLine($"error: {error.Message}");
            Console.Error.WriteLine("Run 'hybridrl --help' for usage.");
            return ExitCodes.InvalidInput;
        }
        try
        {
            // The default handler would print every exception as a crash and return 1; the known ones are mapped below.
            return result.Invoke(new InvocationConfiguration { EnableDefaultExceptionHandler = false });
        }
        catch (Exception ex) when (IsInvalidInput(ex))
        {
            Console.Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.InvalidInput;
        }
        catch (Exception ex) when (ex is TorchUnavailableException or CheckpointCorruptException or InvalidDataException or RunLockedException or ExecutorException
            or ExternalEnvironmentException)
        {
            Console.Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.Failure;
        }
        catch (Exception ex)
        {
            Console.Error.WriteLine($"error: unexpected failure: {ex}");
            return ExitCodes.Failure;
        }
    }

    /// <summary>Errors that mean "your input is wrong": bad config, sweep file, environment or model settings, missing files.</summary>
    public static bool IsInvalidInput(Exception ex) => ex is ConfigException or EnvironmentConfigException or ModelConfigurationException
        or SweepFileException or FileNotFoundException or DirectoryNotFoundException;
}
