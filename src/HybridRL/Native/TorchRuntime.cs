using System.Runtime.InteropServices;
using TorchSharp;

namespace HybridRL.Native;

/// <summary>
/// Loads TorchSharp's native library once per process, applying the libstdc++ compatibility shim
/// built by build/TorchSharpCompat.targets when the host lacks GLIBCXX_3.4.32, and fixes TorchSharp's
/// own thread pools to one thread: HybridRL owns the cores (see DESIGN.md, Performance).
/// </summary>
public static class TorchRuntime
{
    /// <summary>File name of the shim that defines std::ios_base_library_init().</summary>
    public const string ShimFileName = "libhybridrl_iosinit.so";

    private const int RtldNow = 0x002;
    private const int RtldGlobal = 0x100;
    private static readonly object Gate = new();
    private static TorchRuntimeStatus? _status;

    /// <summary>Loads the native library if not yet loaded; throws <see cref="TorchUnavailableException"/> with a clear explanation.</summary>
    public static TorchRuntimeStatus EnsureLoaded()
    {
        var status = Probe();
        if (!status.Loaded) throw new TorchUnavailableException(status.Message);
        return status;
    }

    /// <summary>Attempts the load once and reports what happened, without throwing.</summary>
    public static TorchRuntimeStatus Probe()
    {
        lock (Gate)
        {
            return _status ??= Load();
        }
    }

    private static TorchRuntimeStatus Load()
    {
        bool hostHasTag = HostLibstdcxxHasGlibcxx3432(out string? hostLib);
        bool shimApplied = false;
        string? shimError = null;
        if (OperatingSystem.IsLinux() && !hostHasTag)
        {
            string shim = Path.Combine(AppContext.BaseDirectory, ShimFileName);
            if (File.Exists(shim))
            {
                IntPtr h = DlOpen(shim, RtldNow | RtldGlobal, out shimError);
                shimApplied = h != IntPtr.Zero;
            }
            else
            {
                shimError = $"the compatibility shim {shim} is missing (it is built with g++ during 'dotnet build')";
            }
        }

        try
        {
            torch.set_num_threads(1);
            using var probe = torch.ones(2, 2, dtype: torch.float64);
            double sum = probe.sum().item<double>();
            if (sum != 4.0) throw new InvalidOperationException($"native tensor library returned {sum} for the sum of a 2x2 ones tensor");
            return new TorchRuntimeStatus(true, hostHasTag, shimApplied, hostLib,
                $"TorchSharp native library loaded (libtorch CPU){(shimApplied ? "; libstdc++ compatibility fix applied" : "")}");
        }
        catch (Exception ex)
        {
            string root = Innermost(ex).Message;
            string fix = hostHasTag
                ? "Check that the TorchSharp-cpu package restored completely (runtimes/linux-x64/native next to the program)."
                : "This host's libstdc++ lacks GLIBCXX_3.4.32 (GCC 13). Rebuild with 'dotnet build' on this machine with g++ installed, " +
                  "so the build marks that requirement weak in libLibTorchSharp.so and compiles " + ShimFileName +
                  " (see README, Platform notes)" + (shimError is null ? "." : $"; shim problem: {shimError}.");
            return new TorchRuntimeStatus(false, hostHasTag, shimApplied, hostLib,
                $"The native tensor library (TorchSharp/libtorch) could not be loaded: {FirstLine(root)}. {fix}");
        }
    }

    private static Exception Innermost(Exception ex)
    {
        while (ex.InnerException is not null) ex = ex.InnerException;
        return ex;
    }

    private static string FirstLine(string s)
    {
        int i = s.IndexOf('\n');
        return i < 0 ? s : s[..i];
    }

    /// <summary>Whether the libstdc++ this process would load exports version GLIBCXX_3.4.32.</summary>
    public static bool HostLibstdcxxHasGlibcxx3432(out string? path)
    {
        path = null;
        if (!OperatingSystem.IsLinux()) return true;
        string[] candidates =
        [
            "/lib/x86_64-linux-gnu/libstdc++.so.6", "/usr/lib/x86_64-linux-gnu/libstdc++.so.6",
            "/usr/lib64/libstdc++.so.6", "/lib64/libstdc++.so.6", "/usr/lib/libstdc++.so.6",
        ];
        foreach (var c in candidates)
        {
            if (!File.Exists(c)) continue;
            path = c;
            byte[] bytes = File.ReadAllBytes(c);
            return bytes.AsSpan().IndexOf("GLIBCXX_3.4.32\0"u8) >= 0;
        }
        return true;
    }

    private static IntPtr DlOpen(string path, int flags, out string? error)
    {
        error = null;
        try
        {
            IntPtr h = LibDl.dlopen(path, flags);
            if (h == IntPtr.Zero) error = Marshal.PtrToStringAnsi(LibDl.dlerror());
            return h;
        }
        catch (DllNotFoundException)
        {
            IntPtr h = LibC.dlopen(path, flags);
            if (h == IntPtr.Zero) error = Marshal.PtrToStringAnsi(LibC.dlerror());
            return h;
        }
    }

    private static class LibDl
    {
        [DllImport("libdl.so.2", CharSet = CharSet.Ansi)]
        public static extern IntPtr dlopen(string fileName, int flags);

        [DllImport("libdl.so.2")]
        public static extern IntPtr dlerror();
    }

    private static class LibC
    {
        [DllImport("libc", CharSet = CharSet.Ansi)]
        public static extern IntPtr dlopen(string fileName, int flags);

        [DllImport("libc")]
        public static extern IntPtr dlerror();
    }
}
