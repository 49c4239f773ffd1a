namespace HybridRL.Quantum.Circuits;

/// <summary>
/// Running, thread-safe counters of circuit executions and shots performed by a simulator,
/// plus the number of executions real hardware would have needed for the same work
/// (parameter-shift evaluations in place of adjoint sweeps). Settable for checkpoint restore.
/// </summary>
public sealed class ExecutionCounters
{
    private long _executions, _shots, _hardware;

    /// <summary>Circuit executions simulated (each measurement setting of each row counts once).</summary>
    public long CircuitExecutions => Interlocked.Read(ref _executions);
    /// <summary>Shots sampled.</summary>
    public long Shots => Interlocked.Read(ref _shots);
    /// <summary>Executions a device would have needed (adjoint gradients priced as parameter shift).</summary>
    public long HardwareExecutions => Interlocked.Read(ref _hardware);

    public void Add(long executions, long shots, long hardwareExecutions)
    {
        if (executions < 0 || shots < 0 || hardwareExecutions < 0) throw new ArgumentOutOfRangeException(nameof(executions), "counter increments must be non-negative");
        if (executions != 0) Interlocked.Add(ref _executions, executions);
        if (shots != 0) Interlocked.Add(ref _shots, shots);
        if (hardwareExecutions != 0) Interlocked.Add(ref _hardware, hardwareExecutions);
    }

    public void Reset() => Set(0, 0, 0);

    public void Set(long executions, long shots, long hardwareExecutions)
    {
        if (executions < 0 || shots < 0 || hardwareExecutions < 0) throw new ArgumentOutOfRangeException(nameof(executions), "counters must be non-negative");
        Interlocked.Exchange(ref _executions, executions);
        Interlocked.Exchange(ref _shots, shots);
        Interlocked.Exchange(ref _hardware, hardwareExecutions);
    }

    public override string ToString() => $"executions={CircuitExecutions} shots={Shots} hardware_executions={HardwareExecutions}";
}
