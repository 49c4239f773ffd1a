using HybridRL.Quantum.Circuits;
using MathNet.Numerics.LinearAlgebra;
using Complex = System.Numerics.Complex;

namespace HybridRL.Quantum.Tests;

/// <summary>
/// Independent dense reference: every gate as a full 2^n × 2^n matrix built with MathNet.Numerics
/// Kronecker products of the textbook 2×2 matrices (Nielsen &amp; Chuang §4.2–4.3), qubit 0 the rightmost
/// factor (least significant index bit). Controlled gates are P0⊗I + P1⊗U.
/// </summary>
internal static class DenseReference
{
    private static readonly Complex I = Complex.ImaginaryOne;

    public static Matrix<Complex> M(Complex a, Complex b, Complex c, Complex d) =>
        Matrix<Complex>.Build.DenseOfArray(new[,] { { a, b }, { c, d } });

    public static Matrix<Complex> Id2 => M(1, 0, 0, 1);
    public static Matrix<Complex> X => M(0, 1, 1, 0);
    public static Matrix<Complex> Y => M(0, -I, I, 0);
    public static Matrix<Complex> Z => M(1, 0, 0, -1);
    public static Matrix<Complex> H => M(1, 1, 1, -1) / Math.Sqrt(2);
    public static Matrix<Complex> S => M(1, 0, 0, I);
    public static Matrix<Complex> T => M(1, 0, 0, Complex.Exp(I * Math.PI / 4));
    public static Matrix<Complex> P0 => M(1, 0, 0, 0);
    public static Matrix<Complex> P1 => M(0, 0, 0, 1);
    public static Matrix<Complex> RX(double t) => M(Math.Cos(t / 2), -I * Math.Sin(t / 2), -I * Math.Sin(t / 2), Math.Cos(t / 2));
    public static Matrix<Complex> RY(double t) => M(Math.Cos(t / 2), -Math.Sin(t / 2), Math.Sin(t / 2), Math.Cos(t / 2));
    public static Matrix<Complex> RZ(double t) => M(Complex.Exp(-I * t / 2), 0, 0, Complex.Exp(I * t / 2));
    public static Matrix<Complex> Phase(double p) => M(1, 0, 0, Complex.Exp(I * p));

    /// <summary>I ⊗ … ⊗ U(on q) ⊗ … ⊗ I.</summary>
    public static Matrix<Complex> Embed(Matrix<Complex> u, int q, int n)
    {
        var m = Matrix<Complex>.Build.DenseIdentity(1);
        for (int k = n - 1; k >= 0; k--) m = m.KroneckerProduct(k == q ? u : Id2);
        return m;
    }

    public static Matrix<Complex> Controlled(Matrix<Complex> u, int c, int t, int n) =>
        Embed(P0, c, n) + Embed(P1, c, n) * Embed(u, t, n);

    public static Matrix<Complex> GateMatrix(Operation op, double[] angles, int n)
    {
        int a = op.Qubit0, b = op.Qubit1;
        return op.Kind switch
        {
            GateKind.X => Embed(X, a, n),
            GateKind.Y => Embed(Y, a, n),
            GateKind.Z => Embed(Z, a, n),
            GateKind.H => Embed(H, a, n),
            GateKind.S => Embed(S, a, n),
            GateKind.Sdg => Embed(S.ConjugateTranspose(), a, n),
            GateKind.T => Embed(T, a, n),
            GateKind.Tdg => Embed(T.ConjugateTranspose(), a, n),
            GateKind.RX => Embed(RX(angles[0]), a, n),
            GateKind.RY => Embed(RY(angles[0]), a, n),
            GateKind.RZ => Embed(RZ(angles[0]), a, n),
            GateKind.Phase => Embed(Phase(angles[0]), a, n),
            // N&C Theorem 4.1: U = Rz(ω) Ry(θ) Rz(φ) (up to phase)
            GateKind.Rot => Embed(RZ(angles[2]) * RY(angles[1]) * RZ(angles[0]), a, n),
            GateKind.CNOT => Controlled(X, a, b, n),
            GateKind.CZ => Controlled(Z, a, b, n),
            // SWAP = (I + XX + YY + ZZ)/2
            GateKind.SWAP => (Matrix<Complex>.Build.DenseIdentity(1 << n) + Embed(X, a, n) * Embed(X, b, n) + Embed(Y, a, n) * Embed(Y, b, n) + Embed(Z, a, n) * Embed(Z, b, n)) / 2,
            GateKind.CRX => Controlled(RX(angles[0]), a, b, n),
            GateKind.CRY => Controlled(RY(angles[0]), a, b, n),
            GateKind.CRZ => Controlled(RZ(angles[0]), a, b, n),
            _ => throw new ArgumentException(op.Kind.ToString()),
        };
    }

    /// <summary>Evaluates an angle by hand from its description (independent of the engine's binder).</summary>
    public static double AngleValue(Angle a, double[] x, double[] w) => a.Kind switch
    {
        AngleKind.Constant => a.Value,
        AngleKind.Parameter => w[a.Index],
        AngleKind.Input => (a.ScaleParameter >= 0 ? w[a.ScaleParameter] : a.Value) * (a.Squash == InputSquash.Arctan ? Math.Atan(x[a.Index]) : x[a.Index]),
        AngleKind.InputProduct => a.Value * x[a.Index] * x[a.Index2],
        _ => throw new ArgumentException("mapped angles have no closed form here"),
    };

    public static Vector<Complex> State(Circuit c, double[] x, double[] w)
    {
        int n = c.Qubits;
        var psi = Vector<Complex>.Build.Dense(1 << n);
        psi[0] = 1;
        foreach (var op in c.Operations)
            psi = GateMatrix(op, op.Angles.Select(a => AngleValue(a, x, w)).ToArray(), n) * psi;
        return psi;
    }

    public static Matrix<Complex> PauliMatrix(string letters)
    {
        int n = letters.Length;
        var m = Matrix<Complex>.Build.DenseIdentity(1 << n);
        for (int q = 0; q < n; q++)
        {
            var p = letters[q] switch { 'X' => X, 'Y' => Y, 'Z' => Z, _ => Id2 };
            m = Embed(p, q, n) * m;
        }
        return m;
    }
}
