namespace HybridRL.Models;

/// <summary>How observable expectations become action values (config key <c>model.circuit.readout</c>).</summary>
public enum ReadoutKind
{
    /// <summary>One observable per action: out_a = w_a · ⟨O_a⟩ + b_a.</summary>
    PerAction,
    /// <summary>A dense map: out = W ⟨O⟩ + b, with one observable per qubit.</summary>
    Linear,
}
