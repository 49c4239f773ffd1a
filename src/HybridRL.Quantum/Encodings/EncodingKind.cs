namespace HybridRL.Quantum.Encodings;

public enum EncodingKind
{
    /// <summary>One input, an integer state index, written as a bit string (qubit k = bit k).</summary>
    Basis,
    /// <summary>One rotation per feature, feature f on qubit f mod n.</summary>
    Angle,
    /// <summary>Real amplitudes prepared by uniformly controlled RY rotations (Möttönen et al. 2004).</summary>
    Amplitude,
    /// <summary>Angle encoding repeated before every variational layer (Pérez-Salinas et al. 2020).</summary>
    ReUploading,
    /// <summary>H, RZ(x_i) and ZZ(x_i·x_j) rotations for every feature pair (second-order product encoding).</summary>
    ProductZZ,
}
