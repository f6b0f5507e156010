namespace Lumen.Conformance;

/// <summary>One criterion's outcome.</summary>
/// <param name="Criterion">What was checked (e.g. "chromaticity: 3-step ellipse", "cri.ra").</param>
/// <param name="Measured">Measured value (steps, Δu′v′, signed distance or the field's value); null when unavailable.</param>
/// <param name="Limit">The limit as text.</param>
/// <param name="Margin">Distance to the limit on the passing side (negative = failing by that much).</param>
/// <param name="Pass">True when the measured value is within the limit (a missing value fails).</param>
/// <param name="Note">Why a value is missing, or extra context.</param>
public sealed record CriterionResult(string Criterion, double? Measured, string Limit, double? Margin, bool Pass, string? Note = null);
