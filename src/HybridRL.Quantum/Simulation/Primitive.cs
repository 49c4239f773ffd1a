namespace HybridRL.Quantum.Simulation;

/// <summary>One lowered gate: kind, qubits (control first), angle slot (−1 for fixed gates), source operation.</summary>
internal struct Primitive
{
    public PrimitiveKind Kind;
    public int Q0, Q1;
    public int Slot;
    public int SourceOp;
    /// <summary>True for the last primitive of its source operation (noise is attached after it).</summary>
    public bool EndsOperation;
    public Mat2 Fixed;

    public readonly bool IsSingleQubit => Kind <= PrimitiveKind.Phase;
    public readonly bool IsControlledRotation => Kind is PrimitiveKind.CRX or PrimitiveKind.CRY or PrimitiveKind.CRZ;

    /// <summary>The 2×2 matrix of a single-qubit primitive, or the target block of a controlled rotation.</summary>
    public readonly Mat2 Matrix(double theta) => Kind switch
    {
        PrimitiveKind.Fixed1 => Fixed,
        PrimitiveKind.RX or PrimitiveKind.CRX => Mat2.RX(theta),
        PrimitiveKind.RY or PrimitiveKind.CRY => Mat2.RY(theta),
        PrimitiveKind.RZ or PrimitiveKind.CRZ => Mat2.RZ(theta),
        PrimitiveKind.Phase => Mat2.Phase(theta),
        _ => throw new InvalidOperationException($"{Kind} has no single-qubit matrix"),
    };

    /// <summary>Pauli generator letter of a rotation (U = exp(−iθP/2)).</summary>
    public readonly char Generator => Kind switch
    {
        PrimitiveKind.RX or PrimitiveKind.CRX => 'X',
        PrimitiveKind.RY or PrimitiveKind.CRY => 'Y',
        _ => 'Z',
    };
}
