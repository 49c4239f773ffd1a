using MathNet.Numerics.LinearAlgebra;
using TorchSharp;

namespace HybridRL.Models;

/// <summary>
/// Canonical-form diagnostics for <see cref="MpsCompressor"/>, by singular value decompositions
/// (MathNet.Numerics). The compressor's tensors, with the boundary vectors absorbed into the end sites and
/// the middle site's physical index s = p·d + k of size 2d, define a state |ψ⟩ on N sites. A left-to-right
/// sweep makes every site left-orthonormal (normalising the carried factor, so long chains cannot overflow),
/// then a right-to-left sweep of SVDs exposes at each bond the Schmidt coefficients of the unit-norm state
/// (Schollwöck 2011, Ann. Phys. 326, §4.4). Truncation keeps the largest coefficients during that sweep.
/// Because the compressor's output is invariant to the state's norm and gauge, the truncated compressor
/// computes the function of the truncated state.
/// </summary>
public static class MpsCanonicalForm
{
    /// <summary>Schmidt spectra and entropies of every bond (the compressor is not modified).</summary>
    public static IReadOnlyList<MpsBondSpectrum> Analyse(MpsCompressor mps)
        => Sweep(mps, int.MaxValue, writeBack: false).Spectra;

    /// <summary>
    /// Truncates every bond to at most <paramref name="maxBondDimension"/> Schmidt vectors and writes the
    /// truncated network back into the compressor (zero-padded to its bond dimension).
    /// </summary>
    public static MpsTruncationResult Truncate(MpsCompressor mps, int maxBondDimension)
    {
        if (maxBondDimension < 1) throw new ArgumentOutOfRangeException(nameof(maxBondDimension), maxBondDimension, "must keep at least one Schmidt vector");
        return Sweep(mps, maxBondDimension, writeBack: true);
    }

    /// <summary>Site tensor in [left, physical, right] row-major layout.</summary>
    private sealed class Site(int left, int phys, int right, double[] data)
    {
        public int Left = left, Phys = phys, Right = right;
        public double[] Data = data;
    }

    private static MpsTruncationResult Sweep(MpsCompressor mps, int maxBond, bool writeBack)
    {
        int n = mps.InputSize, chi = mps.BondDimension, d = mps.OutputSize, m = mps.MiddleSite, chi2 = chi * chi;
        var sitesFlat = TensorMemory.AsSpan(mps.Sites).ToArray();
        var middleFlat = TensorMemory.AsSpan(mps.Middle).ToArray();
        double bnd = mps.BoundaryValue;

        // Raw sites in [a, s, b] layout.
        var sites = new Site[n];
        for (int i = 0; i < n; i++)
        {
            int phys = i == m ? 2 * d : 2;
            var data = new double[chi * phys * chi];
            for (int s = 0; s < phys; s++)
                for (int a = 0; a < chi; a++)
                    for (int b = 0; b < chi; b++)
                        data[(a * phys + s) * chi + b] = i == m
                            ? middleFlat[(s * chi + a) * chi + b]
                            : sitesFlat[(((i < m ? i : i - 1) * 2 + s) * chi + a) * chi + b];
            sites[i] = new Site(chi, phys, chi, data);
        }
        // Absorb boundary vectors.
        sites[0] = ContractLeftVector(sites[0], bnd);
        sites[n - 1] = ContractRightVector(sites[n - 1], bnd);

        // Left-to-right: left-orthonormal sites, normalised carry.
        for (int i = 0; i + 1 < n; i++)
        {
            var t = sites[i];
            var mat = Matrix<double>.Build.Dense(t.Left * t.Phys, t.Right, (r, c) => t.Data[r * t.Right + c]);
            var svd = mat.Svd(computeVectors: true);
            int k = Math.Min(mat.RowCount, mat.ColumnCount);
            var u = svd.U.SubMatrix(0, mat.RowCount, 0, k);
            var carry = Matrix<double>.Build.DiagonalOfDiagonalVector(svd.S.SubVector(0, k)) * svd.VT.SubMatrix(0, k, 0, mat.ColumnCount);
            carry /= carry.FrobeniusNorm();
            sites[i] = FromMatrix(u, t.Left, t.Phys, k);
            sites[i + 1] = MultiplyLeft(carry, sites[i + 1]);
        }
        {
            var last = sites[n - 1];
            double norm = Math.Sqrt(last.Data.Sum(x => x * x));
            for (int j = 0; j < last.Data.Length; j++) last.Data[j] /= norm;
        }

        // Right-to-left: Schmidt spectra, optional truncation.
        var spectra = new MpsBondSpectrum[Math.Max(0, n - 1)];
        var kept = new int[Math.Max(0, n - 1)];
        var discarded = new double[Math.Max(0, n - 1)];
        for (int i = n - 1; i >= 1; i--)
        {
            var t = sites[i];
            var mat = Matrix<double>.Build.Dense(t.Left, t.Phys * t.Right, (r, c) => t.Data[r * t.Phys * t.Right + c]);
            var svd = mat.Svd(computeVectors: true);
            int k = Math.Min(mat.RowCount, mat.ColumnCount);
            var sv = svd.S.SubVector(0, k).ToArray();
            double entropy = 0;
            foreach (double s in sv)
            {
                double p = s * s;
                if (p > 0) entropy -= p * Math.Log(p);
            }
            spectra[i - 1] = new MpsBondSpectrum(i - 1, sv, entropy);
            int keep = Math.Min(k, maxBond);
            double lost = 0;
            for (int j = keep; j < k; j++) lost += sv[j] * sv[j];
            kept[i - 1] = keep;
            discarded[i - 1] = lost;
            var vt = svd.VT.SubMatrix(0, keep, 0, mat.ColumnCount);
            var us = svd.U.SubMatrix(0, mat.RowCount, 0, keep) * Matrix<double>.Build.DiagonalOfDiagonalVector(svd.S.SubVector(0, keep));
            sites[i] = new Site(keep, t.Phys, t.Right, vt.ToRowMajorArray());
            sites[i - 1] = MultiplyRight(sites[i - 1], us);
        }

        if (writeBack) WriteBack(mps, sites);
        return new MpsTruncationResult(spectra, kept, discarded);
    }

