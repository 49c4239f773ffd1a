using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Models;

/// <summary>
/// Direct span views over the memory of contiguous CPU float64 tensors, so values move between
/// TorchSharp and managed code without intermediate arrays.
/// </summary>
internal static class TensorMemory
{
    // TorchSharp's own binding of this native entry point is internal; the native function returns the
    // tensor's data pointer (storage offset applied), like at::Tensor::data_ptr().
    [System.Runtime.InteropServices.DllImport("LibTorchSharp")]
    private static extern IntPtr THSTensor_data(IntPtr handle);

    /// <summary>A writable view of a contiguous CPU float64 tensor's elements (valid while the tensor lives).</summary>
    public static unsafe Span<double> AsSpan(Tensor t)
    {
        if (t.dtype != ScalarType.Float64) throw new ArgumentException($"expected a float64 tensor, got {t.dtype}", nameof(t));
        if (t.device_type != DeviceType.CPU) throw new ArgumentException("expected a CPU tensor", nameof(t));
        if (!t.is_contiguous()) throw new ArgumentException("expected a contiguous tensor", nameof(t));
        long n = t.numel();
        if (n > int.MaxValue) throw new ArgumentException("tensor too large for a span", nameof(t));
        if (n == 0) return Span<double>.Empty;
        return new Span<double>((void*)THSTensor_data(t.Handle), (int)n);
    }

    /// <summary>A float64 parameter of the given shape filled from <paramref name="values"/>.</summary>
    public static TorchSharp.Modules.Parameter NewParameter(double[] values, params long[] shape)
    {
        var t = torch.tensor(values, shape, dtype: ScalarType.Float64);
        return new TorchSharp.Modules.Parameter(t, requires_grad: true);
    }
}
