using HybridRL.Quantum.Randomness;

namespace HybridRL.Quantum.Simulation;

/// <summary>Per-worker buffers reused across rows and calls (nothing is allocated per row or per gate).</summary>
internal sealed class Workspace
{
    public Workspace(int dim, int qubits, int slots, int mapped, int outputs, int parameters, int inputs, bool adjoint, bool scratchState, bool probabilities = false)
    {
        Re = new double[dim]; Im = new double[dim];
        if (adjoint) { LRe = new double[dim]; LIm = new double[dim]; }
        if (scratchState) { SRe = new double[dim]; SIm = new double[dim]; }
        if (scratchState || probabilities) Prob = new double[1 << qubits];
        Theta = new double[slots]; GTheta = new double[slots];
        Mapped = new double[mapped]; GMapped = new double[mapped];
        Out = new double[outputs]; Out2 = new double[outputs];
        GParams = new double[parameters]; GInputs = new double[inputs];
        Pending = new Mat2[qubits]; HasPending = new bool[qubits];
        TermSums = new double[64];
    }

    public double[] Re, Im;
    public double[] LRe = [], LIm = [];
    public double[] SRe = [], SIm = [], Prob = [];
    public double[] Theta, GTheta, Mapped, GMapped, Out, Out2, GParams, GInputs;
    public Mat2[] Pending;
    public bool[] HasPending;
    public double[] TermSums;
    public double[] Dense = new double[64];
    public readonly RandomStream Rng = new(0);
    public long Executions, Shots, Hardware;
}
