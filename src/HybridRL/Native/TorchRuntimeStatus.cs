namespace HybridRL.Native;

/// <summary>Outcome of loading the native tensor library.</summary>
/// <param name="Loaded">Tensors can be created.</param>
/// <param name="HostHasGlibcxx3432">The host libstdc++ already exports GLIBCXX_3.4.32 (no fix needed).</param>
/// <param name="CompatibilityFixApplied">The ios_base_library_init shim was loaded globally.</param>
/// <param name="HostLibstdcxx">Path of the host libstdc++ inspected, when found.</param>
/// <param name="Message">One-line human explanation.</param>
public sealed record TorchRuntimeStatus(bool Loaded, bool HostHasGlibcxx3432, bool CompatibilityFixApplied, string? HostLibstdcxx, string Message);
