using System.Runtime.InteropServices;
using Lumen.Analysis;
using Lumen.Colorimetry;
using Lumen.Conformance;

namespace Lumen.BatchStatistics;

/// <summary>
/// Accumulates a batch record by record (input order not required) and builds the summary.
/// </summary>
/// <remarks>Memory: the spectra are never kept; per result it keeps u′v′ (two floats), the steps from the
/// target (one float) and the ID as UTF-8 in shared blocks — about 30 bytes a unit, for the percentile, outlier and spread
/// statistics. Outliers: robust z of the Δu′v′ distance from the coordinate-wise median, with MAD scaled by
/// 1.4826 and the 3.5 cut-off of Iglewicz and Hoaglin (common practice). Capability: Ppk from the overall SD with
/// Bissell's approximate 95 % interval (<see cref="CapabilityIndex"/>), for every limited field and, under an ellipse-steps
/// tolerance, for the steps from the target against the allowed steps (one-sided); with subgroups
/// (<see cref="BatchSummaryOptions"/>) also Cpk from the pooled within-subgroup SD. With a grouping key, one child
/// summary per value, each exactly what a separate batch of that group's records would give.</remarks>
public sealed class BatchSummaryBuilder
{
    /// <summary>Fields summarised with mean/SD/min/max.</summary>
    public static IReadOnlyList<string> SummaryFields { get; } = ["cct.kelvin", "cct.duv", "cri.ra", "cri.r9", "fidelity.rf", "fidelity.rg"];

    private readonly Dictionary<string, RunningStatistics> _stats = SummaryFields.ToDictionary(f => f, _ => new RunningStatistics(), StringComparer.Ordinal);
    private readonly Dictionary<string, RunningStatistics> _limited;
    private readonly IReadOnlyList<(string Field, double? Min, double? Max)> _limits;
    private readonly List<float> _u = [], _v = [], _stepsTarget = [];
    private readonly IdArena _ids = new();
    private readonly StepEllipse? _ellipse; // the spec's step metric (its shape, moved to the batch mean); null without a target
    private readonly double? _allowedSteps; // the ellipse-steps tolerance, for the chromaticity capability row
    private readonly List<long> _pointRecord = []; // the record ordinal of each defined chromaticity
    private float[]? _robustZ; // per defined chromaticity, after Build
    private readonly PreparedSpec _spec;
    private readonly BatchSummaryOptions _options;
    private readonly Dictionary<string, PooledVariance>? _pooled; // per capability field, with subgroups
    private readonly Dictionary<string, BatchSummaryBuilder>? _groups;
    private string? _openSubgroup;
    private long _records, _errors, _passed, _failed, _results, _inconclusive;
    private Lumen.Uncertainty.DecisionRule _rule = Lumen.Uncertainty.DecisionRule.Simple;

    /// <summary>Robust z above which a unit is a chromaticity outlier (Iglewicz and Hoaglin; common practice).</summary>
    public const double OutlierZ = 3.5;

    /// <summary>Creates a builder for a batch judged against <paramref name="spec"/>.</summary>
    /// <param name="spec">The prepared specification: its limits give the capability fields, its ellipse the step metric.</param>
    /// <param name="options">Groups and subgroups; null for none.</param>
    public BatchSummaryBuilder(PreparedSpec spec, BatchSummaryOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(spec);
        _spec = spec;
        _options = options ?? BatchSummaryOptions.None;
        if (_options.SubgroupSize is < 2) throw new ArgumentOutOfRangeException(nameof(options), "A subgroup needs at least 2 results.");
        _limits = spec.Spec.Limits.Select(l => (l.Field, l.Min, l.Max)).ToArray();
        _limited = _limits.Select(l => l.Field).Distinct().ToDictionary(f => f, _ => new RunningStatistics(), StringComparer.Ordinal);
        _ellipse = spec.Ellipse;
        if (spec.Spec.Target is not null && spec.Spec.Tolerance.Kind == ToleranceKind.EllipseSteps) _allowedSteps = spec.Spec.Tolerance.Value;
        if (_options.SubgroupRule is not null)
        {
            _pooled = _limited.Keys.ToDictionary(f => f, _ => new PooledVariance(), StringComparer.Ordinal);
            if (_allowedSteps is not null) _pooled[StepsField] = new PooledVariance();
        }
        if (_options.GroupBy is not null) _groups = new Dictionary<string, BatchSummaryBuilder>(StringComparer.Ordinal);
    }

