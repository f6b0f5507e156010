namespace Lumen.Uncertainty;

/// <summary>The uncertainty of one result from the Monte Carlo draws (JCGM 101:2008 §7.6–7.7).</summary>
/// <param name="Mean">Mean of the draws (the Monte Carlo estimate; the reported value stays the one from the measured spectrum).</param>
/// <param name="Standard">Standard uncertainty: the draws' standard deviation.</param>
/// <param name="Low">Low end of the probabilistically symmetric 95 % coverage interval.</param>
/// <param name="High">High end of the interval.</param>
/// <param name="Draws">Draws with a finite value (fewer than the run's when the quantity was undefined in some).</param>
public sealed record FieldUncertainty(double Mean, double Standard, double Low, double High, long Draws)
{
    /// <summary>Coverage probability of <see cref="Low"/>…<see cref="High"/>.</summary>
    public const double Coverage = 0.95;

    /// <summary>The standard uncertainty by the law of propagation (JCGM 100:2008 §5) for comparison, or null where
    /// it is not computed (it is for XYZ, xy, u′v′, CCT and Duv).</summary>
    public double? Linear { get; init; }

    /// <summary>Expanded uncertainty U = k·u with k = 2 (about 95 % for a normal distribution; used by guarded acceptance).</summary>
    public double Expanded => 2 * Standard;
}
