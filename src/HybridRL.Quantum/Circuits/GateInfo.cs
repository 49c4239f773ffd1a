namespace HybridRL.Quantum.Circuits;

/// <summary>Static facts about each <see cref="GateKind"/>: qubit count, angle count, display and OpenQASM names.</summary>
public static class GateInfo
{
    public static int QubitCount(GateKind kind) => kind switch
    {
        GateKind.CNOT or GateKind.CZ or GateKind.SWAP or GateKind.CRX or GateKind.CRY or GateKind.CRZ => 2,
        _ => 1,
    };

    public static int AngleCount(GateKind kind) => kind switch
    {
        GateKind.RX or GateKind.RY or GateKind.RZ or GateKind.Phase or GateKind.CRX or GateKind.CRY or GateKind.CRZ => 1,
        GateKind.Rot => 3,
        _ => 0,
    };

    public static bool IsControlledRotation(GateKind kind) => kind is GateKind.CRX or GateKind.CRY or GateKind.CRZ;

    /// <summary>Lower-case OpenQASM 3 standard-library name (stdgates.inc); Rot has none and is written as rz·ry·rz.</summary>
    public static string QasmName(GateKind kind) => kind switch
    {
        GateKind.X => "x", GateKind.Y => "y", GateKind.Z => "z", GateKind.H => "h",
        GateKind.S => "s", GateKind.Sdg => "sdg", GateKind.T => "t", GateKind.Tdg => "tdg",
        GateKind.RX => "rx", GateKind.RY => "ry", GateKind.RZ => "rz", GateKind.Phase => "p",
        GateKind.CNOT => "cx", GateKind.CZ => "cz", GateKind.SWAP => "swap",
        GateKind.CRX => "crx", GateKind.CRY => "cry", GateKind.CRZ => "crz",
        GateKind.Rot => "rot",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown gate kind"),
    };
}
