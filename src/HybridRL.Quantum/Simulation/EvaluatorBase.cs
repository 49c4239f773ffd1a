using System.Runtime.CompilerServices;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// Batch machinery shared by all simulation modes: validation, row partitioning over workers (fixed
/// contiguous ranges, each row written to its own slot), per-row random streams derived from the seed
/// and a call counter, the parameter-shift rule, and counting of executions and shots.
/// </summary>
internal abstract class EvaluatorBase : IExpectationEvaluator
{
    protected readonly CompiledCircuit C;
    protected readonly MeasurementPlan Plan;
    protected readonly SimulationOptions Options;
    protected readonly int Qubits;
    private Workspace[] _ws = [];
    private double[] _in = [], _par = [], _out = [], _gout = [], _gpar = [], _gin = [];
    private long _calls;
    private ulong _seed;
    private double _progress;

    protected EvaluatorBase(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, GradientMethod method)
    {
        C = new CompiledCircuit(circuit);
        Qubits = circuit.Qubits;
        Plan = new MeasurementPlan(observables, circuit.Qubits);
        Options = options;
        GradientMethod = method;
        _seed = options.Seed;
        if (options.Threads < 1) throw new ArgumentOutOfRangeException(nameof(options), options.Threads, "Threads must be at least 1");
    }

    public int InputCount => C.InputCount;
    public int ParameterCount => C.ParameterCount;
    public int OutputCount => Plan.OutputCount;
    public abstract SimulationMode Mode { get; }
    public GradientMethod GradientMethod { get; }
    public ExecutionCounters Counters { get; } = new();

    public double NoiseProgress
    {
        get => _progress;
        set
        {
            if (!(value >= 0 && value <= 1)) throw new ArgumentOutOfRangeException(nameof(value), value, "noise progress must be in [0, 1]");
            if (value != _progress) { _progress = value; OnProgressChanged(value); }
        }
    }

    protected virtual void OnProgressChanged(double progress) { }

    public EvaluatorRandomState GetState() => new(_seed, _calls);

    public void SetState(EvaluatorRandomState state)
    {
        if (state.CallCounter < 0) throw new ArgumentOutOfRangeException(nameof(state), state.CallCounter, "call counter must be non-negative");
        _seed = state.Seed;
        _calls = state.CallCounter;
    }

    /// <summary>Bits of the simulated register (qubits for state vectors, 2·qubits for density matrices).</summary>
    protected abstract int StateBits { get; }
    protected virtual bool NeedsAdjointBuffers => false;
    protected virtual bool NeedsScratchState => false;
    protected virtual bool NeedsProbabilities => false;
    /// <summary>True when some measurement setting needs a basis change (a scratch copy of the state).</summary>
    protected bool AnyBasisChange => Plan.Settings.Any(s => (s.XBasis | s.YBasis) != 0);

    /// <summary>Evaluates all outputs of one row for bound slot angles, adding executions and shots to ws.</summary>
    protected abstract void EvaluateRow(Workspace ws, ReadOnlySpan<double> theta, Span<double> outputs, int kernelThreads);

    /// <summary>Adjoint gradient of Σ_k gOut[k]·E_k with respect to slot angles (exact state vector only).</summary>
    protected virtual void AdjointRow(Workspace ws, ReadOnlySpan<double> theta, ReadOnlySpan<double> gOut, Span<double> gTheta, int kernelThreads) =>
        throw new InvalidOperationException("adjoint differentiation is only available for the exact state vector; use GradientMethod.ParameterShift");

    private bool StateParallel => StateBits >= StateKernels.ParallelBits && Options.Threads > 1;

    private void EnsureWorkspaces(int workers)
    {
        if (_ws.Length >= workers) return;
        var list = _ws.ToList();
        while (list.Count < workers)
        {
            var ws = new Workspace(1 << StateBits, Qubits, C.SlotAngles.Length, C.MappedCount, OutputCount, ParameterCount, InputCount, NeedsAdjointBuffers, NeedsScratchState, NeedsProbabilities);
            ws.TermSums = new double[Math.Max(1, Plan.Terms.Length)];
            list.Add(ws);
        }
        _ws = [.. list];
    }

    private static void Grow(ref double[] a, int n) { if (a.Length < n) a = new double[n]; }

