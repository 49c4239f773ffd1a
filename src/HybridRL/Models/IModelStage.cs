using static TorchSharp.torch;

namespace HybridRL.Models;

/// <summary>
/// One differentiable stage of a model (compressor, network). It owns one flat parameter tensor
/// (its slice of the model's flat vector) and evaluates itself two ways: as TorchSharp ops with autograd, and as
/// managed code on one row with parameters taken from any flat slice (acting and population paths).
/// </summary>
internal interface IModelStage
{
    /// <summary>Component name used in parameter counts.</summary>
    string Name { get; }
    int InputSize { get; }
    int OutputSize { get; }
    int ParameterCount { get; }

    /// <summary>All trainable values of the stage as one 1-D parameter, in the stage's documented flat order.</summary>
    TorchSharp.Modules.Parameter Weights { get; }

    /// <summary>[B, InputSize] → [B, OutputSize], autograd-capable.</summary>
    Tensor Forward(Tensor input);

    /// <summary>Doubles of scratch <see cref="ForwardRow"/> needs.</summary>
    int ScratchSize { get; }

    /// <summary>One row with parameters from <paramref name="parameters"/> (length <see cref="ParameterCount"/>, flat order).</summary>
    void ForwardRow(ReadOnlySpan<double> parameters, ReadOnlySpan<double> input, Span<double> output, Span<double> scratch);
}
