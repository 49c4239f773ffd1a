namespace HybridRL.Cli;

/// <summary>
/// Runs a command action and maps the analysis and estimation libraries' bad-input exceptions
/// (<see cref="InvalidDataException"/>, <see cref="ArgumentException"/>: they name the file, key or value) to exit code 2.
/// </summary>
public static class InputErrors
{
    public static int Guard(Func<int> action)
    {
        try
        {
            return action();
        }
        catch (Exception ex) when (ex is InvalidDataException or ArgumentException)
        {
            Console.Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.InvalidInput;
        }
    }
}
