using Lumen.Conformance;

namespace Lumen.Uncertainty;

/// <summary>Decisions under a <see cref="DecisionRule"/> (docs/methods/uncertainty.md §5).</summary>
public static class Decisions
{
    /// <summary>One criterion: simple acceptance uses the margin's sign; guarded acceptance passes when margin ≥ U, fails
    /// when margin ≤ −U and is inconclusive between (U the expanded uncertainty of the measured value, k = 2).</summary>
    /// <param name="margin">Distance to the limit on the passing side (negative = outside); null when not computed (fails).</param>
    /// <param name="pass">The criterion's simple verdict.</param>
    /// <param name="expanded">Expanded uncertainty U of the measured value, or null when unknown (then the simple verdict stands).</param>
    /// <param name="rule">The rule.</param>
    /// <returns>The decision.</returns>
    public static Decision Of(double? margin, bool pass, double? expanded, DecisionRule rule)
    {
        if (rule == DecisionRule.Simple || margin is not { } m || expanded is not { } u || !double.IsFinite(u)) return pass ? Decision.Pass : Decision.Fail;
        if (m >= u) return Decision.Pass;
        if (m <= -u) return Decision.Fail;
        return Decision.Inconclusive;
    }

    /// <summary>A unit: fail when any criterion fails, else inconclusive when any is, else pass.</summary>
    /// <param name="verdict">The simple verdict.</param>
    /// <param name="uncertainty">The unit's uncertainty (its criteria aligned with the verdict's), or null.</param>
    /// <param name="rule">The rule.</param>
    /// <returns>The unit's decision and each criterion's.</returns>
    public static (Decision Unit, IReadOnlyList<Decision> Criteria) Of(Verdict verdict, UncertaintyResult? uncertainty, DecisionRule rule)
    {
        ArgumentNullException.ThrowIfNull(verdict);
        var list = new Decision[verdict.Criteria.Count];
        for (int i = 0; i < list.Length; i++)
        {
            var c = verdict.Criteria[i];
            double? u = uncertainty is not null && i < uncertainty.Criteria.Count ? uncertainty.Criteria[i]?.Expanded : null;
            list[i] = Of(c.Margin, c.Pass, u, rule);
        }
        var unit = list.Contains(Decision.Fail) ? Decision.Fail : list.Contains(Decision.Inconclusive) ? Decision.Inconclusive : Decision.Pass;
        return (unit, list);
    }

    /// <summary>The rule stated for every verdict output.</summary>
    public static string Describe(DecisionRule rule) => rule == DecisionRule.Guarded
        ? "guarded acceptance (ILAC-G8:09/2019, ISO 14253-1:2017): pass only inside each limit by at least the expanded uncertainty U (k = 2), fail only outside it by at least U, otherwise inconclusive"
        : "simple acceptance (ILAC-G8:09/2019): the measured value against each limit; measurement uncertainty not considered";
}
