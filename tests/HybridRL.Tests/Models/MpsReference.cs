using HybridRL.Models;
using MathNet.Numerics.LinearAlgebra;

namespace HybridRL.Tests.Models;

/// <summary>
/// Explicit dense contractions of an <see cref="MpsCompressor"/> with MathNet.Numerics matrices, written
/// independently of the compressor's own code paths (reference for small N).
/// </summary>
internal static class MpsReference
{
    /// <summary>Site matrix A_i[p] (i ≠ middle) or B[s] (i = middle, s = p·d + k) as a MathNet matrix.</summary>
    public static Matrix<double> SiteMatrix(MpsCompressor mps, double[] sites, double[] middle, int i, int s)
    {
        int chi = mps.BondDimension, m = mps.MiddleSite;
        return Matrix<double>.Build.Dense(chi, chi, (a, b) => i == m
            ? middle[(s * chi + a) * chi + b]
            : sites[(((i < m ? i : i - 1) * 2 + s) * chi + a) * chi + b]);
    }

    /// <summary>The full state ψ[s_0,…,s_{N-1}] (s_0 most significant; middle site has 2d values), by one matrix product per configuration.</summary>
    public static double[] DenseState(MpsCompressor mps)
    {
        var sites = HybridRLTestAccess.Flat(mps.Sites);
        var middle = HybridRLTestAccess.Flat(mps.Middle);
        int n = mps.InputSize, chi = mps.BondDimension, d = mps.OutputSize, m = mps.MiddleSite;
        var dims = Enumerable.Range(0, n).Select(i => i == m ? 2 * d : 2).ToArray();
        int total = dims.Aggregate(1, (a, b) => a * b);
        var l = Vector<double>.Build.Dense(chi, mps.BoundaryValue);
        var r = Vector<double>.Build.Dense(chi, mps.BoundaryValue);
        var psi = new double[total];
        var idx = new int[n];
        for (int c = 0; c < total; c++)
        {
            int rem = c;
            for (int i = n - 1; i >= 0; i--) { idx[i] = rem % dims[i]; rem /= dims[i]; }
            var row = l.ToRowMatrix();
            for (int i = 0; i < n; i++) row = row * SiteMatrix(mps, sites, middle, i, idx[i]);
            psi[c] = (row * r.ToColumnMatrix())[0, 0];
        }
        return psi;
    }

    /// <summary>Compressor output for one input by contracting the dense state with the feature vectors.</summary>
    public static double[] Output(MpsCompressor mps, double[] x)
    {
        int n = mps.InputSize, d = mps.OutputSize, m = mps.MiddleSite;
        var psi = DenseState(mps);
        var dims = Enumerable.Range(0, n).Select(i => i == m ? 2 * d : 2).ToArray();
        var c = new double[2 * d];
        var idx = new int[n];
        for (int cfg = 0; cfg < psi.Length; cfg++)
        {
            int rem = cfg;
            for (int i = n - 1; i >= 0; i--) { idx[i] = rem % dims[i]; rem /= dims[i]; }
            double w = psi[cfg];
            for (int i = 0; i < n; i++) if (i != m) w *= Phi(mps.FeatureMap, x[i], idx[i]);
            c[idx[m]] += w;
        }
        double norm = Math.Sqrt(c.Sum(v => v * v));
        var y = new double[d];
        for (int k = 0; k < d; k++)
            y[k] = Math.Sqrt(d) * (Phi(mps.FeatureMap, x[m], 0) * c[k] + Phi(mps.FeatureMap, x[m], 1) * c[d + k]) / norm;
        return y;
    }

    public static double Phi(SiteFeatureMap map, double x, int p) => map == SiteFeatureMap.Trigonometric
        ? (p == 0 ? Math.Cos(Math.PI * x / 2) : Math.Sin(Math.PI * x / 2))
        : (p == 0 ? 1.0 : x);
}
