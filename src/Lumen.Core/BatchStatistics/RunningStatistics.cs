namespace Lumen.BatchStatistics;

/// <summary>Running mean, standard deviation, minimum and maximum (Welford's algorithm).</summary>
public sealed class RunningStatistics
{
    private double _mean, _m2;

    /// <summary>Number of values.</summary>
    public long Count { get; private set; }

    /// <summary>Mean (NaN when empty).</summary>
    public double Mean => Count > 0 ? _mean : double.NaN;

    /// <summary>Sample standard deviation (n − 1; NaN below two values).</summary>
    public double StandardDeviation => Count > 1 ? Math.Sqrt(_m2 / (Count - 1)) : double.NaN;

    /// <summary>Minimum (NaN when empty).</summary>
    public double Min { get; private set; } = double.NaN;

    /// <summary>Maximum (NaN when empty).</summary>
    public double Max { get; private set; } = double.NaN;

    /// <summary>Adds a value (non-finite values are ignored).</summary>
    /// <param name="x">The value to add, in the field's unit; NaN and infinities are ignored.</param>
    public void Add(double x)
    {
        if (!double.IsFinite(x)) return;
        Count++;
        double d = x - _mean;
        _mean += d / Count;
        _m2 += d * (x - _mean);
        Min = Count == 1 ? x : Math.Min(Min, x);
        Max = Count == 1 ? x : Math.Max(Max, x);
    }
}
