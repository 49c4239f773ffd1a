using HybridRL.Quantum.Randomness;
using TorchSharp;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// Matrix product state compressor (Stoudenmire &amp; Schwab 2016): N sites, one per input feature, bond
/// dimension χ, and one output leg of size d on the middle site m = ⌊N/2⌋.
/// <para>
/// Site i ≠ m carries A_i[p] (χ×χ, p = 0,1), contracted with the feature map to M_i(x) = Σ_p φ_p(x_i) A_i[p].
/// The middle site carries B[p,k] (χ×χ, k &lt; d). With fixed boundary vectors l = r = (1,…,1)/√χ,
/// L = lᵀ M_0 ⋯ M_{m-1}, R = M_{m+1} ⋯ M_{N-1} r, C_{pk} = Lᵀ B[p,k] R and the output is
/// y_k = √d · Σ_p φ_p(x_m) C_{pk} / ‖C‖. Dividing by ‖C‖ makes y independent of every scalar factor and of
/// the gauge of the network, so intermediate products can be renormalised freely (values neither vanish
/// nor overflow on chains of hundreds of sites) and canonical forms / truncations act on the same function.
/// </para>
/// <para>
/// The autograd forward contracts the two chains in a balanced pairwise tree: all site matrices are built
/// by one batched matmul, then ⌈log₂(N/2)⌉ levels of batched matmuls, each followed by division by the
/// (detached) Frobenius norm of each product. Detaching is exact: y is invariant to those scalars, so by
/// Euler's theorem for degree-0 homogeneous functions their gradient contribution is zero.
/// </para>
/// <para>
/// Flat parameter order (one parameter tensor <c>weights</c>): <c>sites</c> [N-1, 2, χ, χ] (sites 0..N-1 except m, in order; then p, row, column),
/// then <c>middle</c> [2, d, χ, χ] (p, k, row, column).
/// Initialisation (near identity): A_i[0] = I + ε, A_i[1] = J/√N + ε, where J is block-diagonal with
/// 2×2 blocks [[0,-1],[1,0]], so each M_i is close to a scaled rotation (never singular); ε ~ N(0, 0.01²);
/// B entries ~ N(0, 1).
/// </para>
/// </summary>
public sealed class MpsCompressor : nn.Module<Tensor, Tensor>, IModelStage
{
    private const double NoiseScale = 0.01;
    private readonly Parameter _weights;
    private readonly int _sitesLength;
    private readonly Tensor _identity;   // [χ*χ]
    private readonly Tensor _boundary;   // [χ]
    private readonly double _boundaryValue;

    public MpsCompressor(int inputSize, int bondDimension, int outputSize, SiteFeatureMap featureMap, RandomStream random)
        : base("compressor")
    {
        if (inputSize < 1) throw new ModelConfigurationException($"the matrix product state needs at least one input feature, got {inputSize}", "model.compressor.kind");
        if (bondDimension < 1) throw new ModelConfigurationException($"bond dimension must be at least 1, got {bondDimension}", "model.compressor.bond_dimension");
        if (outputSize < 1) throw new ModelConfigurationException($"output size must be at least 1, got {outputSize}", "model.compressor.output_size");
        InputSize = inputSize;
        BondDimension = bondDimension;
        OutputSize = outputSize;
        FeatureMap = featureMap;
        MiddleSite = inputSize / 2;
        int chi = bondDimension, chi2 = chi * chi;

        var sites = new double[(inputSize - 1) * 2 * chi2];
        double gamma = 1.0 / Math.Sqrt(inputSize);
        for (int i = 0; i < inputSize - 1; i++)
        {
            for (int p = 0; p < 2; p++)
            {
                int baseIndex = (i * 2 + p) * chi2;
                for (int a = 0; a < chi; a++)
                    for (int b = 0; b < chi; b++)
                    {
                        double v = NoiseScale * random.NextGaussian();
                        if (p == 0 && a == b) v += 1.0;
                        if (p == 1 && (a ^ 1) == b && b < chi && (a | 1) < chi) v += (a % 2 == 0 ? -gamma : gamma);
                        sites[baseIndex + a * chi + b] = v;
                    }
            }
        }
        var middle = new double[2 * outputSize * chi2];
        for (int i = 0; i < middle.Length; i++) middle[i] = random.NextGaussian();

        _sitesLength = sites.Length;
        _weights = TensorMemory.NewParameter([.. sites, .. middle], sites.Length + middle.Length);
        register_parameter("weights", _weights);
        _identity = torch.eye(chi, dtype: ScalarType.Float64).reshape(chi2);
        _boundaryValue = 1.0 / Math.Sqrt(chi);
        _boundary = torch.full(chi, _boundaryValue, dtype: ScalarType.Float64);
        ParameterCount = sites.Length + middle.Length;
        ScratchSize = 4 * chi + 2 * outputSize;
    }

