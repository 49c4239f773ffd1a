using System.Runtime.CompilerServices;

namespace HybridRL.Quantum.Simulation;

/// <summary>A complex 2×2 matrix [[A, B], [C, D]] stored as real and imaginary parts.</summary>
internal struct Mat2
{
    public double Ar, Ai, Br, Bi, Cr, Ci, Dr, Di;

    public Mat2(double ar, double ai, double br, double bi, double cr, double ci, double dr, double di)
    {
        Ar = ar; Ai = ai; Br = br; Bi = bi; Cr = cr; Ci = ci; Dr = dr; Di = di;
    }

    public static Mat2 Identity => new(1, 0, 0, 0, 0, 0, 1, 0);

    public readonly bool IsDiagonal => Br == 0 && Bi == 0 && Cr == 0 && Ci == 0;
    public readonly bool IsIdentity => IsDiagonal && Ar == 1 && Ai == 0 && Dr == 1 && Di == 0;

    /// <summary>a·b (b applied first).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Mat2 Mul(in Mat2 a, in Mat2 b) => new(
        a.Ar * b.Ar - a.Ai * b.Ai + a.Br * b.Cr - a.Bi * b.Ci, a.Ar * b.Ai + a.Ai * b.Ar + a.Br * b.Ci + a.Bi * b.Cr,
        a.Ar * b.Br - a.Ai * b.Bi + a.Br * b.Dr - a.Bi * b.Di, a.Ar * b.Bi + a.Ai * b.Br + a.Br * b.Di + a.Bi * b.Dr,
        a.Cr * b.Ar - a.Ci * b.Ai + a.Dr * b.Cr - a.Di * b.Ci, a.Cr * b.Ai + a.Ci * b.Ar + a.Dr * b.Ci + a.Di * b.Cr,
        a.Cr * b.Br - a.Ci * b.Bi + a.Dr * b.Dr - a.Di * b.Di, a.Cr * b.Bi + a.Ci * b.Br + a.Dr * b.Di + a.Di * b.Dr);

    public readonly Mat2 Adjoint() => new(Ar, -Ai, Cr, -Ci, Br, -Bi, Dr, -Di);
    public readonly Mat2 Conjugate() => new(Ar, -Ai, Br, -Bi, Cr, -Ci, Dr, -Di);
    public readonly Mat2 Scale(double s) => new(Ar * s, Ai * s, Br * s, Bi * s, Cr * s, Ci * s, Dr * s, Di * s);

    // Textbook matrices (Nielsen & Chuang §4.2).
    public static Mat2 X => new(0, 0, 1, 0, 1, 0, 0, 0);
    public static Mat2 Y => new(0, 0, 0, -1, 0, 1, 0, 0);
    public static Mat2 Z => new(1, 0, 0, 0, 0, 0, -1, 0);
    public static Mat2 H { get { double r = 1 / Math.Sqrt(2); return new(r, 0, r, 0, r, 0, -r, 0); } }
    public static Mat2 S => new(1, 0, 0, 0, 0, 0, 0, 1);
    public static Mat2 Sdg => new(1, 0, 0, 0, 0, 0, 0, -1);
    public static Mat2 T { get { double r = 1 / Math.Sqrt(2); return new(1, 0, 0, 0, 0, 0, r, r); } }
    public static Mat2 Tdg { get { double r = 1 / Math.Sqrt(2); return new(1, 0, 0, 0, 0, 0, r, -r); } }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Mat2 RX(double theta) { var (s, c) = Math.SinCos(theta / 2); return new(c, 0, 0, -s, 0, -s, c, 0); }
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Mat2 RY(double theta) { var (s, c) = Math.SinCos(theta / 2); return new(c, 0, -s, 0, s, 0, c, 0); }
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Mat2 RZ(double theta) { var (s, c) = Math.SinCos(theta / 2); return new(c, -s, 0, 0, 0, 0, c, s); }
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Mat2 Phase(double phi) { var (s, c) = Math.SinCos(phi); return new(1, 0, 0, 0, 0, 0, c, s); }
}
