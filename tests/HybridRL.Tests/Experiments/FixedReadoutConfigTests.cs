using HybridRL.Experiments;
using HybridRL.Native;
using HybridRL.Tests.Training.Grid;

namespace HybridRL.Tests.Experiments;

/// <summary><c>model.circuit.trainable_output_weights: false</c> reaches the model: the read-out has no parameters.</summary>
public sealed class FixedReadoutConfigTests
{
    private const string Yaml = """
        experiment:
          name: fixed-readout
          budget:
            env_steps: 10
        environment:
          kind: slippery-warehouse
          map: dock-3x4
          observation: binary
        model:
          circuit:
            qubits: 4
            layers: 2
            encoding: angle
            input_squash: none
            readout: per_action
            trainable_output_weights: {0}
        """;

    [Fact]
    public void Fixed_readout_removes_the_readout_weights_and_biases_from_the_parameter_vector()
    {
        TorchRuntime.EnsureLoaded();
        using var trained = ExperimentComponents.Build(GridTraining.Spec(string.Format(Yaml, "true")));
        using var fixedReadout = ExperimentComponents.Build(GridTraining.Spec(string.Format(Yaml, "false")));
        using var a = trained.CreateModel();
        using var b = fixedReadout.CreateModel();
        // Hand count: per_action read-out over 4 actions = 4 weights + 4 biases; 4 qubits × 2 layers × 2 rotations = 16 angles.
        Assert.Equal(8, a.ParameterCounts["readout"]);
        Assert.Equal(0, b.ParameterCounts["readout"]);
        Assert.Equal(16, b.ParameterCounts["circuit"]);
        Assert.Equal(a.ParameterCount - 8, b.ParameterCount);
    }
}
