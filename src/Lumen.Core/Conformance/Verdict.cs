namespace Lumen.Conformance;

/// <summary>Pass/fail of one spectrum against a specification.</summary>
/// <param name="Pass">True when every criterion passes.</param>
/// <param name="Criteria">The criteria in spec order (chromaticity first).</param>
/// <param name="StepsFromTarget">Steps from the target (ellipse metric), when a target exists.</param>
/// <param name="DeltaUPrimeVPrimeFromTarget">Δu′v′ from the target, when a target exists.</param>
public sealed record Verdict(bool Pass, IReadOnlyList<CriterionResult> Criteria, double? StepsFromTarget, double? DeltaUPrimeVPrimeFromTarget);
