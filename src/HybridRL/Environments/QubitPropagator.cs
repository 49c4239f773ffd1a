using System.Numerics;

namespace HybridRL.Environments;

/// <summary>
/// Exact time evolution of one qubit under a constant Hamiltonian H = b · σ (ħ = 1): the closed-form two-level
/// rotation U = exp(−i H t) = cos(|b| t) I − i sin(|b| t) (b̂ · σ) (e.g. Nielsen &amp; Chuang, ex. 4.2 / eq. 4.8).
/// Stored as the four complex entries of a 2 × 2 unitary.
/// </summary>
public readonly struct QubitPropagator
{
    public QubitPropagator(Complex u00, Complex u01, Complex u10, Complex u11)
    {
        U00 = u00; U01 = u01; U10 = u10; U11 = u11;
    }

    public Complex U00 { get; }
    public Complex U01 { get; }
    public Complex U10 { get; }
    public Complex U11 { get; }

    /// <summary>U = exp(−i (bx σx + by σy + bz σz) t).</summary>
    public static QubitPropagator ForField(double bx, double by, double bz, double time)
    {
        double norm = Math.Sqrt(bx * bx + by * by + bz * bz);
        if (norm == 0) return new QubitPropagator(Complex.One, Complex.Zero, Complex.Zero, Complex.One);
        double c = Math.Cos(norm * time), s = Math.Sin(norm * time) / norm;
        // b·σ = [[bz, bx − i by], [bx + i by, −bz]]
        return new QubitPropagator(
            new Complex(c, -s * bz),
            new Complex(-s * by, -s * bx),   // −i s (bx − i by) = −s by − i s bx
            new Complex(s * by, -s * bx),    // −i s (bx + i by) =  s by − i s bx
            new Complex(c, s * bz));
    }

    /// <summary>Applies U to the amplitudes (a0, a1) in place.</summary>
    public void Apply(ref Complex a0, ref Complex a1)
    {
        var n0 = U00 * a0 + U01 * a1;
        var n1 = U10 * a0 + U11 * a1;
        a0 = n0;
        a1 = n1;
    }

    /// <summary>Bloch vector (⟨σx⟩, ⟨σy⟩, ⟨σz⟩) of a normalised pure state.</summary>
    public static (double X, double Y, double Z) Bloch(Complex a0, Complex a1)
    {
        var cross = Complex.Conjugate(a0) * a1;   // ⟨σx⟩ = 2 Re(a0* a1), ⟨σy⟩ = 2 Im(a0* a1)
        return (2 * cross.Real, 2 * cross.Imaginary, a0.Magnitude * a0.Magnitude - a1.Magnitude * a1.Magnitude);
    }

    /// <summary>Fidelity |⟨target|ψ⟩|² of two pure states (Nielsen &amp; Chuang, sec. 9.2.2).</summary>
    public static double Fidelity(Complex t0, Complex t1, Complex a0, Complex a1)
    {
        var overlap = Complex.Conjugate(t0) * a0 + Complex.Conjugate(t1) * a1;
        return overlap.Real * overlap.Real + overlap.Imaginary * overlap.Imaginary;
    }

    /// <summary>The pure state with Bloch vector along the unit vector (x, y, z): cos(θ/2)|0⟩ + e^{iφ} sin(θ/2)|1⟩.</summary>
    public static (Complex A0, Complex A1) StateFromBloch(double x, double y, double z)
    {
        double n = Math.Sqrt(x * x + y * y + z * z);
        double theta = Math.Acos(Math.Clamp(z / n, -1, 1));
        double phi = Math.Atan2(y, x);
        return (new Complex(Math.Cos(theta / 2), 0), Complex.FromPolarCoordinates(Math.Sin(theta / 2), phi));
    }
}
