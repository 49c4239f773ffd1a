using System.Runtime.CompilerServices;

namespace HybridRL.Tests.Sweeps;

/// <summary>A temporary folder for one test, and paths of the checked-in test data beside this source file.</summary>
public sealed class SweepTestFiles : IDisposable
{
    public SweepTestFiles(string? root = null)
    {
        Dir = Path.Combine(root ?? Path.GetTempPath(), "hybridrl-sweep-tests", Guid.NewGuid().ToString("N")[..12]);
        Directory.CreateDirectory(Dir);
        File.Copy(DataPath("base-experiment.yaml"), Path.Combine(Dir, "base-experiment.yaml"));
    }

    public string Dir { get; }

    /// <summary>Writes a file into the temp folder and returns its path.</summary>
    public string Write(string name, string text)
    {
        string path = Path.Combine(Dir, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    public static string DataPath(string name, [CallerFilePath] string here = "") => Path.Combine(Path.GetDirectoryName(here)!, "Data", name);

    public void Dispose()
    {
        try { Directory.Delete(Dir, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}
