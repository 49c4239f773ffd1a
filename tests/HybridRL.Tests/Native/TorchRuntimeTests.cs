using HybridRL.Native;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Tests.Native;

public class TorchRuntimeTests
{
    [Fact]
    public void NativeLibraryLoadsAndReportsTheCompatibilityFix()
    {
        var status = TorchRuntime.EnsureLoaded();
        Assert.True(status.Loaded, status.Message);
        // On a host without GLIBCXX_3.4.32 the build must have produced and the loader applied the shim.
        if (!status.HostHasGlibcxx3432) Assert.True(status.CompatibilityFixApplied, status.Message);
    }

    [Fact]
    public void BackwardAndAdamStepGiveHandComputedValues()
    {
        TorchRuntime.EnsureLoaded();
        // f(w) = sum((w * x - y)^2), x = [1, 2], y = [3, 5], w = 1: gradient 2(wx - y)x = [-4, -12].
        // Hand-worked; Adam's first step moves each weight by -lr * sign(g) (Kingma & Ba 2015, §2:
        // with bias correction m̂ = g and v̂ = g², so the step is lr * g / (|g| + eps)).
        using var w = new TorchSharp.Modules.Parameter(tensor(new[] { 1.0, 1.0 }, dtype: float64));
        using var x = tensor(new[] { 1.0, 2.0 }, dtype: float64);
        using var y = tensor(new[] { 3.0, 5.0 }, dtype: float64);
        var opt = optim.Adam([w], lr: 0.1);
        using var loss = (w * x - y).pow(2).sum();
        loss.backward();
        var g = w.grad!.data<double>().ToArray();
        Assert.Equal(-4.0, g[0], 12);
        Assert.Equal(-12.0, g[1], 12);
        opt.step();
        var after = w.data<double>().ToArray();
        Assert.Equal(1.1, after[0], 6);
        Assert.Equal(1.1, after[1], 6);
    }

    [Fact]
    public void LinearLayerForwardMatchesMatrixProduct()
    {
        TorchRuntime.EnsureLoaded();
        using var layer = nn.Linear(3, 2, dtype: float64);
        using var input = tensor(new[] { 0.5, -1.0, 2.0 }, dtype: float64).reshape(1, 3);
        using var output = layer.forward(input);
        var wt = layer.weight!.data<double>().ToArray();
        var b = layer.bias!.data<double>().ToArray();
        var o = output.data<double>().ToArray();
        for (int i = 0; i < 2; i++)
        {
            double expected = b[i] + wt[i * 3] * 0.5 - wt[i * 3 + 1] + wt[i * 3 + 2] * 2.0; // y = W x + b, by definition
            Assert.Equal(expected, o[i], 12);
        }
    }
}
