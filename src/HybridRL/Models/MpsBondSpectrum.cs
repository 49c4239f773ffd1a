namespace HybridRL.Models;

/// <summary>
/// Schmidt spectrum of one bond of a matrix product state in canonical form.
/// <paramref name="Bond"/> b sits between sites b and b+1; <paramref name="SingularValues"/> are in
/// descending order for the unit-norm state (their squares sum to 1); <paramref name="Entropy"/> is the
/// von Neumann entropy −Σ λ² ln λ² (nats).
/// </summary>
public sealed record MpsBondSpectrum(int Bond, double[] SingularValues, double Entropy);
