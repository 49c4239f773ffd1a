using System.Globalization;
using System.Runtime.CompilerServices;

namespace HybridRL.Quantum.Circuits;

/// <summary>
/// The angle of a gate: a constant, a trainable parameter, an input feature times a scale
/// (the scale itself may be a trainable parameter), a product of two features, or an angle
/// computed from the whole input row by an <see cref="IInputAngleMap"/> of the circuit.
/// </summary>
public readonly record struct Angle
{
    public AngleKind Kind { get; }
    /// <summary>Constant value (Constant) or constant scale (Input without trainable scale, InputProduct).</summary>
    public double Value { get; }
    /// <summary>Parameter index (Parameter), feature index (Input, InputProduct first factor) or map index (Mapped).</summary>
    public int Index { get; }
    /// <summary>Second feature (InputProduct) or output index of the map (Mapped); otherwise -1.</summary>
    public int Index2 { get; }
    /// <summary>Index of the trainable parameter used as scale (Input), or -1 for a constant scale.</summary>
    public int ScaleParameter { get; }
    public InputSquash Squash { get; }

    private Angle(AngleKind kind, double value, int index, int index2, int scaleParameter, InputSquash squash)
    {
        Kind = kind; Value = value; Index = index; Index2 = index2; ScaleParameter = scaleParameter; Squash = squash;
    }

    public static Angle Constant(double value)
    {
        if (!double.IsFinite(value)) throw new ArgumentException($"constant angle must be finite, got {value}", nameof(value));
        return new(AngleKind.Constant, value, -1, -1, -1, InputSquash.None);
    }

    public static Angle Parameter(int index)
    {
        if (index < 0) throw new ArgumentOutOfRangeException(nameof(index), index, "parameter index must be non-negative");
        return new(AngleKind.Parameter, 1.0, index, -1, -1, InputSquash.None);
    }

    /// <summary>scale · squash(x[feature]).</summary>
    public static Angle Input(int feature, double scale = 1.0, InputSquash squash = InputSquash.None)
    {
        if (feature < 0) throw new ArgumentOutOfRangeException(nameof(feature), feature, "input feature index must be non-negative");
        if (!double.IsFinite(scale)) throw new ArgumentException($"input scale must be finite, got {scale}", nameof(scale));
        return new(AngleKind.Input, scale, feature, -1, -1, squash);
    }

    /// <summary>w[scaleParameter] · squash(x[feature]) — a trainable per-feature scale.</summary>
    public static Angle ScaledInput(int feature, int scaleParameter, InputSquash squash = InputSquash.None)
    {
        if (feature < 0) throw new ArgumentOutOfRangeException(nameof(feature), feature, "input feature index must be non-negative");
        if (scaleParameter < 0) throw new ArgumentOutOfRangeException(nameof(scaleParameter), scaleParameter, "scale parameter index must be non-negative");
        return new(AngleKind.Input, 1.0, feature, -1, scaleParameter, squash);
    }

    /// <summary>scale · x[i] · x[j] (second-order product encoding).</summary>
    public static Angle InputProduct(int i, int j, double scale = 1.0)
    {
        if (i < 0) throw new ArgumentOutOfRangeException(nameof(i), i, "input feature index must be non-negative");
        if (j < 0) throw new ArgumentOutOfRangeException(nameof(j), j, "input feature index must be non-negative");
        if (!double.IsFinite(scale)) throw new ArgumentException($"input scale must be finite, got {scale}", nameof(scale));
        return new(AngleKind.InputProduct, scale, i, j, -1, InputSquash.None);
    }

    /// <summary>Output <paramref name="output"/> of the circuit's input-angle map number <paramref name="map"/>.</summary>
    public static Angle Mapped(int map, int output)
    {
        if (map < 0) throw new ArgumentOutOfRangeException(nameof(map), map, "map index must be non-negative");
        if (output < 0) throw new ArgumentOutOfRangeException(nameof(output), output, "map output index must be non-negative");
        return new(AngleKind.Mapped, 1.0, map, output, -1, InputSquash.None);
    }

    public static implicit operator Angle(double value) => Constant(value);

    /// <summary>True when the angle depends on trainable parameters or inputs.</summary>
    public bool IsVariable => Kind != AngleKind.Constant;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double SquashValue(InputSquash s, double x) => s == InputSquash.Arctan ? Math.Atan(x) : x;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double SquashDerivative(InputSquash s, double x) => s == InputSquash.Arctan ? 1.0 / (1.0 + x * x) : 1.0;

    /// <summary>Value of the angle for one input row and parameter vector; <paramref name="mapped"/> holds the map outputs (flattened by map offsets).</summary>
    internal double Evaluate(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, ReadOnlySpan<double> mapped, ReadOnlySpan<int> mapOffsets)
    {
        switch (Kind)
        {
            case AngleKind.Constant: return Value;
            case AngleKind.Parameter: return parameters[Index];
            case AngleKind.Input:
            {
                double scale = ScaleParameter >= 0 ? parameters[ScaleParameter] : Value;
                return scale * SquashValue(Squash, inputs[Index]);
            }
            case AngleKind.InputProduct: return Value * inputs[Index] * inputs[Index2];
            case AngleKind.Mapped: return mapped[mapOffsets[Index] + Index2];
            default: throw new InvalidOperationException($"unknown angle kind {Kind}");
        }
    }

    /// <summary>Adds g·∂angle/∂(parameters, inputs, map outputs) into the gradient buffers.</summary>
    internal void Backprop(double g, ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, Span<double> gradParameters, Span<double> gradInputs, Span<double> gradMapped, ReadOnlySpan<int> mapOffsets)
    {
        switch (Kind)
        {
            case AngleKind.Constant: return;
            case AngleKind.Parameter: gradParameters[Index] += g; return;
            case AngleKind.Input:
            {
                double x = inputs[Index];
                if (ScaleParameter >= 0)
                {
                    gradParameters[ScaleParameter] += g * SquashValue(Squash, x);
                    gradInputs[Index] += g * parameters[ScaleParameter] * SquashDerivative(Squash, x);
                }
                else gradInputs[Index] += g * Value * SquashDerivative(Squash, x);
                return;
            }
            case AngleKind.InputProduct:
                gradInputs[Index] += g * Value * inputs[Index2];
                gradInputs[Index2] += g * Value * inputs[Index];
                return;
            case AngleKind.Mapped: gradMapped[mapOffsets[Index] + Index2] += g; return;
        }
    }

    public override string ToString() => Kind switch
    {
        AngleKind.Constant => Value.ToString("R", CultureInfo.InvariantCulture),
        AngleKind.Parameter => $"w[{Index}]",
        AngleKind.Input => (ScaleParameter >= 0 ? $"w[{ScaleParameter}]" : Value.ToString("R", CultureInfo.InvariantCulture)) + "*" + (Squash == InputSquash.Arctan ? $"arctan(x[{Index}])" : $"x[{Index}]"),
        AngleKind.InputProduct => $"{Value.ToString("R", CultureInfo.InvariantCulture)}*x[{Index}]*x[{Index2}]",
        AngleKind.Mapped => $"map{Index}[{Index2}]",
        _ => "?",
    };
}
