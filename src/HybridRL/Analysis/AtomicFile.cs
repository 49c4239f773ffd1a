using System.Text;

namespace HybridRL.Analysis;

/// <summary>Writes files through a temporary name in the same folder and an atomic rename.</summary>
public static class AtomicFile
{
    public static void WriteAllText(string path, string text)
    {
        string tmp = TempName(path);
        File.WriteAllText(tmp, text, new UTF8Encoding(false));
        File.Move(tmp, path, overwrite: true);
    }

    /// <summary>Runs <paramref name="write"/> against a temporary path with the same extension, then renames it to <paramref name="path"/>.</summary>
    public static void Write(string path, Action<string> write)
    {
        string tmp = TempName(path);
        try
        {
            write(tmp);
            File.Move(tmp, path, overwrite: true);
        }
        finally
        {
            if (File.Exists(tmp)) File.Delete(tmp);
        }
    }

    private static string TempName(string path)
    {
        string dir = Path.GetDirectoryName(Path.GetFullPath(path))!;
        Directory.CreateDirectory(dir);
        return Path.Combine(dir, $".tmp-{Environment.ProcessId}-{Guid.NewGuid():N}{Path.GetExtension(path)}");
    }
}
