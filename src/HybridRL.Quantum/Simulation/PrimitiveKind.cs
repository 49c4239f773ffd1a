namespace HybridRL.Quantum.Simulation;

/// <summary>Primitive operations the simulators execute (Rot is lowered to RZ·RY·RZ).</summary>
internal enum PrimitiveKind : byte
{
    Fixed1, RX, RY, RZ, Phase, CNOT, CZ, SWAP, CRX, CRY, CRZ,
}
