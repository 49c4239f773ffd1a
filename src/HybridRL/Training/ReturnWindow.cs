namespace HybridRL.Training;

/// <summary>Mean of the most recent episode returns (the training-return metric), checkpointable.</summary>
public sealed class ReturnWindow
{
    private readonly double[] _values;
    private int _next;
    private int _count;

    public ReturnWindow(int size)
    {
        if (size <= 0) throw new ArgumentOutOfRangeException(nameof(size));
        _values = new double[size];
    }

    public int Count => _count;

    public void Add(double episodeReturn)
    {
        _values[_next] = episodeReturn;
        _next = (_next + 1) % _values.Length;
        if (_count < _values.Length) _count++;
    }

    /// <summary>Mean in insertion order (fixed summation order), or null before any episode ended.</summary>
    public double? Mean()
    {
        if (_count == 0) return null;
        double s = 0;
        int start = _count < _values.Length ? 0 : _next;
        for (int k = 0; k < _count; k++) s += _values[(start + k) % _values.Length];
        return s / _count;
    }

    public void Save(BinaryWriter w)
    {
        w.Write(_values.Length);
        w.Write(_next);
        w.Write(_count);
        foreach (var v in _values) w.Write(v);
    }

    public void Load(BinaryReader r)
    {
        int n = r.ReadInt32();
        if (n != _values.Length) throw new InvalidDataException($"return window of size {n} in checkpoint, expected {_values.Length}");
        _next = r.ReadInt32();
        _count = r.ReadInt32();
        for (int i = 0; i < n; i++) _values[i] = r.ReadDouble();
    }
}
