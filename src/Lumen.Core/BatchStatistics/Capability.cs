namespace Lumen.BatchStatistics;

/// <summary>Process capability of one limited field.</summary>
/// <param name="Field">The result field path (as in <c>ResultFields</c>), e.g. <c>cri.ra</c>.</param>
/// <param name="Lower">Lower specification limit, or null.</param>
/// <param name="Upper">Upper specification limit, or null.</param>
/// <param name="Mean">Mean of the field over the batch, in the field's unit.</param>
/// <param name="StandardDeviation">Sample standard deviation.</param>
/// <param name="Cpk">min((USL − μ)/3σ, (μ − LSL)/3σ) over the limits given (common practice); NaN when σ = 0 or fewer than 2 values.</param>
public sealed record Capability(string Field, double? Lower, double? Upper, double Mean, double StandardDeviation, double Cpk);
