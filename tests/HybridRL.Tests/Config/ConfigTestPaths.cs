namespace HybridRL.Tests.Config;

/// <summary>Locates the repository (configs/, the bad-case folder) and makes scratch folders for test files.</summary>
internal static class ConfigTestPaths
{
    public static string RepositoryRoot { get; } = FindRoot();

    public static string ConfigsFolder => Path.Combine(RepositoryRoot, "configs");

    /// <summary>The experiment files in configs/ (sorted); sweep files, named <c>*-sweep.yaml</c>, are not experiments.</summary>
    public static string[] ExperimentFiles() =>
        Directory.GetFiles(ConfigsFolder, "*.yaml").Where(f => !f.EndsWith("-sweep.yaml", StringComparison.Ordinal)).OrderBy(f => f, StringComparer.Ordinal).ToArray();

    /// <summary>A frozen small deep-Q experiment (test fixture) for tests that count its circuit and settings by hand.</summary>
    public static string SmallWarehouseDqn => Path.Combine(RepositoryRoot, "tests", "HybridRL.Tests", "Data", "warehouse-dqn-small.yaml");

    public static string BadCasesFolder => Path.Combine(RepositoryRoot, "tests", "HybridRL.Tests", "Config", "bad");

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "HybridRL.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("Repository root (HybridRL.sln) not found above " + AppContext.BaseDirectory);
    }
}

/// <summary>A temporary folder deleted on dispose.</summary>
internal sealed class ScratchFolder : IDisposable
{
    public ScratchFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "hybridrl-config-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string Write(string relative, string text)
    {
        var full = System.IO.Path.Combine(Path, relative);
        Directory.CreateDirectory(System.IO.Path.GetDirectoryName(full)!);
        File.WriteAllText(full, text);
        return full;
    }

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}
