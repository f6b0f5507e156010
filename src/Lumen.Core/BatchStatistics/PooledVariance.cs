namespace Lumen.BatchStatistics;

/// <summary>
/// The pooled within-subgroup standard deviation s_p = √(Σ(nᵢ − 1)sᵢ² / Σ(nᵢ − 1)) of values arriving in subgroups
/// (docs/methods/conformance.md §5): the σ of a Cpk. Subgroups are named; <see cref="Close"/> folds a finished subgroup
/// into the pooled sums so consecutive subgroups of a long batch need no memory. Subgroups of one value add nothing.
/// </summary>
public sealed class PooledVariance
{
    private readonly Dictionary<string, RunningStatistics> _open = new(StringComparer.Ordinal);
    private double _sumSquares;
    private long _degrees, _subgroups, _count;

    /// <summary>Adds a value to a subgroup (non-finite values are ignored).</summary>
    /// <param name="subgroup">The subgroup's name.</param>
    /// <param name="x">The value.</param>
    public void Add(string subgroup, double x)
    {
        ArgumentNullException.ThrowIfNull(subgroup);
        if (!double.IsFinite(x)) return;
        if (!_open.TryGetValue(subgroup, out var s)) _open[subgroup] = s = new RunningStatistics();
        s.Add(x);
    }

    /// <summary>Folds a subgroup into the pooled sums (no effect when it is not open).</summary>
    /// <param name="subgroup">The subgroup's name.</param>
    public void Close(string subgroup)
    {
        ArgumentNullException.ThrowIfNull(subgroup);
        if (!_open.Remove(subgroup, out var s)) return;
        Fold(s);
    }

    private void Fold(RunningStatistics s)
    {
        _subgroups++;
        _count += s.Count;
        if (s.Count < 2) return;
        double sd = s.StandardDeviation;
        _sumSquares += (s.Count - 1) * sd * sd;
        _degrees += s.Count - 1;
    }

    /// <summary>Closes every open subgroup.</summary>
    public void CloseAll()
    {
        foreach (var s in _open.Values) Fold(s);
        _open.Clear();
    }

    /// <summary>Number of closed subgroups.</summary>
    public long Subgroups => _subgroups;

    /// <summary>Values in closed subgroups.</summary>
    public long Count => _count;

    /// <summary>Degrees of freedom Σ(nᵢ − 1) of the closed subgroups.</summary>
    public long DegreesOfFreedom => _degrees;

    /// <summary>The pooled SD of the closed subgroups; NaN without degrees of freedom.</summary>
    public double StandardDeviation => _degrees > 0 ? Math.Sqrt(_sumSquares / _degrees) : double.NaN;
}