    private static Site ContractLeftVector(Site t, double value)
    {
        var data = new double[t.Phys * t.Right];
        for (int a = 0; a < t.Left; a++)
            for (int j = 0; j < t.Phys * t.Right; j++)
                data[j] += value * t.Data[a * t.Phys * t.Right + j];
        return new Site(1, t.Phys, t.Right, data);
    }

    private static Site ContractRightVector(Site t, double value)
    {
        var data = new double[t.Left * t.Phys];
        for (int r = 0; r < t.Left * t.Phys; r++)
        {
            double s = 0;
            for (int b = 0; b < t.Right; b++) s += t.Data[r * t.Right + b] * value;
            data[r] = s;
        }
        return new Site(t.Left, t.Phys, 1, data);
    }

    private static Site FromMatrix(Matrix<double> mat, int left, int phys, int right) => new(left, phys, right, mat.ToRowMajorArray());

    /// <summary>carry [k × Left] · site [Left × (Phys·Right)].</summary>
    private static Site MultiplyLeft(Matrix<double> carry, Site t)
    {
        var mat = Matrix<double>.Build.Dense(t.Left, t.Phys * t.Right, (r, c) => t.Data[r * t.Phys * t.Right + c]);
        var prod = carry * mat;
        return new Site(carry.RowCount, t.Phys, t.Right, prod.ToRowMajorArray());
    }

    /// <summary>site [(Left·Phys) × Right] · us [Right × k].</summary>
    private static Site MultiplyRight(Site t, Matrix<double> us)
    {
        var mat = Matrix<double>.Build.Dense(t.Left * t.Phys, t.Right, (r, c) => t.Data[r * t.Right + c]);
        var prod = mat * us;
        return new Site(t.Left, t.Phys, us.ColumnCount, prod.ToRowMajorArray());
    }

    private static void WriteBack(MpsCompressor mps, Site[] sites)
    {
        int n = mps.InputSize, chi = mps.BondDimension, d = mps.OutputSize, m = mps.MiddleSite;
        double bnd = mps.BoundaryValue;
        var sitesFlat = new double[(n - 1) * 2 * chi * chi];
        var middleFlat = new double[2 * d * chi * chi];
        for (int i = 0; i < n; i++)
        {
            var t = sites[i];
            if (t.Left > chi || t.Right > chi) throw new InvalidOperationException("canonical bond exceeds the compressor's bond dimension");
            for (int s = 0; s < t.Phys; s++)
                for (int a = 0; a < chi; a++)
                    for (int b = 0; b < chi; b++)
                    {
                        // End sites: boundary vectors l = r = bnd·1 satisfy lᵀl = rᵀr = 1, so A = l ⊗ T (or T ⊗ r) reproduces T.
                        double v;
                        if (i == 0 && i == n - 1) v = bnd * t.Data[s] * bnd;
                        else if (i == 0) v = b < t.Right ? bnd * t.Data[s * t.Right + b] : 0.0;
                        else if (i == n - 1) v = a < t.Left ? t.Data[a * t.Phys + s] * bnd : 0.0;
                        else v = a < t.Left && b < t.Right ? t.Data[(a * t.Phys + s) * t.Right + b] : 0.0;
                        if (i == m) middleFlat[(s * chi + a) * chi + b] = v;
                        else sitesFlat[(((i < m ? i : i - 1) * 2 + s) * chi + a) * chi + b] = v;
                    }
        }
        using var _ = torch.no_grad();
        sitesFlat.AsSpan().CopyTo(TensorMemory.AsSpan(mps.Sites));
        middleFlat.AsSpan().CopyTo(TensorMemory.AsSpan(mps.Middle));
    }
}
