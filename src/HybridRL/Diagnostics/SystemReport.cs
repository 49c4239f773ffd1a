using System.Reflection;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using HybridRL.Native;

namespace HybridRL.Diagnostics;

/// <summary>What a user needs to know about a new node before running on it (`hybridrl about`).</summary>
public sealed record SystemReport(
    string HybridRLVersion,
    string DotNetVersion,
    string OperatingSystem,
    string Architecture,
    int CoreCount,
    bool Vector256Accelerated,
    bool Vector512Accelerated,
    bool Avx2,
    bool Fma,
    string TorchSharpVersion,
    TorchRuntimeStatus Torch,
    string? SbatchPath)
{
    public static SystemReport Collect()
    {
        var torch = TorchRuntime.Probe();
        return new SystemReport(
            typeof(SystemReport).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion?.Split('+')[0] ?? "unknown",
            RuntimeInformation.FrameworkDescription,
            RuntimeInformation.OSDescription,
            RuntimeInformation.ProcessArchitecture.ToString(),
            Environment.ProcessorCount,
            Vector256.IsHardwareAccelerated,
            Vector512.IsHardwareAccelerated,
            System.Runtime.Intrinsics.X86.Avx2.IsSupported,
            System.Runtime.Intrinsics.X86.Fma.IsSupported,
            typeof(TorchSharp.torch).Assembly.GetName().Version?.ToString() ?? "unknown",
            torch,
            FindOnPath("sbatch"));
    }

    /// <summary>Full path of an executable found on PATH, or null.</summary>
    public static string? FindOnPath(string name)
    {
        string? path = Environment.GetEnvironmentVariable("PATH");
        if (string.IsNullOrEmpty(path)) return null;
        foreach (var dir in path.Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
        {
            string candidate = Path.Combine(dir, name);
            if (File.Exists(candidate)) return candidate;
        }
        return null;
    }

    /// <summary>Human-readable lines, one fact each.</summary>
    public IEnumerable<string> ToLines()
    {
        yield return $"hybridrl            {HybridRLVersion}";
        yield return $".NET                {DotNetVersion}";
        yield return $"system              {OperatingSystem} ({Architecture})";
        yield return $"cores               {CoreCount}";
        yield return $"SIMD                Vector256 {(Vector256Accelerated ? "yes" : "no")}, Vector512 {(Vector512Accelerated ? "yes" : "no")}, AVX2 {(Avx2 ? "yes" : "no")}, FMA {(Fma ? "yes" : "no")}";
        yield return $"TorchSharp          {TorchSharpVersion}";
        yield return $"tensor library      {(Torch.Loaded ? "loaded" : "NOT loaded")}";
        yield return $"libstdc++ fix       {(Torch.HostHasGlibcxx3432 ? "not needed (host has GLIBCXX_3.4.32)" : Torch.CompatibilityFixApplied ? "applied (GLIBCXX_3.4.32 shim loaded)" : "needed but not applied")}";
        if (!Torch.Loaded) yield return $"  problem           {Torch.Message}";
        yield return $"sbatch              {SbatchPath ?? "not on PATH (Slurm submission unavailable; local sweeps still work)"}";
    }
}
