using System.Numerics;
using MathNet.Numerics.Providers.LinearAlgebra;

namespace HybridRL.Training.Evolution;

/// <summary>
/// CMA-ES as in Hansen's tutorial (2016, "The CMA Evolution Strategy: A Tutorial", arXiv:1604.00772),
/// maximising fitness: λ = 4 + ⌊3 ln n⌋ by default, μ = ⌊λ/2⌋, positive log weights
/// wᵢ ∝ ln((λ+1)/2) − ln i, μ_eff, c_σ, d_σ, c_c, c₁, c_μ from Table 1; cumulation paths p_σ and p_c with
/// the h_σ stall, cumulative step-size adaptation and the rank-one plus rank-μ covariance update.
/// The full model keeps C = B D² Bᵀ and re-decomposes C (MathNet.Numerics managed symmetric EVD) only
/// when more than 1/((c₁+c_μ) n 10) generations have passed, as in the tutorial's reference code.
/// The diagonal model is separable CMA-ES (Ros &amp; Hansen 2008): C is diagonal, B = I, and the covariance
/// learning rates c₁, c_μ are multiplied by (n+2)/3.
/// </summary>
public sealed class CmaEvolutionStrategy : EvolutionStrategyBase
{
    private readonly CmaEsSettings _settings;
    private readonly double[] _weights;
    private readonly double[] _mean;
    private readonly double[] _pSigma;
    private readonly double[] _pC;
    private readonly double[] _c;      // full: n × n symmetric (row-major); diagonal: n
    private readonly double[] _b;      // full: n × n, column k = k-th eigenvector; diagonal: unused (empty)
    private readonly double[] _d;      // square roots of C's eigenvalues (diagonal: of C's diagonal)
    private readonly double[] _z;      // λ × n standard normal draws of the pending generation
    private readonly double[] _y;      // λ × n, y = B D z
    private readonly double[] _yw;
    private readonly double[] _zw;
    private readonly double[] _tmp;
    private readonly double[] _evdVectors;
    private readonly double[] _evdBlock;
    private readonly Complex[] _evdValues;
    private double _sigma;
    private int _eigenGeneration;

    public CmaEvolutionStrategy(CmaEsSettings settings, double[] initialParameters, ulong seed)
        : base(settings, initialParameters, PopulationOrThrow(settings, initialParameters), seed)
    {
        _settings = settings;
        int n = Dimension, lambda = PopulationSize;
        IsDiagonal = settings.UsesDiagonal(n);

        // Hansen 2016, Table 1 (positive weights only).
        Mu = lambda / 2;
        _weights = new double[Mu];
        double sum = 0;
        for (int i = 0; i < Mu; i++)
        {
            _weights[i] = Math.Log((lambda + 1) / 2.0) - Math.Log(i + 1);
            sum += _weights[i];
        }
        double sumSq = 0;
        for (int i = 0; i < Mu; i++)
        {
            _weights[i] /= sum;
            sumSq += _weights[i] * _weights[i];
        }
        MuEff = 1.0 / sumSq;
        CSigma = (MuEff + 2) / (n + MuEff + 5);
        DSigma = 1 + 2 * Math.Max(0, Math.Sqrt((MuEff - 1) / (n + 1)) - 1) + CSigma;
        Cc = (4 + MuEff / n) / (n + 4 + 2 * MuEff / n);
        const double alphaCov = 2;
        double c1 = alphaCov / ((n + 1.3) * (n + 1.3) + MuEff);
        double cMu = Math.Min(1 - c1, alphaCov * (MuEff - 2 + 1 / MuEff) / ((n + 2) * (n + 2) + alphaCov * MuEff / 2));
        if (IsDiagonal)
        {
            // Ros & Hansen 2008: the separable model may learn (n+2)/3 times faster.
            double f = (n + 2) / 3.0;
            c1 = Math.Min(1, c1 * f);
            cMu = Math.Min(1 - c1, cMu * f);
        }
        C1 = c1;
        CMu = cMu;
        // E‖N(0, I)‖ ≈ √n (1 − 1/(4n) + 1/(21n²)) (Hansen 2016, text after eq. 43).
        ExpectedGaussianNorm = Math.Sqrt(n) * (1 - 1.0 / (4 * n) + 1.0 / (21.0 * n * n));

        _mean = (double[])initialParameters.Clone();
        _sigma = settings.Sigma0;
        _pSigma = new double[n];
        _pC = new double[n];
        _d = new double[n];
        Array.Fill(_d, 1.0);
        if (IsDiagonal)
        {
            _c = new double[n];
            Array.Fill(_c, 1.0);
            _b = [];
            _evdVectors = [];
            _evdBlock = [];
            _evdValues = [];
        }
        else
        {
            _c = new double[checked(n * n)];
            _b = new double[n * n];
            for (int i = 0; i < n; i++) { _c[i * n + i] = 1; _b[i * n + i] = 1; }
            _evdVectors = new double[n * n];
            _evdBlock = new double[n * n];
            _evdValues = new Complex[n];
        }
        _z = new double[checked(lambda * n)];
        _y = new double[lambda * n];
        _yw = new double[n];
        _zw = new double[n];
        _tmp = new double[n];
    }