    public string Name => "compressor";
    public int InputSize { get; }
    public int OutputSize { get; }
    public int BondDimension { get; }
    public SiteFeatureMap FeatureMap { get; }
    /// <summary>Index of the site that carries the output leg.</summary>
    public int MiddleSite { get; }
    public int ParameterCount { get; }
    public int ScratchSize { get; }
    public Parameter Weights => _weights;

    /// <summary>The value of each entry of the fixed boundary vectors l and r (1/√χ).</summary>
    public double BoundaryValue => _boundaryValue;

    /// <summary>View of the site tensors A (see class remarks), shape [N-1, 2, χ, χ] (dispose the view when done).</summary>
    public Tensor Sites => _weights.narrow(0, 0, _sitesLength).view(InputSize - 1, 2, BondDimension, BondDimension);

    /// <summary>View of the middle tensor B, shape [2, d, χ, χ] (dispose the view when done).</summary>
    public Tensor Middle => _weights.narrow(0, _sitesLength, 2 * OutputSize * BondDimension * BondDimension).view(2, OutputSize, BondDimension, BondDimension);

    /// <summary>Parameter count for these sizes, without building the compressor.</summary>
    public static int CountParameters(int inputSize, int bondDimension, int outputSize)
        => (inputSize - 1) * 2 * bondDimension * bondDimension + 2 * outputSize * bondDimension * bondDimension;

    public override Tensor forward(Tensor input) => Forward(input);

    public Tensor Forward(Tensor input)
    {
        if (input.dim() != 2 || input.shape[1] != InputSize)
            throw new ArgumentException($"compressor expects [batch, {InputSize}] input, got [{string.Join(", ", input.shape)}]", nameof(input));
        using var scope = torch.NewDisposeScope();
        long batch = input.shape[0];
        int chi = BondDimension, chi2 = chi * chi, m = MiddleSite, n = InputSize;
        Tensor phi = FeatureMap == SiteFeatureMap.Trigonometric
            ? torch.stack([(input * (Math.PI / 2)).cos(), (input * (Math.PI / 2)).sin()], dim: -1)
            : torch.stack([torch.ones_like(input), input], dim: -1);                     // [B, N, 2]
        Tensor phiT = phi.permute(1, 0, 2);                                                // [N, B, 2]
        Tensor flatSites = _weights.narrow(0, 0, _sitesLength).view(n - 1, 2, chi2);
        Tensor middle = _weights.narrow(0, _sitesLength, 2 * OutputSize * chi2);
        int leftCount = m, rightCount = n - 1 - m, depth = Math.Max(leftCount, rightCount);

        Tensor left, right;
        if (depth == 0)
        {
            left = _boundary.reshape(1, chi).expand(batch, chi);
            right = _boundary.reshape(1, chi).expand(batch, chi);
        }
        else
        {
            Tensor Chain(int siteStart, int phiStart, int count)
            {
                var pieces = new List<Tensor>(2);
                if (count > 0) pieces.Add(phiT.narrow(0, phiStart, count).bmm(flatSites.narrow(0, siteStart, count)));
                if (count < depth) pieces.Add(_identity.reshape(1, 1, chi2).expand(depth - count, batch, chi2));
                return pieces.Count == 1 ? pieces[0] : torch.cat(pieces, 0);
            }
            Tensor t = torch.cat([Chain(0, 0, leftCount), Chain(m, m + 1, rightCount)], 1).reshape(depth, 2 * batch, chi, chi);
            int len = depth;
            while (len > 1)
            {
                int half = len / 2;
                Tensor pairs = t.narrow(0, 0, 2 * half).reshape(half, 2, 2 * batch, chi, chi);
                Tensor prod = pairs.select(1, 0).matmul(pairs.select(1, 1));
                Tensor scale;
                using (torch.no_grad()) scale = prod.square().sum([-2L, -1L], keepdim: true).sqrt();
                prod = prod / scale;
                t = len % 2 == 1 ? torch.cat([prod, t.narrow(0, len - 1, 1)], 0) : prod;
                len = half + len % 2;
            }
            Tensor total = t.select(0, 0);                                                 // [2B, χ, χ]
            left = torch.matmul(_boundary.reshape(1, 1, chi), total.narrow(0, 0, batch)).reshape(batch, chi);
            right = torch.matmul(total.narrow(0, batch, batch), _boundary.reshape(1, chi, 1)).reshape(batch, chi);
        }
        int s = 2 * OutputSize;
        // C[b, s] = Σ_ij L[b,i] B[s,i,j] R[b,j]
        Tensor lb = left.matmul(middle.view(s, chi, chi).permute(1, 0, 2).reshape(chi, s * chi)).reshape(batch, s, chi);
        Tensor c = lb.bmm(right.reshape(batch, chi, 1)).reshape(batch, s);
        c = c / c.square().sum(1, keepdim: true).sqrt();
        Tensor phiMid = phi.select(1, m).reshape(batch, 2, 1);
        Tensor y = (c.reshape(batch, 2, OutputSize) * phiMid).sum(1) * Math.Sqrt(OutputSize);
        return y.MoveToOuterDisposeScope();
    }