    private const string StepsField = "steps_from_target";

    /// <summary>Adds one record's outcome: a result with its verdict, or an error.</summary>
    /// <param name="outcome">The outcome (judged against the same specification).</param>
    public void Add(RecordOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(outcome);
        if (_groups is not null)
        {
            string value = outcome.Record.MetadataValue(_options.GroupBy!) ?? "";
            if (!_groups.TryGetValue(value, out var child))
                _groups[value] = child = new BatchSummaryBuilder(_spec, _options with { GroupBy = null });
            child.Add(outcome);
        }
        _rule = outcome.Rule;
        if (outcome.Assessment is { } a)
        {
            string status = outcome.Status;
            AddResult(outcome.Record.Name, a.Chromaticity2Degree, status is "pass" or "ok", p => ResultFields.Get(a, p), outcome.Verdict?.StepsFromTarget,
                _options.GroupBy is { } key ? outcome.Record.MetadataValue(key) ?? "" : null, status == "inconclusive");
        }
        else AddError();
    }

    /// <summary>Counts a record that could not be read or computed.</summary>
    internal void AddError() { _records++; _errors++; }

    /// <summary>The subgroup of the next result: consecutive blocks when a size is set, else the group value.</summary>
    private string? Subgroup(string? groupValue)
    {
        if (_pooled is null) return null;
        string key = _options.SubgroupSize is { } n ? (_results / n).ToString(System.Globalization.CultureInfo.InvariantCulture) : groupValue ?? "";
        if (_options.SubgroupSize is not null && _openSubgroup is { } open && open != key)
            foreach (var p in _pooled.Values) p.Close(open); // a finished consecutive subgroup needs no memory
        _openSubgroup = key;
        return key;
    }

    /// <summary>Adds a result.</summary>
    /// <param name="id">The record's ID (name), used to list outliers.</param>
    /// <param name="chromaticity2Degree">Its 2° chromaticity.</param>
    /// <param name="pass">Pass/fail against the spec.</param>
    /// <param name="field">Field resolver (summary and limited fields).</param>
    /// <param name="stepsFromTarget">Steps from the target, or null.</param>
    /// <param name="groupValue">The record's value of the grouping key (the subgroup when no size is set), or null.</param>
    /// <param name="inconclusive">Guarded acceptance found the unit too close to a limit to call (counted apart from pass and fail).</param>
    internal void AddResult(string id, Chromaticity chromaticity2Degree, bool pass, Func<string, double?> field, double? stepsFromTarget, string? groupValue = null, bool inconclusive = false)
    {
        ArgumentNullException.ThrowIfNull(field);
        string? subgroup = Subgroup(groupValue);
        long ordinal = _records;
        _records++;
        _results++;
        if (inconclusive) _inconclusive++;
        else if (pass) _passed++;
        else _failed++;
        foreach (var (name, s) in _stats) s.Add(field(name) ?? double.NaN);
        foreach (var (name, s) in _limited)
        {
            double x = field(name) ?? double.NaN;
            s.Add(x);
            if (subgroup is not null) _pooled![name].Add(subgroup, x);
        }
        if (subgroup is not null && _allowedSteps is not null) _pooled![StepsField].Add(subgroup, stepsFromTarget ?? double.NaN);
        if (chromaticity2Degree.IsDefined)
        {
            _pointRecord.Add(ordinal);
            _u.Add((float)chromaticity2Degree.UPrime);
            _v.Add((float)chromaticity2Degree.VPrime);
            _ids.Add(id);
            _stepsTarget.Add(stepsFromTarget is { } st ? (float)st : float.NaN);
        }
    }

