using Serilog;
using Serilog.Core;
using Serilog.Events;
using Serilog.Formatting.Compact;

namespace HybridRL.Logging;

/// <summary>Console verbosity chosen by --verbose / --quiet.</summary>
public enum Verbosity
{
    Quiet,
    Normal,
    Verbose,
}

/// <summary>
/// Builds HybridRL's Serilog loggers: a human-readable console (to stderr, so stdout stays for
/// results) and, per run, a compact JSON file in the run folder.
/// </summary>
public static class LogSetup
{
    public static LogEventLevel ConsoleLevel(Verbosity v) => v switch
    {
        Verbosity.Quiet => LogEventLevel.Warning,
        Verbosity.Verbose => LogEventLevel.Debug,
        _ => LogEventLevel.Information,
    };

    /// <summary>The process-wide console logger.</summary>
    public static Logger CreateConsole(Verbosity verbosity) =>
        new LoggerConfiguration()
            .MinimumLevel.Is(ConsoleLevel(verbosity))
            .WriteTo.Console(
                outputTemplate: "{Timestamp:HH:mm:ss} {Level:u3} {Message:lj}{NewLine}{Exception}",
                standardErrorFromLevel: LogEventLevel.Verbose)
            .CreateLogger();

    /// <summary>A logger that writes to the console and to a compact JSON log file (one event per line).</summary>
    public static Logger CreateForRun(Verbosity verbosity, string jsonLogPath) =>
        new LoggerConfiguration()
            .MinimumLevel.Debug()
            .WriteTo.Logger(console => console
                .Filter.ByExcluding(e => e.Properties.ContainsKey(ProgressProperty))
                .WriteTo.Console(
                    outputTemplate: "{Timestamp:HH:mm:ss} {Level:u3} {Message:lj}{NewLine}{Exception}",
                    restrictedToMinimumLevel: ConsoleLevel(verbosity),
                    standardErrorFromLevel: LogEventLevel.Verbose))
            .WriteTo.File(new CompactJsonFormatter(), jsonLogPath, flushToDiskInterval: TimeSpan.FromSeconds(2))
            .CreateLogger();

    /// <summary>Marks progress-line events: they go to the JSON log only (the progress reporter draws them on the console).</summary>
    public const string ProgressProperty = "ProgressLine";
}
