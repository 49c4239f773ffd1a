namespace HybridRL.Experiments.Config;

/// <summary><c>trainer.cma_es</c>: covariance matrix adaptation evolution strategy (Hansen 2016 tutorial).</summary>
public sealed record CmaEsSettings
{
    /// <summary>0 = default λ = 4 + ⌊3 ln n⌋ (see <see cref="ResolvePopulation"/>).</summary>
    public required int Population { get; init; }
    public required double Sigma0 { get; init; }
    public required int EpisodesPerMember { get; init; }
    public required int EvalEvery { get; init; }
    public required int EvalEpisodes { get; init; }

    /// <summary>Population for <paramref name="parameterCount"/> parameters: the configured value, or
    /// λ = 4 + ⌊3 ln n⌋ when 0 (Hansen, "The CMA Evolution Strategy: A Tutorial", 2016, Table 1).</summary>
    public int ResolvePopulation(int parameterCount)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(parameterCount, 1);
        return Population > 0 ? Population : 4 + (int)Math.Floor(3 * Math.Log(parameterCount));
    }
}