    /// <summary>Feature map of one value.</summary>
    internal void Phi(double x, out double p0, out double p1)
    {
        if (FeatureMap == SiteFeatureMap.Trigonometric)
        {
            double a = x * (Math.PI / 2);
            p0 = Math.Cos(a);
            p1 = Math.Sin(a);
        }
        else
        {
            p0 = 1.0;
            p1 = x;
        }
    }

    /// <summary>
    /// Managed evaluation of one row: the left chain is swept left to right and the right chain right to left
    /// as vector–matrix products (2χ² multiply-adds per site), renormalising after each site. Same function as
    /// <see cref="Forward"/>; different summation order, so agreement is to rounding (≈1e-13 relative).
    /// </summary>
    public void ForwardRow(ReadOnlySpan<double> parameters, ReadOnlySpan<double> input, Span<double> output, Span<double> scratch)
    {
        int chi = BondDimension, chi2 = chi * chi, m = MiddleSite, n = InputSize, d = OutputSize;
        var sites = parameters[..((n - 1) * 2 * chi2)];
        var middle = parameters.Slice((n - 1) * 2 * chi2, 2 * d * chi2);
        Span<double> v = scratch[..chi], v2 = scratch.Slice(chi, chi), w = scratch.Slice(2 * chi, chi), w2 = scratch.Slice(3 * chi, chi);
        Span<double> c = scratch.Slice(4 * chi, 2 * d);
        v.Fill(_boundaryValue);
        w.Fill(_boundaryValue);
        for (int i = 0; i < m; i++)
        {
            Phi(input[i], out double p0, out double p1);
            var a0 = sites.Slice((i * 2) * chi2, chi2);
            var a1 = sites.Slice((i * 2 + 1) * chi2, chi2);
            v2.Clear();
            for (int a = 0; a < chi; a++)
            {
                double c0 = v[a] * p0, c1 = v[a] * p1;
                var r0 = a0.Slice(a * chi, chi);
                var r1 = a1.Slice(a * chi, chi);
                for (int b = 0; b < chi; b++) v2[b] += c0 * r0[b] + c1 * r1[b];
            }
            Normalise(v2);
            var t = v; v = v2; v2 = t;
        }
        for (int i = n - 1; i > m; i--)
        {
            Phi(input[i], out double p0, out double p1);
            int si = i - 1;
            var a0 = sites.Slice((si * 2) * chi2, chi2);
            var a1 = sites.Slice((si * 2 + 1) * chi2, chi2);
            for (int a = 0; a < chi; a++)
            {
                var r0 = a0.Slice(a * chi, chi);
                var r1 = a1.Slice(a * chi, chi);
                double s0 = 0, s1 = 0;
                for (int b = 0; b < chi; b++) { s0 += r0[b] * w[b]; s1 += r1[b] * w[b]; }
                w2[a] = p0 * s0 + p1 * s1;
            }
            Normalise(w2);
            var t = w; w = w2; w2 = t;
        }
        double norm2 = 0;
        for (int s = 0; s < 2 * d; s++)
        {
            var bm = middle.Slice(s * chi2, chi2);
            double acc = 0;
            for (int a = 0; a < chi; a++)
            {
                var row = bm.Slice(a * chi, chi);
                double rs = 0;
                for (int b = 0; b < chi; b++) rs += row[b] * w[b];
                acc += v[a] * rs;
            }
            c[s] = acc;
            norm2 += acc * acc;
        }
        double inv = Math.Sqrt(d) / Math.Sqrt(norm2);
        Phi(input[m], out double q0, out double q1);
        for (int k = 0; k < d; k++) output[k] = (q0 * c[k] + q1 * c[d + k]) * inv;
    }

    private static void Normalise(Span<double> v)
    {
        double s = 0;
        foreach (double x in v) s += x * x;
        double inv = 1.0 / Math.Sqrt(s);
        for (int i = 0; i < v.Length; i++) v[i] *= inv;
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _identity.Dispose();
            _boundary.Dispose();
        }
        base.Dispose(disposing);
    }
}
