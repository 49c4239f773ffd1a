using System.CommandLine;
using HybridRL.Logging;

namespace HybridRL.Cli;

/// <summary>Options every command accepts.</summary>
public static class GlobalOptions
{
    public static readonly Option<bool> Verbose = new("--verbose", "-v")
    {
        Description = "Show debug messages on the console.",
        Recursive = true,
    };

    public static readonly Option<bool> Quiet = new("--quiet", "-q")
    {
        Description = "Show only warnings and errors on the console.",
        Recursive = true,
    };

    public static Verbosity VerbosityOf(ParseResult result) =>
        result.GetValue(Verbose) ? Verbosity.Verbose : result.GetValue(Quiet) ? Verbosity.Quiet : Verbosity.Normal;
}
