using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using static TorchSharp.torch;

namespace HybridRL.Tests.Models;

public class MpsCanonicalFormTests
{
    private static MpsCompressor Generic(int n, int chi, int d, ulong seed)
    {
        TorchRuntime.EnsureLoaded();
        var mps = new MpsCompressor(n, chi, d, SiteFeatureMap.Trigonometric, new RandomStream(seed));
        var rng = new RandomStream(seed + 7);
        using var _ = no_grad();
        var s = HybridRLTestAccess.Flat(mps.Sites);
        for (int i = 0; i < s.Length; i++) s[i] += 0.8 * rng.NextGaussian();
        mps.Sites.copy_(tensor(s, mps.Sites.shape, dtype: float64));
        return mps;
    }

    private static double[] Normalised(double[] v)
    {
        double n = Math.Sqrt(v.Sum(x => x * x));
        return v.Select(x => x / n).ToArray();
    }

    [Fact]
    public void SpectraAreSchmidtCoefficientsOfTheDenseState()
    {
        var mps = Generic(5, 3, 2, 1);
        var psi = Normalised(MpsReference.DenseState(mps));
        var spectra = MpsCanonicalForm.Analyse(mps);
        Assert.Equal(4, spectra.Count);
        // Schmidt coefficients across bond b = singular values of ψ reshaped to (left sites) × (right sites)
        // (Nielsen & Chuang §2.5); reference SVD from MathNet.Numerics.
        int[] dims = [2, 2, 4, 2, 2];
        for (int b = 0; b < 4; b++)
        {
            int rows = dims.Take(b + 1).Aggregate(1, (x, y) => x * y);
            int cols = psi.Length / rows;
            var mat = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(rows, cols, (r, c) => psi[r * cols + c]);
            var reference = mat.Svd(false).S.ToArray();
            var got = spectra[b].SingularValues;
            for (int k = 0; k < Math.Min(got.Length, reference.Length); k++) Assert.Equal(reference[k], got[k], 10);
            for (int k = got.Length; k < reference.Length; k++) Assert.True(reference[k] < 1e-10);
            double entropy = -reference.Where(s => s > 0).Sum(s => s * s * Math.Log(s * s));
            Assert.Equal(entropy, spectra[b].Entropy, 10);
        }
    }

    [Fact]
    public void TruncationErrorEqualsDiscardedWeight()
    {
        var mps = Generic(6, 4, 2, 2);
        var before = Normalised(MpsReference.DenseState(mps));
        var x = new[] { 0.1, -0.4, 0.9, 0.3, -0.2, 0.6 };
        var result = MpsCanonicalForm.Truncate(mps, 2);
        Assert.True(result.TotalDiscardedWeight > 1e-6, "the test needs a truncation that discards something");
        var after = MpsReference.DenseState(mps); // the written-back network, not renormalised
        double dist2 = before.Zip(after, (a, b) => (a - b) * (a - b)).Sum();
        // Eckart–Young (Eckart & Young 1936): the best rank-k approximation error is the sum of the squared
        // discarded singular values; in a right-to-left sweep from left-canonical form the per-bond errors are
        // mutually orthogonal, so they add (derived; cf. Schollwöck 2011 §4.5).
        Assert.Equal(result.TotalDiscardedWeight, dist2, 10);
        Assert.All(result.KeptBondDimensions, k => Assert.True(k <= 2));
        // The truncated compressor computes the function of the truncated state.
        var y = MpsReference.Output(mps, x);
        using var input = tensor(x, [1, 6], dtype: float64);
        using var yt = mps.Forward(input);
        var got = HybridRLTestAccess.Flat(yt);
        for (int k = 0; k < 2; k++) Assert.Equal(y[k], got[k], 10);
    }

    [Fact]
    public void CanonicalisationWithoutTruncationPreservesTheFunction()
    {
        var mps = Generic(5, 3, 2, 3);
        var x = new[] { 0.2, 0.5, -0.7, 0.1, 0.9 };
        using var input = tensor(x, [1, 5], dtype: float64);
        var before = HybridRLTestAccess.Flat(mps.Forward(input));
        var r = MpsCanonicalForm.Truncate(mps, 3);
        Assert.Equal(0.0, r.TotalDiscardedWeight, 12);
        var after = HybridRLTestAccess.Flat(mps.Forward(input));
        // Output is invariant to gauge and norm of the network (by construction, see MpsCompressor).
        for (int k = 0; k < 2; k++) Assert.Equal(before[k], after[k], 10);
    }
}
