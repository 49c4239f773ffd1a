using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Noise;
using HybridRL.Quantum.Simulation;
using HybridRL.Training;

namespace HybridRL.Tests.Models;

public class NoiseScheduleTests
{
    private static IAgentModel Create(SimulationSettings sim) => ModelFactory.Create(new ModelSettings
    {
        Circuit = new CircuitSettings { Qubits = 3, Layers = 2 },
        Simulation = sim,
    }, 3, 2, 11);

    [Fact]
    public void LinearDriftToZeroEndsAtTheNoiselessResult()
    {
        TorchRuntime.EnsureLoaded();
        double[] obs = [0.3, -0.7, 1.1];
        var noisy = new SimulationSettings
        {
            Mode = SimulationMode.DensityMatrix, Gradient = GradientMethod.ParameterShift,
            Depolarizing = 0.05, BitFlip = 0.02, Schedule = ScheduleKind.LinearDrift, EndScale = 0.0,
        };
        using var drifting = Create(noisy);
        using var exact = Create(new SimulationSettings());
        var atStart = new double[2];
        var atEnd = new double[2];
        var reference = new double[2];
        NoiseClock.Advance([drifting], 0.0);
        drifting.ForwardNoGrad(obs, 1, atStart);
        NoiseClock.Advance([drifting], 1.0);
        drifting.ForwardNoGrad(obs, 1, atEnd);
        exact.ForwardNoGrad(obs, 1, reference);
        // At progress 1 the schedule has driven every strength to 0 × start: a noiseless density matrix gives
        // the state-vector expectations (same seed, same initial parameters); at progress 0 the channels act.
        Assert.Equal(reference[0], atEnd[0], 12);
        Assert.Equal(reference[1], atEnd[1], 12);
        Assert.True(Math.Abs(atStart[0] - reference[0]) > 1e-4 || Math.Abs(atStart[1] - reference[1]) > 1e-4,
            "noise at the start of the schedule should change the expectations");
    }
}
