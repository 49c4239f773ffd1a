using HybridRL.Experiments.Config;

namespace HybridRL.Tests.Config;

public sealed class EncodingCompatibilityTests : IDisposable
{
    private readonly ScratchFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    private ModelSettings Model(string modelYaml)
    {
        var file = _dir.Write("m.yaml", "experiment:\n  budget:\n    env_steps: 10\nenvironment:\n  kind: external\n" + modelYaml);
        return ExperimentSpecLoader.LoadFile(file).Model;
    }

    [Fact]
    public void Basis_encoding_needs_a_discrete_environment_with_few_enough_states()
    {
        var model = Model("model:\n  circuit:\n    encoding: basis\n    qubits: 4\n");
        Assert.Contains("needs a discrete environment", Assert.Single(EncodingCompatibility.Check(model, "cart-pole", new EnvironmentShape(4, 2, null))).Message);
        var tooMany = Assert.Single(EncodingCompatibility.Check(model, "x", new EnvironmentShape(1, 4, 17)));
        Assert.Equal("model.circuit.qubits", tooMany.Key);
        Assert.Contains("at least 5 qubits", tooMany.Message); // ⌈log2 17⌉ = 5
        Assert.Empty(EncodingCompatibility.Check(model, "x", new EnvironmentShape(1, 4, 16)));
        // a discrete environment that sends its state as 4 bits instead of the index
        var bits = Assert.Single(EncodingCompatibility.Check(model, "slippery-warehouse", new EnvironmentShape(4, 4, 11)));
        Assert.Equal("model.circuit.encoding", bits.Key);
        Assert.Contains("gives 4 observation values", bits.Message);
        Assert.Contains("observation: index", bits.Message);
    }

    [Fact]
    public void Observation_too_large_without_a_compressor_suggests_one()
    {
        var angle = Model("model:\n  circuit:\n    qubits: 4\n    readout: linear\n");
        var problem = Assert.Single(EncodingCompatibility.Check(angle, "survey-drone", new EnvironmentShape(9, 5, null)));
        Assert.Contains("has 9 values but angle encoding on 4 qubits", problem.Message);
        Assert.Contains("model.compressor.kind", problem.Message);
        var amplitude = Model("model:\n  circuit:\n    qubits: 3\n    encoding: amplitude\n    readout: linear\n");
        Assert.Single(EncodingCompatibility.Check(amplitude, "x", new EnvironmentShape(9, 2, null)));   // 9 > 2^3
        Assert.Empty(EncodingCompatibility.Check(amplitude, "x", new EnvironmentShape(8, 2, null)));    // 8 = 2^3 fits
        var compressed = Model("model:\n  compressor:\n    kind: mps\n  circuit:\n    qubits: 4\n    readout: linear\n");
        Assert.Empty(EncodingCompatibility.Check(compressed, "x", new EnvironmentShape(100, 2, null)));
    }

    [Fact]
    public void Per_action_readout_needs_a_qubit_per_action()
    {
        var model = Model("model:\n  circuit:\n    qubits: 2\n");
        var problem = Assert.Single(EncodingCompatibility.Check(model, "x", new EnvironmentShape(2, 3, null)));
        Assert.Equal("model.circuit.readout", problem.Key);
    }
}
