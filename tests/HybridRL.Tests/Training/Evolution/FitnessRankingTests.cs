using HybridRL.Training.Evolution;

namespace HybridRL.Tests.Training.Evolution;

public class FitnessRankingTests
{
    [Fact]
    public void CentredRanksOfHandMadeFitness()
    {
        // Salimans et al. 2017 (fitness shaping by centred ranks): ascending rank r ↦ r/(λ−1) − 0.5.
        // Hand-worked: fitness [3, −1, 10, 3.5, 0] has ascending ranks [2, 0, 4, 3, 1]; λ − 1 = 4,
        // so the shaped values are [0, −0.5, 0.5, 0.25, −0.25].
        double[] shaped = FitnessRanking.CentredRanks([3, -1, 10, 3.5, 0]);
        Assert.Equal([0, -0.5, 0.5, 0.25, -0.25], shaped);
    }

    [Fact]
    public void TiesShareTheirMeanRankAndNaNRanksLast()
    {
        // Hand-worked: [1, 2, 2, 5] has ranks 0, {1, 2}, 3; the tie shares 1.5, so with λ − 1 = 3:
        // [0/3 − 0.5, 1.5/3 − 0.5, 1.5/3 − 0.5, 3/3 − 0.5] = [−0.5, 0, 0, 0.5].
        Assert.Equal([-0.5, 0, 0, 0.5], FitnessRanking.CentredRanks([1, 2, 2, 5]));
        // Hand-worked: NaN is the worst member: [NaN, 1, −∞] ranks NaN 0, −∞ 1, 1 2 → [−0.5, 0.5, 0].
        Assert.Equal([-0.5, 0.5, 0], FitnessRanking.CentredRanks([double.NaN, 1, double.NegativeInfinity]));
        // All equal: every member gets the mean rank, i.e. 0 (no signal).
        Assert.Equal([0, 0, 0, 0], FitnessRanking.CentredRanks([7, 7, 7, 7]));
    }

    [Fact]
    public void SortIsDescendingAndStableForManyLengths()
    {
        // Hand-checkable property: the order lists slots best first; equal values keep slot order.
        var rng = new HybridRL.Quantum.Randomness.RandomStream(99);
        for (int n = 1; n <= 40; n++)
        {
            var f = new double[n];
            for (int i = 0; i < n; i++) f[i] = rng.NextInt(5); // many ties
            var order = new int[n];
            FitnessRanking.SortDescending(f, order, new int[n]);
            var expected = Enumerable.Range(0, n).OrderByDescending(i => f[i]).ThenBy(i => i).ToArray(); // LINQ's stable sort as reference
            Assert.Equal(expected, order);
        }
    }
}
