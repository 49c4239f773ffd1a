using HybridRL.Environments;

namespace HybridRL.Tests.Environments;

/// <summary>Checks that saving an environment mid-episode and restoring it into a fresh copy continues with the identical trajectory.</summary>
internal static class TrajectoryAssert
{
    public static void RestoreReproduces(IEnvironment env, ulong seed, Func<int, int> policy, int stepsBeforeSave, int stepsAfter, Func<IEnvironment>? fresh = null)
    {
        var obs = new double[env.ObservationSize];
        env.Reset(seed, obs);
        for (int t = 0; t < stepsBeforeSave; t++)
            if (env.Step(policy(t), obs).Done) env.Reset(seed + 1000 + (ulong)t, obs);
        var ms = new MemoryStream();
        using (var w = new BinaryWriter(ms, System.Text.Encoding.UTF8, leaveOpen: true)) env.SaveState(w);
        var expected = Run(env, policy, stepsBeforeSave, stepsAfter);

        ms.Position = 0;
        var other = fresh is null ? null : fresh();
        var target = other ?? env;
        using (var r = new BinaryReader(ms)) target.LoadState(r);
        var restoredObs = new double[env.ObservationSize];
        target.WriteObservation(restoredObs);
        Assert.Equal(expected[0].Obs, restoredObs);
        var actual = Run(target, policy, stepsBeforeSave, stepsAfter);
        Assert.Equal(expected.Count, actual.Count);
        for (int i = 0; i < expected.Count; i++)
        {
            Assert.Equal(expected[i].Obs, actual[i].Obs);
            Assert.Equal(expected[i].Reward, actual[i].Reward);
            Assert.Equal(expected[i].Terminal, actual[i].Terminal);
            Assert.Equal(expected[i].Truncated, actual[i].Truncated);
        }
        other?.Dispose();
    }

    private static List<(double[] Obs, double Reward, bool Terminal, bool Truncated)> Run(IEnvironment env, Func<int, int> policy, int t0, int steps)
    {
        var list = new List<(double[], double, bool, bool)>();
        var obs = new double[env.ObservationSize];
        env.WriteObservation(obs);
        list.Add(((double[])obs.Clone(), 0, false, false));
        for (int t = t0; t < t0 + steps; t++)
        {
            var r = env.Step(policy(t), obs);
            list.Add(((double[])obs.Clone(), r.Reward, r.Terminal, r.Truncated));
            if (r.Done) { env.Reset(7_000 + (ulong)t, obs); list.Add(((double[])obs.Clone(), 0, false, false)); }
        }
        return list;
    }
}
