using System.Collections.Concurrent;
using System.Text;

namespace HybridRL.Experiments.Config;

/// <summary>Maps enum members to their snake_case configuration names (ProductZz ↔ product_zz).</summary>
public static class ChoiceNames
{
    private static readonly ConcurrentDictionary<Type, string[]> Cache = new();

    public static string ToName<T>(T value) where T : struct, Enum => ToSnake(value.ToString());

    /// <summary>All configuration names of an enum, in declaration order.</summary>
    public static IReadOnlyList<string> All<T>() where T : struct, Enum =>
        Cache.GetOrAdd(typeof(T), _ => Enum.GetNames<T>().Select(ToSnake).ToArray());

    public static bool TryParse<T>(string name, out T value) where T : struct, Enum
    {
        foreach (var member in Enum.GetValues<T>())
        {
            if (string.Equals(ToSnake(member.ToString()), name, StringComparison.Ordinal))
            {
                value = member;
                return true;
            }
        }
        value = default;
        return false;
    }

    public static T Parse<T>(string name) where T : struct, Enum =>
        TryParse<T>(name, out var value) ? value : throw new ArgumentException($"'{name}' is not one of {string.Join(", ", All<T>())}");

    public static string ToSnake(string pascal)
    {
        var sb = new StringBuilder(pascal.Length + 4);
        for (var i = 0; i < pascal.Length; i++)
        {
            var c = pascal[i];
            if (char.IsUpper(c))
            {
                if (i > 0) sb.Append('_');
                sb.Append(char.ToLowerInvariant(c));
            }
            else sb.Append(c);
        }
        return sb.ToString();
    }
}
