namespace HybridRL.Models;

/// <summary>What sits between the observation and the circuit's encoding (config key <c>model.compressor.kind</c>).</summary>
public enum CompressorKind
{
    /// <summary>Observation features go straight into the encoding; they must fit the qubits.</summary>
    None,
    /// <summary>Matrix product state with one output leg (<see cref="MpsCompressor"/>).</summary>
    Mps,
    /// <summary>Small fully connected network (<see cref="DenseCompressor"/>).</summary>
    Dense,
}
