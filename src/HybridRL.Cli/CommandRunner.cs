using System.CommandLine;
using HybridRL.Native;

namespace HybridRL.Cli;

/// <summary>Parses and runs a command line; maps known failures to HybridRL's exit codes with one clear message.</summary>
public static class CommandRunner
{
    public static int Invoke(RootCommand root, string[] args)
    {
        var result = root.Parse(args);
        if (result.Errors.Count > 0)
        {
            foreach (var error in result.Errors) Console.Error.WriteLine($"error: {error.Message}");
            Console.Error.WriteLine("Run 'hybridrl --help' for usage.");
            return ExitCodes.InvalidInput;
        }
        try
        {
            return result.Invoke();
        }
        catch (TorchUnavailableException ex)
        {
            Console.Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.Failure;
        }
    }
}