    private void Validate(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, int batch, bool perRow)
    {
        if (batch < 1) throw new ArgumentOutOfRangeException(nameof(batch), batch, "batch must be at least 1");
        if (inputs.Length != batch * InputCount)
            throw new ArgumentException($"inputs has {inputs.Length} values but batch {batch} × InputCount {InputCount} = {batch * InputCount} are needed", nameof(inputs));
        int np = perRow ? batch * ParameterCount : ParameterCount;
        if (parameters.Length != np)
            throw new ArgumentException($"parameters has {parameters.Length} values but {(perRow ? $"batch {batch} × " : "")}ParameterCount {ParameterCount} = {np} are needed", nameof(parameters));
        for (int i = 0; i < inputs.Length; i++)
            if (!double.IsFinite(inputs[i]))
                throw new ArgumentException($"input feature {i % Math.Max(1, InputCount)} of batch row {i / Math.Max(1, InputCount)} is {inputs[i]} (must be finite)", nameof(inputs));
        for (int i = 0; i < parameters.Length; i++)
            if (!double.IsFinite(parameters[i]))
                throw new ArgumentException($"parameter {i % Math.Max(1, ParameterCount)}{(perRow ? $" of batch row {i / Math.Max(1, ParameterCount)}" : "")} is {parameters[i]} (must be finite)", nameof(parameters));
    }

    private void SeedRow(Workspace ws, long call, int row) =>
        ws.Rng.Reseed(RandomStream.SeedFor(RandomStream.SeedFor(_seed, "circuit-shots", call), "row", row));

    /// <summary>Runs body(ws, row) for every row: contiguous row ranges per worker for small registers, sequential rows with threaded kernels for large ones.</summary>
    private void RunRows(int batch, Action<Workspace, int, int> body)
    {
        int threads = Options.Threads;
        if (StateParallel || threads == 1 || batch == 1)
        {
            EnsureWorkspaces(1);
            int kt = StateParallel ? threads : 1;
            for (int r = 0; r < batch; r++) body(_ws[0], r, kt);
            return;
        }
        int workers = Math.Min(threads, batch);
        EnsureWorkspaces(workers);
        Parallel.For(0, workers, new ParallelOptions { MaxDegreeOfParallelism = workers }, w =>
        {
            int a = (int)((long)batch * w / workers), b = (int)((long)batch * (w + 1) / workers);
            for (int r = a; r < b; r++) body(_ws[w], r, 1);
        });
    }

    private void FlushCounters()
    {
        foreach (var ws in _ws)
        {
            Counters.Add(ws.Executions, ws.Shots, ws.Hardware);
            ws.Executions = ws.Shots = ws.Hardware = 0;
        }
    }

    public void Forward(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, int batch, bool perRowParameters, Span<double> outputs)
    {
        Validate(inputs, parameters, batch, perRowParameters);
        if (outputs.Length != batch * OutputCount)
            throw new ArgumentException($"outputs has {outputs.Length} slots but batch {batch} × OutputCount {OutputCount} = {batch * OutputCount} are needed", nameof(outputs));
        long call = _calls++;
        Grow(ref _in, inputs.Length); inputs.CopyTo(_in);
        Grow(ref _par, parameters.Length); parameters.CopyTo(_par);
        Grow(ref _out, outputs.Length);
        int I = InputCount, P = ParameterCount, K = OutputCount;
        var inArr = _in; var parArr = _par; var outArr = _out;
        try
        {
            RunRows(batch, (ws, r, kt) =>
            {
                SeedRow(ws, call, r);
                var x = new ReadOnlySpan<double>(inArr, r * I, I);
                var w = perRowParameters ? new ReadOnlySpan<double>(parArr, r * P, P) : new ReadOnlySpan<double>(parArr, 0, P);
                C.Bind(x, w, ws.Mapped, ws.Theta, r);
                EvaluateRow(ws, ws.Theta, new Span<double>(outArr, r * K, K), kt);
                ws.Hardware += Plan.SettingCount;
            });
        }
        finally { FlushCounters(); }
        _out.AsSpan(0, outputs.Length).CopyTo(outputs);
    }