    /// <summary>Builds the summary.</summary>
    /// <returns>The summary.</returns>
    public BatchSummary Build()
    {
        int n = _u.Count;
        double mu = 0, mv = 0;
        for (int i = 0; i < n; i++) { mu += _u[i]; mv += _v[i]; }
        mu = n > 0 ? mu / n : double.NaN; mv = n > 0 ? mv / n : double.NaN;

        var fromMean = new RunningStatistics();
        var fromMeanValues = new double[n];
        var mean = Chromaticity.FromUPrimeVPrime(mu, mv);
        var aroundMean = _ellipse?.MovedTo(mean).Measure(); // once, not once per record
        for (int i = 0; i < n; i++)
        {
            var c = Chromaticity.FromUPrimeVPrime(_u[i], _v[i]);
            fromMeanValues[i] = aroundMean is { } m ? m.Steps(c) : c.DeltaUPrimeVPrime(mean) / StandardEllipses.UPrimeVPrimePerStep;
            fromMean.Add(fromMeanValues[i]);
        }
        var fromTarget = new RunningStatistics();
        var targetValues = new double[_stepsTarget.Count(float.IsFinite)];
        int t = 0;
        foreach (var x in _stepsTarget)
        {
            if (!float.IsFinite(x)) continue;
            targetValues[t++] = x;
            fromTarget.Add(x);
        }

        if (_pooled is not null) foreach (var p in _pooled.Values) p.CloseAll();
        var caps = _limits.Select(l => CapabilityIndex.Of(l.Field, _limited[l.Field], l.Min, l.Max, _pooled?[l.Field])).ToList();
        if (_allowedSteps is { } allowed) caps.Add(CapabilityIndex.Of(StepsField, fromTarget, null, allowed, _pooled?[StepsField]));

        var groups = _groups?.OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => new GroupSummary(g.Key, g.Value.Build())).ToArray();
        return new BatchSummary(_records, _records - _errors, _errors, _passed, _failed,
            _stats, mu, mv, MaxPairwise(), fromMean, OrderStatistics.Percentile(fromMeanValues, 0.95), fromTarget, OrderStatistics.Percentile(targetValues, 0.95), Outliers(), caps) // both arrays are this method's own: rearranged, not copied
        {
            GroupedBy = _options.GroupBy,
            Inconclusive = _inconclusive,
            Rule = _rule,
            Groups = groups ?? [],
            SubgroupRule = _options.SubgroupRule,
        };
    }

    /// <summary>
    /// The robust z of a record's chromaticity (Δu′v′ from the batch median against the MAD, as for the outliers), by the
    /// record's ordinal in the order records were added; NaN for an error, an undefined chromaticity, or a batch too small
    /// or too uniform for a MAD. Available after <see cref="Build"/>.
    /// </summary>
    /// <param name="record">Zero-based ordinal of the record among all records added (errors included).</param>
    /// <returns>The robust z, or NaN.</returns>
    public double RobustZ(long record)
    {
        if (_robustZ is null) throw new InvalidOperationException("Build the summary first.");
        // Ordinals ascend and skip only errors and undefined chromaticities: with none before it, a record's point is at
        // its own ordinal, so look there first (the output copy asks for every record in order: a binary search each was
        // about a tenth of the work after the last row). Otherwise search.
        int i = record >= 0 && record < _pointRecord.Count && _pointRecord[(int)record] == record ? (int)record : _pointRecord.BinarySearch(record);
        return i >= 0 ? _robustZ[i] : double.NaN;
    }

    /// <summary>Linear-interpolated percentile (common practice, "type 7").</summary>
    /// <param name="values">Values (copied; see <see cref="OrderStatistics.Percentile"/>).</param>
    /// <param name="p">Fraction in [0, 1].</param>
    /// <returns>The percentile, NaN when empty.</returns>
    public static double Percentile(IReadOnlyCollection<double> values, double p)
    {
        ArgumentNullException.ThrowIfNull(values);
        return OrderStatistics.Percentile(values.ToArray(), p);
    }

    private double MaxPairwise() => LargestDistance(CollectionsMarshal.AsSpan(_u), CollectionsMarshal.AsSpan(_v));

    /// <summary>
    /// The largest distance between two points (u′v′ here): the largest distance between two vertices of their convex
    /// hull (monotone chain, A. M. Andrew, Information Processing Letters 9(5), 1979). Points strictly inside the
    /// quadrilateral of the four extreme points cannot be hull vertices and are dropped before the sort (S. G. Akl and
    /// G. T. Toussaint, Information Processing Letters 7(5), 1978): in a batch's tight cloud that leaves a few percent,
    /// and sorting 100,000 pairs took tens of milliseconds after the last row.
    /// </summary>
    internal static double LargestDistance(ReadOnlySpan<float> u, ReadOnlySpan<float> v)
    {
        int n = u.Length;
        if (n < 2) return 0;
        int left = 0, right = 0, bottom = 0, top = 0;
        for (int i = 1; i < n; i++)
        {
            if (u[i] < u[left]) left = i;
            if (u[i] > u[right]) right = i;
            if (v[i] < v[bottom]) bottom = i;
            if (v[i] > v[top]) top = i;
        }
        (double, double) l = (u[left], v[left]), b = (u[bottom], v[bottom]), r = (u[right], v[right]), t = (u[top], v[top]);
        static double Cross((double, double) o, (double, double) a, (double, double) b) => (a.Item1 - o.Item1) * (b.Item2 - o.Item2) - (a.Item2 - o.Item2) * (b.Item1 - o.Item1);
        var candidates = new List<(double, double)>();
        for (int i = 0; i < n; i++)
        {
            (double, double) p = (u[i], v[i]);
            // Counter-clockwise left, bottom, right, top: strictly left of every edge is strictly inside (a repeated
            // corner gives an edge of no length, where nothing is strictly inside, so nothing is dropped).
            if (Cross(l, b, p) > 0 && Cross(b, r, p) > 0 && Cross(r, t, p) > 0 && Cross(t, l, p) > 0) continue;
            candidates.Add(p);
        }
        var pts = candidates.ToArray();
        Array.Sort(pts);
        var hull = new List<(double, double)>();
        foreach (var p in pts) { while (hull.Count >= 2 && Cross(hull[^2], hull[^1], p) <= 0) hull.RemoveAt(hull.Count - 1); hull.Add(p); }
        int lower = hull.Count + 1;
        for (int i = pts.Length - 2; i >= 0; i--) { var p = pts[i]; while (hull.Count >= lower && Cross(hull[^2], hull[^1], p) <= 0) hull.RemoveAt(hull.Count - 1); hull.Add(p); }
        double best = 0;
        for (int i = 0; i < hull.Count; i++)
            for (int j = i + 1; j < hull.Count; j++)
            {
                double du = hull[i].Item1 - hull[j].Item1, dv = hull[i].Item2 - hull[j].Item2;
                best = Math.Max(best, Math.Sqrt(du * du + dv * dv));
            }
        return best;
    }

    private IReadOnlyList<Outlier> Outliers()
    {
        int n = _u.Count;
        _robustZ = new float[n];
        Array.Fill(_robustZ, float.NaN);
        if (n < 5) return [];
        var work = new double[n];
        for (int i = 0; i < n; i++) work[i] = _u[i];
        double mu = OrderStatistics.Median(work);
        for (int i = 0; i < n; i++) work[i] = _v[i];
        double mv = OrderStatistics.Median(work);
        var d = new double[n];
        for (int i = 0; i < n; i++) { double du = _u[i] - mu, dv = _v[i] - mv; d[i] = Math.Sqrt(du * du + dv * dv); }
        d.CopyTo(work, 0);
        double md = OrderStatistics.Median(work);
        for (int i = 0; i < n; i++) work[i] = Math.Abs(d[i] - md);
        double mad = OrderStatistics.Median(work);
        if (!(mad > 0)) return [];
        var list = new List<Outlier>();
        for (int i = 0; i < n; i++)
        {
            double z = (d[i] - md) / (1.4826 * mad);
            _robustZ[i] = (float)z;
            if (z > OutlierZ) list.Add(new Outlier(_ids.Get(i), d[i], z));
        }
        return list.OrderByDescending(o => o.RobustZ).ToArray();
    }

    /// <summary>IDs stored as UTF-8 in large shared blocks (about 4 bytes of overhead per ID instead of ~40).</summary>
    private sealed class IdArena
    {
        private const int BlockSize = 1 << 20;
        private readonly List<byte[]> _blocks = [];
        private readonly List<long> _starts = [];
        private int _used = BlockSize;

        public void Add(string id)
        {
            var bytes = System.Text.Encoding.UTF8.GetBytes(id);
            if (bytes.Length > ushort.MaxValue) bytes = bytes[..ushort.MaxValue];
            if (_used + bytes.Length + 2 > BlockSize) { _blocks.Add(new byte[Math.Max(BlockSize, bytes.Length + 2)]); _used = 0; }
            var block = _blocks[^1];
            block[_used] = (byte)(bytes.Length >> 8);
            block[_used + 1] = (byte)bytes.Length;
            bytes.CopyTo(block, _used + 2);
            _starts.Add(((long)(_blocks.Count - 1) << 32) | (uint)_used);
            _used += bytes.Length + 2;
        }

        public string Get(int index)
        {
            long s = _starts[index];
            var block = _blocks[(int)(s >> 32)];
            int at = (int)(s & 0xFFFFFFFF);
            int len = (block[at] << 8) | block[at + 1];
            return System.Text.Encoding.UTF8.GetString(block, at + 2, len);
        }
    }
}
