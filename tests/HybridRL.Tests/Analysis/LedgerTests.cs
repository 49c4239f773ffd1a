using HybridRL.Analysis.Ledger;

namespace HybridRL.Tests.Analysis;

public class LedgerTests
{
    /// <summary>
    /// A tiny hardware-style training loop that really evaluates a circuit expectation and counts executions:
    /// RY(θ_k + x_k) on each qubit of |0…0⟩, observable Z⊗…⊗Z, so ⟨Z…Z⟩ = Π_k cos(θ_k + x_k) (Nielsen &amp; Chuang
    /// sec. 4.2: RY(φ)|0⟩ = cos(φ/2)|0⟩ + sin(φ/2)|1⟩, ⟨Z⟩ = cos φ). Gradients by the parameter-shift rule
    /// ∂f/∂θ_k = [f(θ + π/2 e_k) − f(θ − π/2 e_k)]/2 (Mitarai et al. 2018).
    /// </summary>
    private sealed class CountingToyCircuit(int qubits)
    {
        public long Executions;

        public double Expectation(ReadOnlySpan<double> theta, ReadOnlySpan<double> x)
        {
            Executions++;
            double f = 1;
            for (int k = 0; k < qubits; k++) f *= Math.Cos(theta[k] + x[k]);
            return f;
        }

        public void Gradient(double[] theta, double[] x, double[] grad)
        {
            for (int k = 0; k < qubits; k++)
            {
                double t = theta[k];
                theta[k] = t + Math.PI / 2; double plus = Expectation(theta, x);
                theta[k] = t - Math.PI / 2; double minus = Expectation(theta, x);
                theta[k] = t;
                grad[k] = 0.5 * (plus - minus);
            }
        }
    }

    [Fact]
    public void CountedExecutionsEqualAnalyticCount()
    {
        const int p = 3, batch = 4, updates = 5, steps = 7;
        var circuit = new CountingToyCircuit(p);
        double[] theta = [0.3, -0.2, 0.9], x = [0.1, 0.4, -0.5], grad = new double[p];
        for (int s = 0; s < steps; s++) circuit.Expectation(theta, x);                 // acting: one forward per step
        for (int u = 0; u < updates; u++)
            for (int b = 0; b < batch; b++)
            {
                circuit.Expectation(theta, x);                                           // forward for the loss
                circuit.Gradient(theta, x, grad);                                        // 2 shifted runs per parameter
                for (int k = 0; k < p; k++) theta[k] -= 0.01 * grad[k];
            }

        var count = HardwareCount.ForTraining(HardwareCount.ShiftTerms(p, 0), batch, updates, forwardExecutionsPerStep: 1, steps, forwardExecutionsPerSample: 1);
        Assert.Equal(2L * p * batch * updates, count.ShiftedExecutions);                 // the 2·P·B·U
        Assert.Equal(7 + 20 + 120, count.Total);                                         // hand sum
        Assert.Equal(count.Total, circuit.Executions);

        // The shifted evaluations are a real gradient: compare with d/dθ_k Π cos = −sin(θ_k+x_k) Π_{j≠k} cos(θ_j+x_j).
        circuit.Gradient(theta, x, grad);
        for (int k = 0; k < p; k++)
        {
            double expect = -Math.Sin(theta[k] + x[k]);
            for (int j = 0; j < p; j++) if (j != k) expect *= Math.Cos(theta[j] + x[j]);
            Assert.Equal(expect, grad[k], 12);
        }
    }

    [Fact]
    public void ShiftTermsAndMeasurementGroups()
    {
        // 2 per Pauli rotation, 4 per controlled rotation (four-term shift rule for controlled rotations).
        Assert.Equal(2 * 3 + 4 * 2, HardwareCount.ShiftTerms(3, 2));
        var c = HardwareCount.ForTraining(10, 2, 3, 1, 5, 2, measurementGroups: 3);
        Assert.Equal(5 * 3, c.ActingExecutions);
        Assert.Equal(3 * 2 * 2 * 3, c.UpdateForwardExecutions);
        Assert.Equal(3 * 2 * 10 * 3, c.ShiftedExecutions);
        Assert.Equal(40, HardwareCount.ForEvolution(20, 2).Total);
        Assert.Throws<ArgumentOutOfRangeException>(() => HardwareCount.ForTraining(-1, 1, 1, 1, 1));
    }

    [Fact]
    public void DeviceSecondsAndCostFollowTheProfileFormula()
    {
        // Hand-worked: E = 147 executions × 100 shots = 14 700 shots. 14 700·1e-4 s = 1.47 s; 147·0.01 s = 1.47 s;
        // ⌈147/10⌉ = 15 jobs × 2 s = 30 s → 32.94 s. Cost 14 700 × 0.0003 = 4.41.
        var profile = HardwareProfile.Parse(new StringReader(
            "name: invented-test-device\nnote: made-up numbers for a test\nseconds_per_shot: 1e-4\nper_circuit_overhead_seconds: 0.01\ncircuits_per_job: 10\nqueue_latency_seconds: 2\nprice_per_shot: 0.0003\ncurrency: EUR\n"), "test");
        var ledger = new HardwareLedger(CircuitExecutions: 50, Shots: 0, HardwareExecutions: 147, ShotsPerExecution: 100);
        var e = ledger.Estimate(profile);
        Assert.Equal(14700, e.HardwareShots, 9);
        Assert.Equal(15, e.Jobs);
        Assert.Equal(32.94, e.DeviceSeconds, 9);
        Assert.Equal(4.41, e.Cost!.Value, 9);
        Assert.Equal("EUR", e.Currency);
        var total = HardwareLedger.Total([e, e], profile);
        Assert.Equal(2 * 32.94, total.DeviceSeconds, 9);
        Assert.Contains("not vendor quotes", HardwareLedger.Disclaimer);
    }

    [Theory]
    [InlineData("name: a\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1\nqueue_latency_seconds: 0\n", "seconds_per_shot")]
    [InlineData("name: a\nseconds_per_shot: x\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1\nqueue_latency_seconds: 0\n", "seconds_per_shot")]
    [InlineData("name: a\nseconds_per_shot: 1\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 0.5\nqueue_latency_seconds: 0\n", "circuits_per_job")]
    [InlineData("name: a\nseconds_per_shot: 1\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1\nqueue_latency_seconds: 0\nprice_per_shot: 1\n", "currency")]
    [InlineData("name: a\nseconds_per_shot: 1\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1\nqueue_latency_seconds: 0\nspeed: 3\n", "speed")]
    [InlineData("name: a\nseconds_per_shot: -1\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1\nqueue_latency_seconds: 0\n", "seconds_per_shot")]
    public void ProfileErrorsNameTheKey(string yaml, string key)
    {
        var ex = Assert.Throws<InvalidDataException>(() => HardwareProfile.Parse(new StringReader(yaml), "profile.yaml"));
        Assert.Contains($"'{key}'", ex.Message);
        Assert.Contains("profile.yaml", ex.Message);
    }
}