    public void Backward(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, int batch, bool perRowParameters,
        ReadOnlySpan<double> gradOutputs, Span<double> gradParameters, Span<double> gradInputs)
    {
        Validate(inputs, parameters, batch, perRowParameters);
        if (gradOutputs.Length != batch * OutputCount)
            throw new ArgumentException($"gradOutputs has {gradOutputs.Length} values but batch {batch} × OutputCount {OutputCount} = {batch * OutputCount} are needed", nameof(gradOutputs));
        int np = perRowParameters ? batch * ParameterCount : ParameterCount;
        if (gradParameters.Length != np)
            throw new ArgumentException($"gradParameters has {gradParameters.Length} slots but {np} are needed ({(perRowParameters ? "batch × ParameterCount" : "ParameterCount, summed over rows")})", nameof(gradParameters));
        bool wantInputs = gradInputs.Length > 0;
        if (wantInputs && gradInputs.Length != batch * InputCount)
            throw new ArgumentException($"gradInputs has {gradInputs.Length} slots but batch {batch} × InputCount {InputCount} = {batch * InputCount} are needed (or pass an empty span)", nameof(gradInputs));
        for (int i = 0; i < gradOutputs.Length; i++)
            if (!double.IsFinite(gradOutputs[i])) throw new ArgumentException($"gradOutputs[{i}] is {gradOutputs[i]} (must be finite)", nameof(gradOutputs));

        long call = _calls++;
        int I = InputCount, P = ParameterCount, K = OutputCount;
        Grow(ref _in, inputs.Length); inputs.CopyTo(_in);
        Grow(ref _par, parameters.Length); parameters.CopyTo(_par);
        Grow(ref _gout, gradOutputs.Length); gradOutputs.CopyTo(_gout);
        Grow(ref _gpar, batch * P);
        Grow(ref _gin, batch * I);
        var inArr = _in; var parArr = _par; var goutArr = _gout; var gparArr = _gpar; var ginArr = _gin;
        bool adjoint = GradientMethod == GradientMethod.Adjoint;
        // Without an input gradient, slots that depend on inputs alone need no shifted evaluations on hardware.
        int[] shiftSlots = wantInputs ? C.DifferentiableSlots : C.ParameterSlots;
        int hardwarePerRow = (wantInputs ? C.ShiftEvaluations : C.ParameterShiftEvaluations) * Plan.SettingCount;
        try
        {
            RunRows(batch, (ws, r, kt) =>
            {
                SeedRow(ws, call, r);
                var x = new ReadOnlySpan<double>(inArr, r * I, I);
                var w = perRowParameters ? new ReadOnlySpan<double>(parArr, r * P, P) : new ReadOnlySpan<double>(parArr, 0, P);
                var g = new ReadOnlySpan<double>(goutArr, r * K, K);
                C.Bind(x, w, ws.Mapped, ws.Theta, r);
                var gTheta = ws.GTheta.AsSpan();
                gTheta.Clear();
                if (adjoint)
                {
                    AdjointRow(ws, ws.Theta, g, gTheta, kt);
                    ws.Executions += Plan.SettingCount;
                    ws.Hardware += hardwarePerRow;
                }
                else ShiftRow(ws, g, gTheta, kt, shiftSlots, hardwarePerRow);
                var gp = new Span<double>(gparArr, r * P, P);
                var gi = new Span<double>(ginArr, r * I, I);
                gp.Clear(); gi.Clear();
                C.Backprop(gTheta, x, w, gp, gi, ws.GMapped);
            });
        }
        finally { FlushCounters(); }

        if (perRowParameters) _gpar.AsSpan(0, batch * P).CopyTo(gradParameters);
        else
        {
            gradParameters.Clear();
            for (int r = 0; r < batch; r++)   // fixed order: identical for any thread count
            {
                var gp = new ReadOnlySpan<double>(_gpar, r * P, P);
                for (int j = 0; j < P; j++) gradParameters[j] += gp[j];
            }
        }
        if (wantInputs) _gin.AsSpan(0, batch * I).CopyTo(gradInputs);
    }

    // Four-term rule for controlled rotations, whose generator |1⟩⟨1| ⊗ P/2 has eigenvalues {0, ±1/2}
    // (Wierichs et al. 2022; Anselmetti et al. 2021): shifts ±π/2, ±3π/2 with these coefficients.
    private static readonly double D1 = (Math.Sqrt(2) + 1) / (4 * Math.Sqrt(2));
    private static readonly double D2 = (Math.Sqrt(2) - 1) / (4 * Math.Sqrt(2));

    /// <summary>Parameter-shift gradient of Σ_k g[k]·E_k for the given slots (all differentiable ones, or the parameter-dependent ones when no input gradient is wanted); every shifted evaluation is counted.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ShiftRow(Workspace ws, ReadOnlySpan<double> g, Span<double> gTheta, int kt, int[] slots, int hardware)
    {
        var theta = ws.Theta;
        var o1 = ws.Out; var o2 = ws.Out2;
        int K = OutputCount;
        foreach (int s in slots)
        {
            double t0 = theta[s];
            bool controlled = C.Primitives[C.SlotPrimitive[s]].IsControlledRotation;
            double acc = 0;
            // Two-term rule (Mitarai et al. 2018; Schuld et al. 2019): dE/dθ = [E(θ+π/2) − E(θ−π/2)] / 2.
            theta[s] = t0 + Math.PI / 2; EvaluateRow(ws, theta, o1, kt);
            theta[s] = t0 - Math.PI / 2; EvaluateRow(ws, theta, o2, kt);
            double c1 = controlled ? D1 : 0.5;
            for (int k = 0; k < K; k++) acc += g[k] * c1 * (o1[k] - o2[k]);
            if (controlled)
            {
                theta[s] = t0 + 3 * Math.PI / 2; EvaluateRow(ws, theta, o1, kt);
                theta[s] = t0 - 3 * Math.PI / 2; EvaluateRow(ws, theta, o2, kt);
                for (int k = 0; k < K; k++) acc -= g[k] * D2 * (o1[k] - o2[k]);
            }
            theta[s] = t0;
            gTheta[s] = acc;
        }
        ws.Hardware += hardware;
    }

