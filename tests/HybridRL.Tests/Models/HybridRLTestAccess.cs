using static TorchSharp.torch;

namespace HybridRL.Tests.Models;

internal static class HybridRLTestAccess
{
    public static double[] Flat(Tensor t) => t.numel() == 0 ? [] : t.detach().contiguous().data<double>().ToArray();
}
