namespace Lumen.Conformance;

/// <summary>A limit on one result field.</summary>
/// <param name="Field">Path into the analyze JSON object, e.g. <c>cri.ra</c>, <c>cri.r9</c>.</param>
/// <param name="Min">Lower limit (inclusive), or null.</param>
/// <param name="Max">Upper limit (inclusive), or null.</param>
/// <param name="Line">Line of the limit in the spec file (for messages).</param>
public sealed record FieldLimit(string Field, double? Min, double? Max, int Line)
{
    /// <summary>Readable limit, e.g. "≥ 90" or "80 … 90".</summary>
    public string Description => (Min, Max) switch
    {
        ({ } lo, { } hi) => $"{lo:G6} … {hi:G6}",
        ({ } lo, null) => $">= {lo:G6}",
        (null, { } hi) => $"<= {hi:G6}",
        _ => "",
    };
}
