using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Tests.Models;

public class MpsCompressorTests
{
    private static MpsCompressor Build(int n, int chi, int d, SiteFeatureMap map, ulong seed, double middleNoise = 0.0)
    {
        TorchRuntime.EnsureLoaded();
        var mps = new MpsCompressor(n, chi, d, map, new RandomStream(seed));
        if (middleNoise > 0)
        {
            // Move the sites well away from the near-identity start so the test exercises a generic network.
            var rng = new RandomStream(seed + 99);
            using var _ = no_grad();
            var s = HybridRLTestAccess.Flat(mps.Sites);
            for (int i = 0; i < s.Length; i++) s[i] += middleNoise * rng.NextGaussian();
            mps.Sites.copy_(tensor(s, mps.Sites.shape, dtype: float64));
        }
        return mps;
    }

    private static double[] RandomInputs(int count, ulong seed, double lo, double hi)
    {
        var r = new RandomStream(seed);
        return Enumerable.Range(0, count).Select(_ => lo + (hi - lo) * r.NextDouble()).ToArray();
    }

    [Theory]
    [InlineData(5, 3, 2, SiteFeatureMap.Trigonometric)]
    [InlineData(4, 2, 3, SiteFeatureMap.Linear)]
    [InlineData(1, 2, 2, SiteFeatureMap.Trigonometric)]
    [InlineData(2, 3, 1, SiteFeatureMap.Linear)]
    public void OutputEqualsExplicitDenseContraction(int n, int chi, int d, SiteFeatureMap map)
    {
        var mps = Build(n, chi, d, map, 11, middleNoise: 0.5);
        const int batch = 3;
        var x = RandomInputs(batch * n, 5, -1.0, 1.5);
        using var input = tensor(x, [batch, n], dtype: float64);
        using var y = mps.Forward(input);
        var yt = HybridRLTestAccess.Flat(y);
        var flat = HybridRLTestAccess.Flat(mps.Weights);
        var row = new double[d];
        var scratch = new double[mps.ScratchSize];
        for (int b = 0; b < batch; b++)
        {
            var xb = x.AsSpan(b * n, n).ToArray();
            var expected = MpsReference.Output(mps, xb); // dense contraction with MathNet.Numerics matrices
            mps.ForwardRow(flat, xb, row, scratch);
            for (int k = 0; k < d; k++)
            {
                Assert.Equal(expected[k], yt[b * d + k], 12);
                Assert.Equal(expected[k], row[k], 12);
            }
        }
    }

    [Fact]
    public void ParameterCountMatchesFormula()
    {
        var mps = Build(100, 16, 6, SiteFeatureMap.Trigonometric, 1);
        // (N-1) sites × 2 × χ² plus the middle 2 × d × χ² (hand count).
        Assert.Equal(99 * 2 * 256 + 2 * 6 * 256, mps.ParameterCount);
        Assert.Equal(mps.ParameterCount, MpsCompressor.CountParameters(100, 16, 6));
    }

    [Fact]
    public void LongChainStaysFiniteAndBounded()
    {
        // 400 sites: an unnormalised product of 200 matrices of norm ~√χ·1.1 would reach ~10^100 or vanish.
        var mps = Build(400, 8, 4, SiteFeatureMap.Linear, 3, middleNoise: 0.3);
        const int batch = 4;
        var x = RandomInputs(batch * 400, 8, -3.0, 3.0);
        using var input = tensor(x, [batch, 400], dtype: float64);
        using var y = mps.Forward(input);
        var yt = HybridRLTestAccess.Flat(y);
        var flat = HybridRLTestAccess.Flat(mps.Weights);
        var row = new double[4];
        var scratch = new double[mps.ScratchSize];
        for (int b = 0; b < batch; b++)
        {
            double xm = x[b * 400 + mps.MiddleSite];
            // Cauchy–Schwarz: |y| ≤ √d · ‖φ(x_m)‖ because ‖C/‖C‖‖ = 1 (derived from the definition).
            double bound = Math.Sqrt(4) * Math.Sqrt(1 + xm * xm);
            double norm = Math.Sqrt(Enumerable.Range(0, 4).Sum(k => yt[b * 4 + k] * yt[b * 4 + k]));
            Assert.True(double.IsFinite(norm) && norm > 1e-6 && norm <= bound + 1e-12, $"row {b}: |y| = {norm}, bound {bound}");
            mps.ForwardRow(flat, x.AsSpan(b * 400, 400), row, scratch);
            for (int k = 0; k < 4; k++) Assert.Equal(yt[b * 4 + k], row[k], 10); // tree vs sequential sweep, same function
        }
    }

    [Fact]
    public void GradientsMatchCentralFiniteDifferences()
    {
        var mps = Build(7, 3, 2, SiteFeatureMap.Trigonometric, 21, middleNoise: 0.4);
        const int batch = 2;
        var x = RandomInputs(batch * 7, 9, -1, 1);
        var weights = new[] { 0.7, -1.3, 0.4, 2.0 };
        using var w = tensor(weights, [batch, 2], dtype: float64);
        using var input = tensor(x, [batch, 7], dtype: float64).requires_grad_(true);
        using (var loss = (mps.Forward(input) * w).sum()) loss.backward();
        var gAll = HybridRLTestAccess.Flat(mps.Weights.grad!);
        var gInput = HybridRLTestAccess.Flat(input.grad!);

        var flat = HybridRLTestAccess.Flat(mps.Weights);
        var scratch = new double[mps.ScratchSize];
        var row = new double[2];
        double Loss(double[] p, double[] xx)
        {
            double s = 0;
            for (int b = 0; b < batch; b++)
            {
                mps.ForwardRow(p, xx.AsSpan(b * 7, 7), row, scratch);
                s += weights[b * 2] * row[0] + weights[b * 2 + 1] * row[1];
            }
            return s;
        }
        const double h = 1e-6;
        // Central difference, error O(h²) (any numerical analysis text, e.g. Nocedal & Wright 2006 §8.1).
        var rng = new RandomStream(4);
        for (int t = 0; t < 25; t++)
        {
            int j = rng.NextInt(flat.Length);
            var plus = (double[])flat.Clone(); plus[j] += h;
            var minus = (double[])flat.Clone(); minus[j] -= h;
            double fd = (Loss(plus, x) - Loss(minus, x)) / (2 * h);
            double analytic = gAll[j];
            Assert.True(Math.Abs(fd - analytic) <= 1e-7 * (1 + Math.Abs(fd)), $"param {j}: fd {fd}, autograd {analytic}");
        }
        for (int j = 0; j < x.Length; j++)
        {
            var plus = (double[])x.Clone(); plus[j] += h;
            var minus = (double[])x.Clone(); minus[j] -= h;
            double fd = (Loss(flat, plus) - Loss(flat, minus)) / (2 * h);
            Assert.True(Math.Abs(fd - gInput[j]) <= 1e-7 * (1 + Math.Abs(fd)), $"input {j}: fd {fd}, autograd {gInput[j]}");
        }
    }
}