    // ---------------- shared measurement helpers ----------------

    /// <summary>Applies the basis change of a setting (H for X, S†·H for Y) to a state of the given bits.</summary>
    protected static void RotateToSetting(double[] re, double[] im, int bits, int qubits, MeasurementPlan.Setting s, bool density, int kt)
    {
        for (int q = 0; q < qubits; q++)
        {
            ulong b = 1UL << q;
            if ((s.YBasis & b) != 0)
            {
                StateKernels.ApplyDiag1(re, im, bits, q, 1, 0, 0, -1, kt);
                if (density) StateKernels.ApplyDiag1(re, im, bits, q + qubits, 1, 0, 0, 1, kt);
            }
            if (((s.XBasis | s.YBasis) & b) != 0)
            {
                StateKernels.Apply1(re, im, bits, q, Mat2.H, kt);
                if (density) StateKernels.Apply1(re, im, bits, q + qubits, Mat2.H, kt);
            }
        }
    }

    /// <summary>Applies per-qubit read-out confusion to a probability vector in place.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    protected static void ApplyReadout(Span<double> prob, int qubits, double[] p01, double[] p10)
    {
        for (int q = 0; q < qubits; q++)
        {
            double a = p01[q], b = p10[q];
            if (a == 0 && b == 0) continue;
            int stride = 1 << q;
            for (int j = 0; j < prob.Length; j++)
            {
                if ((j & stride) != 0) continue;
                double x0 = prob[j], x1 = prob[j | stride];
                prob[j] = (1 - a) * x0 + b * x1;
                prob[j | stride] = a * x0 + (1 - b) * x1;
            }
        }
    }

    /// <summary>Adds the exact expectations of a setting's terms, from its (read-out-confused) probabilities.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    protected static void AddExpectationsFromProbabilities(ReadOnlySpan<double> prob, MeasurementPlan.Setting s, Span<double> outputs, double factor)
    {
        foreach (var e in s.EntryArray)
        {
            double sum = 0;
            long m = (long)e.Support;
            for (int j = 0; j < prob.Length; j++)
                sum += (System.Numerics.BitOperations.PopCount((ulong)(j & m)) & 1) == 0 ? prob[j] : -prob[j];
            outputs[e.Output] += factor * e.Weight * sum;
        }
    }

    /// <summary>
    /// Samples <paramref name="shots"/> bit strings from prob (turned into a cumulative table in place), flips
    /// each read-out bit with the confusion probabilities, and adds factor·weight·(mean parity) per term.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    protected static void AddSampledExpectations(Span<double> prob, int qubits, MeasurementPlan.Setting s, int shots, RandomStream rng,
        double[]? p01, double[]? p10, Span<double> outputs, double factor, Span<double> termSums)
    {
        double total = 0;
        for (int j = 0; j < prob.Length; j++) { total += prob[j]; prob[j] = total; }
        var entries = s.EntryArray;
        termSums[..entries.Length].Clear();
        for (int shot = 0; shot < shots; shot++)
        {
            double u = rng.NextDouble() * total;
            int lo = 0, hi = prob.Length - 1;
            while (lo < hi)
            {
                int mid = (lo + hi) >> 1;
                if (prob[mid] > u) hi = mid; else lo = mid + 1;
            }
            long bitsOut = lo;
            if (p01 != null && p10 != null)
                for (int q = 0; q < qubits; q++)
                {
                    bool one = ((bitsOut >> q) & 1) != 0;
                    double pf = one ? p10[q] : p01[q];
                    if (pf > 0 && rng.NextDouble() < pf) bitsOut ^= 1L << q;
                }
            for (int t = 0; t < entries.Length; t++)
                termSums[t] += (System.Numerics.BitOperations.PopCount((ulong)bitsOut & entries[t].Support) & 1) == 0 ? 1 : -1;
        }
        for (int t = 0; t < entries.Length; t++) outputs[entries[t].Output] += factor * entries[t].Weight * termSums[t] / shots;
    }

    protected void AddConstants(Span<double> outputs)
    {
        for (int k = 0; k < outputs.Length; k++) outputs[k] += Plan.Constant[k];
    }
}
