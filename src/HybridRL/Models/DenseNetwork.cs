using HybridRL.Quantum.Randomness;
using TorchSharp;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Models;

/// <summary>
/// Fully connected network: hidden layers with a nonlinearity, linear output layer.
/// Flat parameter order (one parameter tensor <c>weights</c>): for each layer ℓ = 0..L-1, weight ℓ ([out, in], row-major) then bias ℓ ([out]).
/// Initialisation: weights and biases uniform in ±1/√fan_in (common practice; the same bounds as
/// PyTorch's default linear layer, from memory), drawn from the given random stream in flat order.
/// </summary>
public sealed class DenseNetwork : nn.Module<Tensor, Tensor>, IModelStage
{
    private readonly int[] _sizes;
    private readonly Parameter _weights;
    private readonly Activation _activation;

    public DenseNetwork(string name, int inputSize, IReadOnlyList<int> hiddenSizes, int outputSize, Activation activation, RandomStream random)
        : base(name)
    {
        if (inputSize <= 0) throw new ArgumentOutOfRangeException(nameof(inputSize), inputSize, "input size must be positive");
        if (outputSize <= 0) throw new ArgumentOutOfRangeException(nameof(outputSize), outputSize, "output size must be positive");
        foreach (int h in hiddenSizes)
            if (h <= 0) throw new ArgumentOutOfRangeException(nameof(hiddenSizes), h, "hidden sizes must be positive");
        Name = name;
        _activation = activation;
        _sizes = [inputSize, .. hiddenSizes, outputSize];
        var values = new List<double>();
        for (int l = 0; l + 1 < _sizes.Length; l++)
        {
            int fanIn = _sizes[l], fanOut = _sizes[l + 1];
            double bound = 1.0 / Math.Sqrt(fanIn);
            var w = new double[fanOut * fanIn];
            for (int i = 0; i < w.Length; i++) w[i] = (2.0 * random.NextDouble() - 1.0) * bound;
            var b = new double[fanOut];
            for (int i = 0; i < b.Length; i++) b[i] = (2.0 * random.NextDouble() - 1.0) * bound;
            values.AddRange(w);
            values.AddRange(b);
        }
        ParameterCount = values.Count;
        _weights = TensorMemory.NewParameter([.. values], values.Count);
        register_parameter("weights", _weights);
        int widest = 0;
        foreach (int s in _sizes) widest = Math.Max(widest, s);
        ScratchSize = 2 * widest;
    }

    public string Name { get; }
    public int InputSize => _sizes[0];
    public int OutputSize => _sizes[^1];
    public int ParameterCount { get; }
    public int ScratchSize { get; }
    public Parameter Weights => _weights;

    /// <summary>Layer widths including input and output.</summary>
    public IReadOnlyList<int> LayerSizes => _sizes;

    /// <summary>Parameter count of a network with these sizes, without building it.</summary>
    public static int CountParameters(int inputSize, IReadOnlyList<int> hiddenSizes, int outputSize)
    {
        int n = 0, prev = inputSize;
        foreach (int h in hiddenSizes) { n += prev * h + h; prev = h; }
        return n + prev * outputSize + outputSize;
    }

    public override Tensor forward(Tensor input) => Forward(input);

    public Tensor Forward(Tensor input)
    {
        using var scope = torch.NewDisposeScope();
        Tensor h = input;
        int layers = _sizes.Length - 1;
        long o = 0;
        for (int l = 0; l < layers; l++)
        {
            int fanIn = _sizes[l], fanOut = _sizes[l + 1];
            var w = _weights.narrow(0, o, fanIn * fanOut).view(fanOut, fanIn);
            var bias = _weights.narrow(0, o + fanIn * fanOut, fanOut);
            o += fanIn * fanOut + fanOut;
            h = nn.functional.linear(h, w, bias);
            if (l + 1 < layers) h = _activation == Activation.Relu ? nn.functional.relu(h) : h.tanh();
        }
        return h.MoveToOuterDisposeScope();
    }

    public void ForwardRow(ReadOnlySpan<double> parameters, ReadOnlySpan<double> input, Span<double> output, Span<double> scratch)
    {
        int widest = ScratchSize / 2;
        Span<double> a = scratch[..widest], b = scratch.Slice(widest, widest);
        input[.._sizes[0]].CopyTo(a);
        int o = 0;
        int layers = _sizes.Length - 1;
        for (int l = 0; l < layers; l++)
        {
            int fanIn = _sizes[l], fanOut = _sizes[l + 1];
            var w = parameters.Slice(o, fanIn * fanOut);
            var bias = parameters.Slice(o + fanIn * fanOut, fanOut);
            o += fanIn * fanOut + fanOut;
            bool last = l + 1 == layers;
            Span<double> dst = last ? output : b;
            for (int j = 0; j < fanOut; j++)
            {
                double s = bias[j];
                var row = w.Slice(j * fanIn, fanIn);
                for (int i = 0; i < fanIn; i++) s += row[i] * a[i];
                if (!last) s = _activation == Activation.Relu ? Math.Max(s, 0.0) : Math.Tanh(s);
                dst[j] = s;
            }
            if (!last)
            {
                var t = a; a = b; b = t;
            }
        }
    }
}
