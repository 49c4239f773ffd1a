using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using static TorchSharp.torch;

namespace HybridRL.Tests.Models;

public class ClassicalModelTests
{
    [Fact]
    public void ForwardMatchesHandComputedNetworkAndPopulationIsBitExact()
    {
        TorchRuntime.EnsureLoaded();
        var settings = new ModelSettings { Kind = ModelKind.Classical, Classical = new ClassicalSettings { Hidden = [4, 3], Activation = Activation.Relu } };
        using var model = ModelFactory.Create(settings, 2, 2, 4);
        // Hand count: 2·4+4 + 4·3+3 + 3·2+2 = 35.
        Assert.Equal(35, model.ParameterCount);
        var flat = new double[35];
        model.GetFlat(flat);
        var x = new[] { 0.3, -0.8 };
        // y = W3 relu(W2 relu(W1 x + b1) + b2) + b3, by definition, written out with MathNet.Numerics matrices.
        var m = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build;
        var v = MathNet.Numerics.LinearAlgebra.Vector<double>.Build;
        int o = 0;
        var h = v.DenseOfArray(x);
        foreach (var (i, j, act) in new[] { (2, 4, true), (4, 3, true), (3, 2, false) })
        {
            var w = m.Dense(j, i, (r, c) => flat[o + r * i + c]);
            var b = v.DenseOfArray(flat.AsSpan(o + i * j, j).ToArray());
            o += i * j + j;
            h = w * h + b;
            if (act) h = h.Map(z => Math.Max(0, z));
        }
        using var y = model.Forward(tensor(x, [1, 2], dtype: float64));
        var yt = HybridRLTestAccess.Flat(y);
        var yn = new double[2];
        model.ForwardNoGrad(x, 1, yn);
        for (int a = 0; a < 2; a++)
        {
            Assert.Equal(h[a], yt[a], 12);
            Assert.Equal(h[a], yn[a], 12);
        }
        var rng = new RandomStream(3);
        var members = Enumerable.Range(0, 3 * 35).Select(_ => rng.NextGaussian()).ToArray();
        var obs = Enumerable.Range(0, 6).Select(_ => rng.NextGaussian()).ToArray();
        var pop = new double[6];
        model.PopulationForward(members, obs, 3, pop);
        for (int k = 0; k < 3; k++)
        {
            model.SetFlat(members.AsSpan(k * 35, 35));
            model.ForwardNoGrad(obs.AsSpan(k * 2, 2), 1, yn);
            Assert.Equal(yn, pop.AsSpan(k * 2, 2).ToArray());
        }
        Assert.Null(model.Counters);
    }
}
