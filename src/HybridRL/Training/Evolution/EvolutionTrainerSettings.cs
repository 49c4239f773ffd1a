namespace HybridRL.Training.Evolution;

/// <summary>Settings of the evolutionary trainer loop (the search method has its own).</summary>
/// <param name="EpisodesPerMember">Fitness = mean return over this many episodes; all members of a generation use the same episode seeds (extra episodes a strategy asks for come on top).</param>
/// <param name="EvalEpisodes">Greedy evaluation episodes of the distribution centre after each generation (0: none).</param>
/// <param name="Workers">Threads that evaluate the population's slices (a fixed split, see EvolutionTrainer.SliceCount; results do not depend on this).</param>
public sealed record EvolutionTrainerSettings(int EpisodesPerMember = 1, int EvalEpisodes = 5, int Workers = 0, int EvalEvery = 1)
{
    public int EffectiveWorkers => Workers > 0 ? Workers : Environment.ProcessorCount;
}
