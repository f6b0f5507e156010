namespace Lumen.Graphics;

/// <summary>
/// One rounding rule per quantity for everything a report prints (tables, statistics, verdicts), so a value never
/// shows 94.37353 in one table and 94.4 in another: the result fields' rule is Core's
/// <see cref="Lumen.Analysis.ResultFields.DisplayFormat"/> (shared with the text tables); steps and capability indices
/// to 0.01 are the report's own.
/// </summary>
internal static class Rounding
{
    /// <summary>Capability indices (Ppk, Cpk) and their intervals.</summary>
    public const string CapabilityIndex = "0.00";

    /// <summary>The format of a value of a field: a result-field path (<see cref="Lumen.Analysis.ResultFields.DisplayFormat"/>,
    /// the rule every text output shares), a chromaticity criterion or <c>steps_from_target</c>.</summary>
    public static string Value(string field) => field switch
    {
        "steps_from_target" => "0.00",
        "delta_uv_from_target" => "0.0000",
        _ when field.StartsWith("chromaticity:", StringComparison.Ordinal) => field.Contains("step", StringComparison.Ordinal) ? "0.00" : "0.0000",
        _ => Lumen.Analysis.ResultFields.DisplayFormat(field),
    };

    /// <summary>The format of a spread (SD) or a margin of a field: the value's digits without a forced sign.</summary>
    public static string Spread(string field) => Value(field) == "+0.0000;-0.0000;0.0000" ? "0.0000" : Value(field);
}
