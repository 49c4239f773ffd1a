namespace HybridRL.Experiments.Executors;

/// <summary>POSIX shell quoting for generated scripts.</summary>
public static class ShellQuoting
{
    /// <summary>One word, single-quoted unless it holds only safe characters.</summary>
    public static string Quote(string word)
    {
        if (word.Length > 0 && word.All(c => char.IsAsciiLetterOrDigit(c) || "-_./=:,+@%".Contains(c))) return word;
        return "'" + word.Replace("'", "'\\''") + "'";
    }

    /// <summary>An argument vector as one shell command line.</summary>
    public static string Join(IEnumerable<string> argv) => string.Join(" ", argv.Select(Quote));
}
