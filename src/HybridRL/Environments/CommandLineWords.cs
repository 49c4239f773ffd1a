using System.Text;

namespace HybridRL.Environments;

/// <summary>
/// Splits a command line into words: whitespace separates words; single quotes keep text literally; double quotes
/// group words and allow backslash escapes of <c>"</c> and <c>\</c>. No shell is involved (no variables, globs or pipes).
/// </summary>
internal static class CommandLineWords
{
    public static IReadOnlyList<string> Split(string command)
    {
        var words = new List<string>();
        var sb = new StringBuilder();
        bool inWord = false;
        for (int i = 0; i < command.Length; i++)
        {
            char c = command[i];
            if (char.IsWhiteSpace(c))
            {
                if (inWord) { words.Add(sb.ToString()); sb.Clear(); inWord = false; }
                continue;
            }
            inWord = true;
            if (c == '\'')
            {
                int end = command.IndexOf('\'', i + 1);
                if (end < 0) throw new FormatException("unclosed single quote in command");
                sb.Append(command, i + 1, end - i - 1);
                i = end;
            }
            else if (c == '"')
            {
                i++;
                while (true)
                {
                    if (i >= command.Length) throw new FormatException("unclosed double quote in command");
                    char d = command[i];
                    if (d == '"') break;
                    if (d == '\\' && i + 1 < command.Length && (command[i + 1] == '"' || command[i + 1] == '\\')) { sb.Append(command[i + 1]); i += 2; continue; }
                    sb.Append(d);
                    i++;
                }
            }
            else sb.Append(c);
        }
        if (inWord) words.Add(sb.ToString());
        return words;
    }
}
