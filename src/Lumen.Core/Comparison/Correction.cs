namespace Lumen.Comparison;

/// <summary>The correction that brings the other source to the reference.</summary>
/// <param name="MiredShift">M(reference) − M(other), MK⁻¹: positive = warming (amber-ish filter), negative = cooling.</param>
/// <param name="DuvShift">Duv(reference) − Duv(other): positive = towards green, negative = towards magenta.</param>
/// <param name="Description">The same in plain words.</param>
public sealed record Correction(double MiredShift, double DuvShift, string Description);
