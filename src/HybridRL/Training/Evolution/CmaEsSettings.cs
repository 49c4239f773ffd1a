using System.Globalization;

namespace HybridRL.Training.Evolution;

/// <summary>
/// Settings of <see cref="CmaEvolutionStrategy"/>.
/// Keys: <c>population</c>, <c>sigma0</c>, <c>covariance</c>, <c>diagonal_above</c>.
/// All strategy parameters other than λ and σ₀ follow Table 1 of Hansen's tutorial (2016, arXiv:1604.00772).
/// The σ₀ default of 0.5 is our choice (Hansen suggests about a quarter to a half of the search range;
/// circuit angles live on a 2π-periodic range); the switch to the diagonal model above 200 dimensions is
/// our choice (the full model costs O(n²) per member and O(n³) per eigen-decomposition).
/// </summary>
/// <param name="Population">λ; 0 selects the default 4 + ⌊3 ln n⌋; otherwise ≥ 2.</param>
/// <param name="Sigma0">Initial step size σ₀ (&gt; 0).</param>
/// <param name="Covariance">Full, diagonal (separable) or automatic choice.</param>
/// <param name="DiagonalAbove">With <see cref="CmaCovarianceMode.Auto"/>, dimensions above this use the diagonal model (≥ 1).</param>
public sealed record CmaEsSettings(
    int Population = 0,
    double Sigma0 = 0.5,
    CmaCovarianceMode Covariance = CmaCovarianceMode.Auto,
    int DiagonalAbove = 200) : EvolutionSettings
{
    private const string Method = "CMA-ES";

    public override EvolutionKind Kind => EvolutionKind.CmaEs;

    public override void Validate()
    {
        if (Population != 0 && Population < 2) throw Bad(Method, "population", "must be 0 (default) or at least 2", Population);
        if (!IsPositiveFinite(Sigma0)) throw Bad(Method, "sigma0", "must be a positive finite number", Sigma0.ToString("R", CultureInfo.InvariantCulture));
        if (!Enum.IsDefined(Covariance)) throw Bad(Method, "covariance", "must be auto, full or diagonal", Covariance);
        if (DiagonalAbove < 1) throw Bad(Method, "diagonal_above", "must be at least 1", DiagonalAbove);
    }

    /// <summary>Whether a problem of dimension <paramref name="n"/> uses the diagonal (separable) model.</summary>
    public bool UsesDiagonal(int n) => Covariance switch
    {
        CmaCovarianceMode.Diagonal => true,
        CmaCovarianceMode.Full => false,
        _ => n > DiagonalAbove,
    };

    /// <summary>The population size for dimension <paramref name="n"/>: the setting, or 4 + ⌊3 ln n⌋ (Hansen 2016, Table 1).</summary>
    public int PopulationFor(int n) => Population != 0 ? Population : DefaultPopulation(n);

    /// <summary>λ = 4 + ⌊3 ln n⌋ (Hansen 2016, Table 1).</summary>
    public static int DefaultPopulation(int n)
    {
        if (n < 1) throw new ArgumentOutOfRangeException(nameof(n), n, "dimension must be at least 1");
        return 4 + (int)Math.Floor(3 * Math.Log(n));
    }

    internal override void Write(BinaryWriter writer)
    {
        writer.Write(Population);
        writer.Write(Sigma0);
        writer.Write((int)Covariance);
        writer.Write(DiagonalAbove);
    }

    internal static CmaEsSettings Read(BinaryReader reader) => new(
        reader.ReadInt32(), reader.ReadDouble(), (CmaCovarianceMode)reader.ReadInt32(), reader.ReadInt32());
}
