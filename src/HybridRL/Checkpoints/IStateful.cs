namespace HybridRL.Checkpoints;

/// <summary>
/// A part of a trainer whose complete state can be written to and restored from a checkpoint section
/// (model parameters, optimiser, replay buffer, environment copies, counters...). <see cref="Load"/> must
/// restore exactly what <see cref="Save"/> wrote, so that a resumed run continues bit-for-bit.
/// </summary>
public interface IStateful
{
    void Save(BinaryWriter writer);
    void Load(BinaryReader reader);
}
