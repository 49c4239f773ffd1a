using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Models;

/// <summary>
/// The whole <see cref="QuantumLayer"/> (circuit and read-out) as one autograd node, so a forward/backward
/// through TorchSharp costs one custom-function call plus the engine's own work. Forward: the engine writes
/// expectations E into a tensor that is kept for backward, the managed read-out writes the output. Backward:
/// read-out gradients by hand (per_action: ∂y_a/∂w_a = E_a, ∂y_a/∂b_a = 1, ∂y_a/∂E_a = w_a; linear:
/// ∂y/∂W = g Eᵀ, ∂y/∂b = g, ∂y/∂E = Wᵀ g), then the engine's vector–Jacobian product for the circuit
/// parameters and inputs. The gradient with respect to E goes through a buffer owned by the layer (reused).
/// Call as <c>QuantumLayerFunction.apply(inputs [B, I], layer.Weights, layer)</c>.
/// </summary>
public sealed class QuantumLayerFunction : autograd.SingleTensorFunction<QuantumLayerFunction>
{
    public override string Name => "quantum_layer";

    public override Tensor forward(autograd.AutogradContext ctx, params object[] vars)
    {
        var inputs = ((Tensor)vars[0]).contiguous();
        var weights = (Tensor)vars[1];
        var layer = (QuantumLayer)vars[2];
        var ev = layer.Evaluator;
        if (inputs.dtype != ScalarType.Float64) throw new ArgumentException("the quantum layer works in float64; convert inputs with .to(torch.float64)");
        if (inputs.dim() != 2 || inputs.shape[1] != ev.InputCount)
            throw new ArgumentException($"quantum layer inputs must be [batch, {ev.InputCount}], got [{string.Join(", ", inputs.shape)}]");
        int batch = checked((int)inputs.shape[0]);
        int nObs = ev.OutputCount, outputs = layer.OutputCount;
        var w = TensorMemory.AsSpan(weights);
        var e = torch.empty([batch, nObs], dtype: ScalarType.Float64);
        var y = torch.empty([batch, outputs], dtype: ScalarType.Float64);
        var es = TensorMemory.AsSpan(e);
        var ys = TensorMemory.AsSpan(y);
        ev.Forward(TensorMemory.AsSpan(inputs), w[..layer.CircuitParameterCount], batch, false, es);
        var readout = w[layer.CircuitParameterCount..];
        for (int b = 0; b < batch; b++) layer.ReadoutRow(readout, es.Slice(b * nObs, nObs), ys.Slice(b * outputs, outputs));
        ctx.save_for_backward([inputs, weights, e]);
        ctx.save_data("layer", layer);
        ctx.save_data("inputs_grad", ((Tensor)vars[0]).requires_grad);
        return y;
    }

    public override List<Tensor> backward(autograd.AutogradContext ctx, Tensor gradOutput)
    {
        var saved = ctx.get_saved_variables();
        var inputs = saved[0];
        var weights = saved[1];
        var e = saved[2];
        var layer = (QuantumLayer)ctx.get_data("layer");
        bool wantInputs = (bool)ctx.get_data("inputs_grad");
        var ev = layer.Evaluator;
        int batch = checked((int)inputs.shape[0]);
        int nObs = ev.OutputCount, outputs = layer.OutputCount, pc = layer.CircuitParameterCount;
        using var g = gradOutput.contiguous();
        var gs = TensorMemory.AsSpan(g);
        var es = TensorMemory.AsSpan(e);
        var w = TensorMemory.AsSpan(weights);
        var gradWeights = torch.empty([layer.ParameterCount], dtype: ScalarType.Float64);
        var gw = TensorMemory.AsSpan(gradWeights);
        var gE = layer.GradientBuffer(batch * nObs);
        layer.ReadoutBackward(w[pc..], es, gs, batch, gw[pc..], gE);
        Tensor? gradInputs = wantInputs ? torch.empty([batch, ev.InputCount], dtype: ScalarType.Float64) : null;
        ev.Backward(TensorMemory.AsSpan(inputs), w[..pc], batch, false, gE, gw[..pc],
            gradInputs is null ? Span<double>.Empty : TensorMemory.AsSpan(gradInputs));
        return [gradInputs!, gradWeights, null!];
    }
}
