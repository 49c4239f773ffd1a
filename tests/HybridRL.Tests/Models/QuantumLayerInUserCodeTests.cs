using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Tests.Models;

/// <summary>
/// The quantum layer as a plain TorchSharp module in user code: between two ordinary linear layers, trained with
/// TorchSharp's own Adam on a toy regression, with no HybridRL model or trainer around it.
/// </summary>
public sealed class QuantumLayerInUserCodeTests
{
    [Fact]
    public void Layer_between_linear_layers_trains_with_torch_adam()
    {
        TorchRuntime.EnsureLoaded();
        torch.manual_seed(3);
        var design = ModelCircuit.Build(new CircuitSettings { Qubits = 3, Layers = 2, InputSquash = InputSquash.Arctan }, 3, 3);
        using var quantum = new QuantumLayer(design.Circuit, design.Observables, SimulationOptions.Exact, ReadoutKind.Linear, 2,
            new RandomStream(5), design.IsScaleParameter);
        using var before = nn.Linear(4, 3, dtype: float64);
        using var after = nn.Linear(2, 1, dtype: float64);
        var parameters = before.parameters().Concat(quantum.parameters()).Concat(after.parameters()).ToList();
        using var optimizer = optim.Adam(parameters, lr: 0.05);

        var rng = new RandomStream(9);
        var xs = Enumerable.Range(0, 16 * 4).Select(_ => 2 * rng.NextDouble() - 1).ToArray();
        using var x = tensor(xs, [16, 4], dtype: float64);
        using var y = (x[.., 0] * x[.., 1]).unsqueeze(1) * 0.5; // a smooth toy target
        double Loss()
        {
            using var scope = NewDisposeScope();
            using var noGrad = no_grad();
            return nn.functional.mse_loss(after.forward(quantum.forward(before.forward(x))), y).item<double>();
        }
        double start = Loss();
        for (int step = 0; step < 60; step++)
        {
            using var scope = NewDisposeScope();
            optimizer.zero_grad();
            var loss = nn.functional.mse_loss(after.forward(quantum.forward(before.forward(x))), y);
            loss.backward();
            optimizer.step();
        }
        double end = Loss();
        // The gradient reaches every stage: each one's parameters changed, and the loss fell.
        Assert.True(end < 0.5 * start, $"loss {start} → {end}");
        Assert.NotNull(quantum.Weights.grad);
        Assert.True(before.weight!.grad!.abs().sum().item<double>() > 0);
    }
}
