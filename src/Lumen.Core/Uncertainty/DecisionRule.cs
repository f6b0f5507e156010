namespace Lumen.Uncertainty;

/// <summary>How a verdict treats measurement uncertainty (docs/methods/uncertainty.md §5).</summary>
public enum DecisionRule
{
    /// <summary>Simple acceptance: the measured value against the limit, uncertainty not considered (ILAC-G8:09/2019 §4.2.1).</summary>
    Simple,

    /// <summary>Guarded acceptance with a guard band w = U (k = 2) (ILAC-G8:09/2019 §4.2.3; ISO 14253-1:2017): pass only
    /// inside the limit by at least U, fail only outside it by at least U, otherwise inconclusive.</summary>
    Guarded,
}
