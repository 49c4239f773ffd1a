using System.Diagnostics;

namespace HybridRL.Quantum.Simulation;

/// <summary>Memory throughput of the single-qubit gate kernel against a plain copy of the same buffers (for benchmarks).</summary>
public static class KernelThroughput
{
    /// <param name="GateBytesPerSecond">Bytes read plus written per second while applying single-qubit gates.</param>
    /// <param name="CopyBytesPerSecond">Bytes read plus written per second copying the same buffers.</param>
    public sealed record Result(int Qubits, int Threads, double GateBytesPerSecond, double CopyBytesPerSecond, double GateSecondsPerSweep, double CopySecondsPerSweep)
    {
        public double Ratio => GateBytesPerSecond / CopyBytesPerSecond;
    }

    /// <summary>
    /// Applies <paramref name="sweeps"/> non-diagonal single-qubit gates (cycling over all qubits, so low and high
    /// strides are both measured) to a <paramref name="qubits"/>-qubit state, and copies the same re/im buffers as
    /// many times; each repetition pass is timed and the fastest of <paramref name="repeats"/> is kept.
    /// </summary>
    public static Result MeasureSingleQubitSweep(int qubits = 22, int sweeps = 22, int threads = 1, int repeats = 3)
    {
        if (qubits < 2 || qubits > 26) throw new ArgumentOutOfRangeException(nameof(qubits), qubits, "qubits must be between 2 and 26");
        if (sweeps < 1) throw new ArgumentOutOfRangeException(nameof(sweeps), sweeps, "sweeps must be positive");
        if (threads < 1) throw new ArgumentOutOfRangeException(nameof(threads), threads, "threads must be positive");
        long dim = 1L << qubits;
        var re = new double[dim]; var im = new double[dim];
        var re2 = new double[dim]; var im2 = new double[dim];
        for (long j = 0; j < dim; j++) { re[j] = 1.0 / Math.Sqrt(dim); im[j] = 0; }
        var m = Mat2.RY(0.37);
        var parts = threads;
        void Copy()
        {
            if (parts <= 1 || qubits < StateKernels.ParallelBits)
            {
                Array.Copy(re, re2, dim);
                Array.Copy(im, im2, dim);
                return;
            }
            Parallel.For(0, parts, new ParallelOptions { MaxDegreeOfParallelism = parts }, p =>
            {
                long a = dim * p / parts, b = dim * (p + 1) / parts;
                Array.Copy(re, a, re2, a, b - a);
                Array.Copy(im, a, im2, a, b - a);
            });
        }
        // warm-up (JIT and page faults)
        StateKernels.Apply1(re, im, qubits, 0, m, threads);
        StateKernels.Apply1(re, im, qubits, qubits - 1, m, threads);
        Copy();
        double bestGate = double.MaxValue, bestCopy = double.MaxValue;
        for (int r = 0; r < repeats; r++)
        {
            var sw = Stopwatch.StartNew();
            for (int s = 0; s < sweeps; s++) StateKernels.Apply1(re, im, qubits, s % qubits, m, threads);
            bestGate = Math.Min(bestGate, sw.Elapsed.TotalSeconds / sweeps);
            sw.Restart();
            for (int s = 0; s < sweeps; s++) Copy();
            bestCopy = Math.Min(bestCopy, sw.Elapsed.TotalSeconds / sweeps);
        }
        double bytes = 2.0 * 2 * dim * sizeof(double); // re and im, each read once and written once
        return new Result(qubits, threads, bytes / bestGate, bytes / bestCopy, bestGate, bestCopy);
    }
}
