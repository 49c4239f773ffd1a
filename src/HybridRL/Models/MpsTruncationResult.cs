namespace HybridRL.Models;

/// <summary>
/// Outcome of <see cref="MpsCanonicalForm.Truncate"/>: the spectra before truncation, the bond dimension
/// kept per bond and the discarded weight Σ (discarded λ²) per bond. For the unit-norm state the squared
/// distance between the original and the truncated state equals <see cref="TotalDiscardedWeight"/>.
/// </summary>
public sealed record MpsTruncationResult(IReadOnlyList<MpsBondSpectrum> Spectra, int[] KeptBondDimensions, double[] DiscardedWeights)
{
    public double TotalDiscardedWeight => DiscardedWeights.Sum();
}