    private static int PopulationOrThrow(CmaEsSettings settings, double[] initialParameters)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(initialParameters);
        settings.Validate();
        if (initialParameters.Length == 0)
            throw new ArgumentException("initial parameter vector must not be empty", nameof(initialParameters));
        return settings.PopulationFor(initialParameters.Length);
    }

    public override EvolutionKind Kind => EvolutionKind.CmaEs;
    public override EvolutionSettings Settings => _settings;
    public override double StepSize => _sigma;
    public override ReadOnlySpan<double> Center => _mean;

    /// <summary>Whether the separable (diagonal covariance) model is in use.</summary>
    public bool IsDiagonal { get; }

    /// <summary>μ = ⌊λ/2⌋, the number of selected members.</summary>
    public int Mu { get; }

    /// <summary>Recombination weights w₁ ≥ … ≥ w_μ &gt; 0, summing to 1.</summary>
    public ReadOnlySpan<double> Weights => _weights;

    public double MuEff { get; }
    public double CSigma { get; }
    public double DSigma { get; }
    public double Cc { get; }
    public double C1 { get; }
    public double CMu { get; }

    /// <summary>E‖N(0, I)‖, the approximation used for step-size control.</summary>
    public double ExpectedGaussianNorm { get; }

    /// <summary>Evolution path for σ.</summary>
    public ReadOnlySpan<double> SigmaPath => _pSigma;

    /// <summary>Evolution path for C.</summary>
    public ReadOnlySpan<double> CovariancePath => _pC;

    /// <summary>B (row-major, column k = k-th eigenvector of C); empty in the diagonal model.</summary>
    internal ReadOnlySpan<double> EigenBasis => _b;

    /// <summary>D: square roots of C's eigenvalues (of its diagonal in the diagonal model).</summary>
    internal ReadOnlySpan<double> AxisLengths => _d;

    /// <summary>Entry (i, j) of the covariance matrix C (zero off the diagonal in the diagonal model).</summary>
    public double Covariance(int i, int j)
    {
        int n = Dimension;
        if ((uint)i >= (uint)n || (uint)j >= (uint)n) throw new ArgumentOutOfRangeException(i >= n || i < 0 ? nameof(i) : nameof(j));
        if (IsDiagonal) return i == j ? _c[i] : 0;
        return _c[i * n + j];
    }

    protected override void Sample(Span<double> members, Span<int> extraEpisodes)
    {
        int n = Dimension;
        for (int k = 0; k < PopulationSize; k++)
        {
            Span<double> z = _z.AsSpan(k * n, n);
            Span<double> y = _y.AsSpan(k * n, n);
            Span<double> x = members.Slice(k * n, n);
            for (int j = 0; j < n; j++) z[j] = Random.NextGaussian();
            if (IsDiagonal)
            {
                for (int i = 0; i < n; i++) y[i] = _d[i] * z[i];
            }
            else
            {
                for (int j = 0; j < n; j++) _tmp[j] = _d[j] * z[j];
                for (int i = 0; i < n; i++)
                {
                    double s = 0;
                    int row = i * n;
                    for (int j = 0; j < n; j++) s += _b[row + j] * _tmp[j];
                    y[i] = s;
                }
            }
            for (int i = 0; i < n; i++) x[i] = _mean[i] + _sigma * y[i];
        }
    }

    protected override void Update(ReadOnlySpan<double> fitness, ReadOnlySpan<int> order)
    {
        int n = Dimension;
        int generationNumber = Generation + 1;

        // Selection and recombination (Hansen 2016, eqs. 39–41, c_m = 1).
        Array.Clear(_yw);
        Array.Clear(_zw);
        for (int r = 0; r < Mu; r++)
        {
            double w = _weights[r];
            int k = order[r];
            ReadOnlySpan<double> y = _y.AsSpan(k * n, n);
            ReadOnlySpan<double> z = _z.AsSpan(k * n, n);
            for (int i = 0; i < n; i++)
            {
                _yw[i] += w * y[i];
                _zw[i] += w * z[i];
            }
        }
        for (int i = 0; i < n; i++) _mean[i] += _sigma * _yw[i];

        // Step-size path (eq. 43): C^{-1/2} y_w = B D⁻¹ Bᵀ B D z_w = B z_w.
        double csn = Math.Sqrt(CSigma * (2 - CSigma) * MuEff);
        if (IsDiagonal)
        {
            for (int i = 0; i < n; i++) _pSigma[i] = (1 - CSigma) * _pSigma[i] + csn * _zw[i];
        }
        else
        {
            for (int i = 0; i < n; i++)
            {
                double s = 0;
                int row = i * n;
                for (int j = 0; j < n; j++) s += _b[row + j] * _zw[j];
                _pSigma[i] = (1 - CSigma) * _pSigma[i] + csn * s;
            }
        }
        double normPSigma = 0;
        for (int i = 0; i < n; i++) normPSigma += _pSigma[i] * _pSigma[i];
        normPSigma = Math.Sqrt(normPSigma);

        // h_σ stall of the rank-one path (text after eq. 45).
        double hSigmaThreshold = (1.4 + 2.0 / (n + 1)) * ExpectedGaussianNorm;
        bool hSigma = normPSigma / Math.Sqrt(1 - Math.Pow(1 - CSigma, 2.0 * generationNumber)) < hSigmaThreshold;
        double ccn = hSigma ? Math.Sqrt(Cc * (2 - Cc) * MuEff) : 0;
        for (int i = 0; i < n; i++) _pC[i] = (1 - Cc) * _pC[i] + ccn * _yw[i];

        // Covariance update (eq. 47 with positive weights, Σw = 1; δ(h_σ) = (1 − h_σ) c_c (2 − c_c)).
        double delta = hSigma ? 0 : Cc * (2 - Cc);
        double keep = 1 + C1 * delta - C1 - CMu;
        if (IsDiagonal)
        {
            for (int i = 0; i < n; i++)
            {
                double rankMu = 0;
                for (int r = 0; r < Mu; r++)
                {
                    double yi = _y[order[r] * n + i];
                    rankMu += _weights[r] * yi * yi;
                }
                _c[i] = keep * _c[i] + C1 * _pC[i] * _pC[i] + CMu * rankMu;
            }
        }
        else
        {
            for (int i = 0; i < n; i++)
            {
                for (int j = 0; j <= i; j++)
                {
                    double rankMu = 0;
                    for (int r = 0; r < Mu; r++)
                    {
                        int row = order[r] * n;
                        rankMu += _weights[r] * _y[row + i] * _y[row + j];
                    }
                    double v = keep * _c[i * n + j] + C1 * _pC[i] * _pC[j] + CMu * rankMu;
                    _c[i * n + j] = v;
                    _c[j * n + i] = v;
                }
            }
        }

        // Cumulative step-size adaptation (eq. 44).
        _sigma *= Math.Exp(CSigma / DSigma * (normPSigma / ExpectedGaussianNorm - 1));

        if (IsDiagonal)
        {
            for (int i = 0; i < n; i++) _d[i] = Math.Sqrt(Math.Max(_c[i], 0));
        }
        else if (generationNumber - _eigenGeneration > 1.0 / ((C1 + CMu) * n * 10))
        {
            Decompose();
            _eigenGeneration = generationNumber;
        }
    }

    /// <summary>C = B D² Bᵀ through MathNet.Numerics' managed symmetric eigen-decomposition.</summary>
    private void Decompose()
    {
        int n = Dimension;
        // C is symmetric, so its row-major storage is also the column-major layout the provider expects.
        ManagedLinearAlgebraProvider.Instance.EigenDecomp(true, n, _c, _evdVectors, _evdValues, _evdBlock);
        double maxEigen = 0;
        for (int k = 0; k < n; k++) maxEigen = Math.Max(maxEigen, _evdValues[k].Real);
        double floor = maxEigen * 1e-30;
        for (int k = 0; k < n; k++)
        {
            _d[k] = Math.Sqrt(Math.Max(_evdValues[k].Real, floor));
            for (int i = 0; i < n; i++) _b[i * n + k] = _evdVectors[k * n + i]; // column-major → B[i, k]
        }
    }

    protected override void SaveCore(BinaryWriter writer)
    {
        writer.Write(_sigma);
        writer.Write(_eigenGeneration);
        WriteArray(writer, _mean);
        WriteArray(writer, _pSigma);
        WriteArray(writer, _pC);
        WriteArray(writer, _c);
        WriteArray(writer, _b);
        WriteArray(writer, _d);
        WriteArray(writer, _z);
        WriteArray(writer, _y);
    }

    protected override void LoadCore(BinaryReader reader)
    {
        _sigma = reader.ReadDouble();
        _eigenGeneration = reader.ReadInt32();
        ReadArray(reader, _mean, "mean");
        ReadArray(reader, _pSigma, "sigma_path");
        ReadArray(reader, _pC, "covariance_path");
        ReadArray(reader, _c, "covariance");
        ReadArray(reader, _b, "eigenvectors");
        ReadArray(reader, _d, "eigenvalue_roots");
        ReadArray(reader, _z, "z");
        ReadArray(reader, _y, "y");
    }
}
