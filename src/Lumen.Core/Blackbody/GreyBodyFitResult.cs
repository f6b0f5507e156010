namespace Lumen.Blackbody;

/// <summary>Result of fitting a grey body to a measured spectrum.</summary>
/// <param name="TemperatureKelvin">Best-fit temperature, K (NaN when the data hold no signal).</param>
/// <param name="TemperatureLowKelvin">Lower end of the 95 % confidence interval, K (NaN when it cannot be estimated).</param>
/// <param name="TemperatureHighKelvin">Upper end of the 95 % confidence interval, K (NaN when it cannot be estimated).</param>
/// <param name="Scale">Fitted gain A (equal to the emissivity when the data are absolute radiance).</param>
/// <param name="EmissivitySlopePer100Nm">Fitted relative emissivity slope per 100 nm (0 when not fitted).</param>
/// <param name="RelativeResidual">RMS of the residuals divided by the RMS of the data (0–∞; NaN without signal).</param>
/// <param name="Thermal">True when a grey body describes the data (positive gain and relative residual ≤ <see cref="GreyBodyFit.ThermalResidualLimit"/>).</param>
/// <param name="BandFirstNm">First wavelength used, nm.</param>
/// <param name="BandLastNm">Last wavelength used, nm.</param>
/// <param name="Points">Number of samples used.</param>
public sealed record GreyBodyFitResult(double TemperatureKelvin, double TemperatureLowKelvin, double TemperatureHighKelvin, double Scale,
    double EmissivitySlopePer100Nm, double RelativeResidual, bool Thermal, double BandFirstNm, double BandLastNm, int Points)
{
    /// <summary>The caution every fit output carries.</summary>
    public const string Caution = "Caution: a temperature from a spectral fit is an estimate of the radiator's distribution temperature, not a surface-temperature measurement; hot surfaces burn — use proper thermometry for safety decisions.";

    /// <summary>True when the data held a signal to fit (not all zero) and the fit produced a finite temperature.</summary>
    public bool HasSignal => double.IsFinite(TemperatureKelvin) && double.IsFinite(RelativeResidual);

    /// <summary>Plain-language warnings about the fit (no signal, no confidence interval).</summary>
    public IReadOnlyList<string> Warnings
    {
        get
        {
            var w = new List<string>();
            if (!HasSignal) w.Add("The spectrum holds no signal to fit (all values zero or not finite): no temperature.");
            else if (!double.IsFinite(TemperatureLowKelvin) || !double.IsFinite(TemperatureHighKelvin))
                w.Add("The 95 % interval could not be estimated (too few points or a perfect fit).");
            return w;
        }
    }

    /// <summary>One sentence saying what the fit means.</summary>
    public string Message => !HasSignal
        ? "no signal: nothing to fit"
        : Thermal
            ? "a grey body describes this spectrum"
            : FormattableString.Invariant($"NOT a thermal source: the grey body misses the data by {RelativeResidual * 100:0} % RMS (LED, fluorescent or filtered light?), so this temperature is meaningless");
}
