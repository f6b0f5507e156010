namespace Lumen.Uncertainty;

/// <summary>The Monte Carlo uncertainty of one spectrum's results.</summary>
/// <param name="Model">The model propagated.</param>
/// <param name="Draws">Number of draws.</param>
/// <param name="Seed">Seed of the draws (the same seed gives the same result on any thread count).</param>
/// <param name="Adaptive">True when the adaptive procedure (JCGM 101:2008 §7.9) set the number of draws.</param>
/// <param name="Fields">Per result-field path (ordinal order), its uncertainty.</param>
/// <param name="Criteria">Per criterion of the verdict (same order), the uncertainty of its measured value; empty without a specification.</param>
/// <param name="UPrimeVPrimeCovariance">Covariance of the 2° (u′, v′) draws: (var u′, cov, var v′), for uncertainty ellipses.</param>
/// <param name="Warnings">Disagreements between the law of propagation and Monte Carlo, and other notes.</param>
public sealed record UncertaintyResult(
    UncertaintyModel Model, long Draws, ulong Seed, bool Adaptive,
    IReadOnlyDictionary<string, FieldUncertainty> Fields,
    IReadOnlyList<FieldUncertainty?> Criteria,
    (double UU, double UV, double VV) UPrimeVPrimeCovariance,
    IReadOnlyList<string> Warnings);
