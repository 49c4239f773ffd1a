using HybridRL.Quantum.Randomness;
using HybridRL.Training.DeepQ;

namespace HybridRL.Tests.Training;

public class ReplayBufferTests
{
    [Fact]
    public void BinaryObservationsAreStoredAsBytesAndComeBackExactly()
    {
        var buffer = new ReplayBuffer(4, 3, binaryObservations: true);
        buffer.Add([1, 0, 0], 2, 0.5, [0, 1, 0], terminal: false);
        var s = new double[3];
        var n = new double[3];
        var a = new int[1];
        var r = new double[1];
        var t = new bool[1];
        buffer.Sample(new RandomStream(1), 1, s, a, r, n, t);
        Assert.Equal([1.0, 0, 0], s);
        Assert.Equal([0.0, 1, 0], n);
        Assert.Equal(2, a[0]);
        Assert.Equal(0.5, r[0]);
        Assert.False(t[0]);
        Assert.Equal(2L * 3 + 4 + 8 + 1, ReplayBuffer.BytesPerTransition(3, binary: true));
    }

    [Fact]
    public void NonBinaryValueInBinaryBufferIsRejected()
    {
        var buffer = new ReplayBuffer(4, 2, binaryObservations: true);
        var ex = Assert.Throws<InvalidOperationException>(() => buffer.Add([0.5, 0], 0, 0, [0, 0], false));
        Assert.Contains("not binary", ex.Message);
    }

    [Fact]
    public void RingOverwritesOldestAndSaveLoadRoundTripsSampling()
    {
        var buffer = new ReplayBuffer(3, 2, binaryObservations: false);
        for (int i = 0; i < 5; i++) buffer.Add([i, -i], i % 2, i * 1.5, [i + 0.25, 0], terminal: i == 4);
        Assert.Equal(3, buffer.Count);

        using var ms = new MemoryStream();
        using (var w = new BinaryWriter(ms, System.Text.Encoding.UTF8, leaveOpen: true)) buffer.Save(w);
        ms.Position = 0;
        var copy = new ReplayBuffer(3, 2, binaryObservations: false);
        using (var rd = new BinaryReader(ms)) copy.Load(rd);

        var rngA = new RandomStream(7);
        var rngB = new RandomStream(7);
        var sa = new double[20]; var sb = new double[20];
        var na = new double[20]; var nb = new double[20];
        var aa = new int[10]; var ab = new int[10];
        var ra = new double[10]; var rb = new double[10];
        var ta = new bool[10]; var tb = new bool[10];
        buffer.Sample(rngA, 10, sa, aa, ra, na, ta);
        copy.Sample(rngB, 10, sb, ab, rb, nb, tb);
        Assert.Equal(sa, sb);
        Assert.Equal(ra, rb);
        Assert.Equal(ta, tb);
        // Only transitions 2, 3, 4 survive in a ring of three.
        foreach (var reward in ra) Assert.Contains(reward, new[] { 3.0, 4.5, 6.0 });
    }
}
