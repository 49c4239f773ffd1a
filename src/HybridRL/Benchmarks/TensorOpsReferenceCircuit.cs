using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Benchmarks;

/// <summary>
/// The same circuit written with plain TorchSharp complex tensor operations and autograd, batched over rows:
/// the state is a complex128 tensor [batch, 2^n]; a single-qubit gate is a batched 2×2 matrix product on the
/// view [batch, 2^(n−q−1), 2, 2^q]; CNOT and SWAP are index permutations; CZ multiplies by a sign vector;
/// expectations of Z strings are probabilities times a sign matrix. Gradients come from TorchSharp's autograd.
/// It is the comparison baseline of <see cref="SimulatorBenchmark"/> and an independent check of the engine.
/// Supports every gate except controlled rotations, every angle kind except input maps, and diagonal (Z-string) observables.
/// </summary>
public sealed class TensorOpsReferenceCircuit
{
    private readonly Circuit _circuit;
    private readonly int _n, _dim;
    private readonly double[] _signs; // [dim, outputs] row-major, weights included
    private readonly double[] _constants;
    private readonly int _outputs;

    public TensorOpsReferenceCircuit(Circuit circuit, IReadOnlyList<Observable> observables)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        ArgumentNullException.ThrowIfNull(observables);
        _circuit = circuit;
        _n = circuit.Qubits;
        _dim = 1 << _n;
        if (circuit.InputMaps.Count > 0) throw new NotSupportedException("the tensor-ops reference does not support input maps (amplitude or basis encoding)");
        foreach (var op in circuit.Operations)
            if (GateInfo.IsControlledRotation(op.Kind)) throw new NotSupportedException($"the tensor-ops reference does not support {op.Kind}");
        _outputs = observables.Count;
        _signs = new double[_dim * _outputs];
        _constants = new double[_outputs];
        for (int k = 0; k < _outputs; k++)
            foreach (var t in observables[k].Terms)
            {
                if (t.XMask != 0) throw new NotSupportedException($"the tensor-ops reference supports Z strings only, got {t}");
                if (t.Support == 0) { _constants[k] += t.Weight; continue; }
                for (int j = 0; j < _dim; j++)
                    _signs[j * _outputs + k] += t.Weight * ((System.Numerics.BitOperations.PopCount((ulong)j & t.ZMask) & 1) == 0 ? 1 : -1);
            }
    }

    public int OutputCount => _outputs;

    /// <summary>Expectations [batch·outputs]; with <paramref name="gradOutputs"/>, also the vector–Jacobian product by autograd.</summary>
    public (double[] Outputs, double[] GradParameters, double[] GradInputs) Run(double[] inputs, double[] parameters, int batch, double[]? gradOutputs)
    {
        int I = _circuit.InputCount, P = _circuit.ParameterCount;
        if (inputs.Length != batch * I) throw new ArgumentException($"inputs has {inputs.Length} values, expected {batch * I}", nameof(inputs));
        if (parameters.Length != P) throw new ArgumentException($"parameters has {parameters.Length} values, expected {P}", nameof(parameters));
        bool grad = gradOutputs != null;
        using var scope = torch.NewDisposeScope();
        var x = torch.tensor(inputs, [batch, Math.Max(I, 0)], dtype: ScalarType.Float64);
        var w = torch.tensor(parameters, [P], dtype: ScalarType.Float64);
        if (grad) { x.requires_grad_(true); w.requires_grad_(true); }
        var init = new double[batch * _dim];
        for (int r = 0; r < batch; r++) init[r * _dim] = 1;
        var psi = torch.complex(torch.tensor(init, [batch, _dim], dtype: ScalarType.Float64), torch.zeros([batch, _dim], dtype: ScalarType.Float64));
        foreach (var op in _circuit.Operations)
        {
            switch (op.Kind)
            {
                case GateKind.CNOT:
                case GateKind.SWAP:
                    psi = psi.index_select(1, Permutation(op));
                    break;
                case GateKind.CZ:
                {
                    var s = new double[_dim];
                    long both = (1L << op.Qubit0) | (1L << op.Qubit1);
                    for (int j = 0; j < _dim; j++) s[j] = (j & both) == both ? -1 : 1;
                    psi = psi * torch.complex(torch.tensor(s, dtype: ScalarType.Float64), torch.zeros(_dim, dtype: ScalarType.Float64));
                    break;
                }
                case GateKind.Rot:
                    psi = Apply(psi, batch, op.Qubit0, Rotation(GateKind.RZ, AngleOf(op.Angles[0], x, w)));
                    psi = Apply(psi, batch, op.Qubit0, Rotation(GateKind.RY, AngleOf(op.Angles[1], x, w)));
                    psi = Apply(psi, batch, op.Qubit0, Rotation(GateKind.RZ, AngleOf(op.Angles[2], x, w)));
                    break;
                case GateKind.RX or GateKind.RY or GateKind.RZ or GateKind.Phase:
                    psi = Apply(psi, batch, op.Qubit0, Rotation(op.Kind, AngleOf(op.Angles[0], x, w)));
                    break;
                default:
                    psi = Apply(psi, batch, op.Qubit0, Fixed(op.Kind));
                    break;
            }
        }
        var probs = torch.view_as_real(psi).pow(2).sum(-1);                       // [batch, dim]
        var outT = probs.matmul(torch.tensor(_signs, [_dim, _outputs], dtype: ScalarType.Float64))
                   + torch.tensor(_constants, dtype: ScalarType.Float64);
        var outputs = outT.detach().contiguous().data<double>().ToArray();
        if (!grad) return (outputs, [], []);
        var g = torch.tensor(gradOutputs!, [batch, _outputs], dtype: ScalarType.Float64);
        (outT * g).sum().backward();
        var gp = w.grad is null ? new double[P] : w.grad.contiguous().data<double>().ToArray();
        var gi = x.grad is null ? new double[batch * I] : x.grad.contiguous().data<double>().ToArray();
        return (outputs, gp, gi);
    }

    private Tensor Apply(Tensor psi, int batch, int q, Tensor u)
    {
        var s = psi.reshape(batch, _dim >> (q + 1), 2, 1 << q);
        return torch.matmul(u, s).reshape(batch, _dim);
    }

    private Tensor Permutation(Operation op)
    {
        var perm = new long[_dim];
        int a = op.Qubit0, b = op.Qubit1;
        for (int j = 0; j < _dim; j++)
        {
            if (op.Kind == GateKind.CNOT) perm[j] = ((j >> a) & 1) != 0 ? j ^ (1 << b) : j;
            else
            {
                int ba = (j >> a) & 1, bb = (j >> b) & 1;
                perm[j] = ba == bb ? j : j ^ (1 << a) ^ (1 << b);
            }
        }
        return torch.tensor(perm, dtype: ScalarType.Int64);
    }

    /// <summary>Angle as a tensor of shape [1] (shared) or [batch] (input-dependent).</summary>
    private static Tensor AngleOf(Angle a, Tensor x, Tensor w)
    {
        switch (a.Kind)
        {
            case AngleKind.Constant: return torch.tensor(new[] { a.Value }, dtype: ScalarType.Float64);
            case AngleKind.Parameter: return w.narrow(0, a.Index, 1);
            case AngleKind.Input:
            {
                var f = x.select(1, a.Index);
                if (a.Squash == InputSquash.Arctan) f = torch.atan(f);
                return a.ScaleParameter >= 0 ? w.narrow(0, a.ScaleParameter, 1) * f : f * a.Value;
            }
            case AngleKind.InputProduct: return x.select(1, a.Index) * x.select(1, a.Index2) * a.Value;
            default: throw new NotSupportedException($"angle kind {a.Kind} is not supported by the tensor-ops reference");
        }
    }

    /// <summary>Rotation matrices [m, 1, 2, 2] (N&amp;C §4.2) from angles of shape [m].</summary>
    private static Tensor Rotation(GateKind kind, Tensor theta)
    {
        long m = theta.shape[0];
        var zero = torch.zeros_like(theta);
        Tensor re, im;
        if (kind == GateKind.Phase)
        {
            var one = torch.ones_like(theta);
            re = torch.stack([one, zero, zero, torch.cos(theta)], -1);
            im = torch.stack([zero, zero, zero, torch.sin(theta)], -1);
        }
        else
        {
            var c = torch.cos(theta / 2); var s = torch.sin(theta / 2);
            switch (kind)
            {
                case GateKind.RX: re = torch.stack([c, zero, zero, c], -1); im = torch.stack([zero, -s, -s, zero], -1); break;
                case GateKind.RY: re = torch.stack([c, -s, s, c], -1); im = torch.stack([zero, zero, zero, zero], -1); break;
                default: re = torch.stack([c, zero, zero, c], -1); im = torch.stack([-s, zero, zero, s], -1); break;
            }
        }
        return torch.complex(re, im).reshape(m, 1, 2, 2);
    }

    private static Tensor Fixed(GateKind kind)
    {
        double r = 1 / Math.Sqrt(2);
        (double[] re, double[] im) = kind switch
        {
            GateKind.X => (new double[] { 0, 1, 1, 0 }, new double[] { 0, 0, 0, 0 }),
            GateKind.Y => ([0, 0, 0, 0], [0, -1, 1, 0]),
            GateKind.Z => ([1, 0, 0, -1], [0, 0, 0, 0]),
            GateKind.H => ([r, r, r, -r], [0, 0, 0, 0]),
            GateKind.S => ([1, 0, 0, 0], [0, 0, 0, 1]),
            GateKind.Sdg => ([1, 0, 0, 0], [0, 0, 0, -1]),
            GateKind.T => ([1, 0, 0, r], [0, 0, 0, r]),
            GateKind.Tdg => ([1, 0, 0, r], [0, 0, 0, -r]),
            _ => throw new NotSupportedException($"gate {kind} is not supported by the tensor-ops reference"),
        };
        return torch.complex(torch.tensor(re, dtype: ScalarType.Float64), torch.tensor(im, dtype: ScalarType.Float64)).reshape(1, 1, 2, 2);
    }
}
