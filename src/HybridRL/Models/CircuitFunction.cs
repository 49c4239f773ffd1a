using HybridRL.Quantum.Simulation;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Models;

/// <summary>
/// Custom autograd function around an <see cref="IExpectationEvaluator"/>: forward runs the batched
/// simulation; backward asks the evaluator for its vector–Jacobian product (adjoint or parameter shift,
/// whichever the evaluator was built with) and returns gradients for the inputs and the circuit parameters.
/// Spans are taken directly over the tensors' memory: the only allocations per call are the output tensor
/// and the two gradient tensors. Call as <c>CircuitFunction.apply(inputs [B, I], parameters [P], evaluator)</c>.
/// </summary>
public sealed class CircuitFunction : autograd.SingleTensorFunction<CircuitFunction>
{
    public override string Name => "circuit_expectations";

    public override Tensor forward(autograd.AutogradContext ctx, params object[] vars)
    {
        var inputs = ((Tensor)vars[0]).contiguous();
        var parameters = ((Tensor)vars[1]).contiguous();
        var evaluator = (IExpectationEvaluator)vars[2];
        int batch = checked((int)inputs.shape[0]);
        CheckShapes(inputs, parameters, evaluator);
        var output = torch.empty([batch, evaluator.OutputCount], dtype: ScalarType.Float64);
        evaluator.Forward(TensorMemory.AsSpan(inputs), TensorMemory.AsSpan(parameters), batch, false, TensorMemory.AsSpan(output));
        ctx.save_for_backward([inputs, parameters]);
        ctx.save_data("evaluator", evaluator);
        ctx.save_data("inputs_grad", ((Tensor)vars[0]).requires_grad);
        return output;
    }

    public override List<Tensor> backward(autograd.AutogradContext ctx, Tensor gradOutput)
    {
        var saved = ctx.get_saved_variables();
        var inputs = saved[0];
        var parameters = saved[1];
        var evaluator = (IExpectationEvaluator)ctx.get_data("evaluator");
        bool wantInputs = (bool)ctx.get_data("inputs_grad");
        int batch = checked((int)inputs.shape[0]);
        using var g = gradOutput.contiguous();
        var gradParameters = torch.empty([evaluator.ParameterCount], dtype: ScalarType.Float64);
        Tensor? gradInputs = wantInputs ? torch.empty([batch, evaluator.InputCount], dtype: ScalarType.Float64) : null;
        evaluator.Backward(TensorMemory.AsSpan(inputs), TensorMemory.AsSpan(parameters), batch, false, TensorMemory.AsSpan(g),
            TensorMemory.AsSpan(gradParameters), gradInputs is null ? Span<double>.Empty : TensorMemory.AsSpan(gradInputs));
        return [gradInputs!, gradParameters, null!];
    }

    private static void CheckShapes(Tensor inputs, Tensor parameters, IExpectationEvaluator evaluator)
    {
        if (inputs.dtype != ScalarType.Float64 || parameters.dtype != ScalarType.Float64)
            throw new ArgumentException("the circuit layer works in float64; convert inputs with .to(torch.float64)");
        if (inputs.dim() != 2 || inputs.shape[1] != evaluator.InputCount)
            throw new ArgumentException($"circuit inputs must be [batch, {evaluator.InputCount}], got [{string.Join(", ", inputs.shape)}]");
        if (parameters.numel() != evaluator.ParameterCount)
            throw new ArgumentException($"circuit parameters must have {evaluator.ParameterCount} entries, got {parameters.numel()}");
    }
}
