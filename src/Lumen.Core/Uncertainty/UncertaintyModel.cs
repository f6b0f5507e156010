namespace Lumen.Uncertainty;

/// <summary>
/// A spectroradiometer's measurement uncertainty as a model of the spectrum's errors (docs/methods/uncertainty.md §1).
/// Every component is optional and a standard uncertainty (k = 1); 0 means absent.
/// </summary>
/// <param name="RelativeNoise">Relative standard uncertainty of each spectral value, independent between samples.</param>
/// <param name="AbsoluteNoise">Absolute standard uncertainty of each spectral value, in the file's unit, independent.</param>
/// <param name="RelativeScale">A relative error common to all samples (fully correlated): a calibration scale error.</param>
/// <param name="SmoothRelative">Relative standard uncertainty of a responsivity error that is smooth across wavelengths.</param>
/// <param name="CorrelationLengthNm">Correlation length ℓ of the smooth error: correlation exp(−Δλ²/2ℓ²).</param>
/// <param name="WavelengthShiftNm">Standard uncertainty of a common wavelength-scale offset, nm.</param>
/// <param name="BandwidthNm">The instrument's bandpass (FWHM), for the record only: no deconvolution is done.</param>
public sealed record UncertaintyModel(
    double RelativeNoise = 0, double AbsoluteNoise = 0, double RelativeScale = 0,
    double SmoothRelative = 0, double CorrelationLengthNm = 0, double WavelengthShiftNm = 0, double? BandwidthNm = null)
{
    /// <summary>Problems with the model (negative or non-finite values, a smooth error without a correlation length); empty when valid.</summary>
    public IReadOnlyList<string> Problems()
    {
        var list = new List<string>();
        void NonNegative(string name, double v) { if (!double.IsFinite(v) || v < 0) list.Add($"{name} must be a finite number ≥ 0 (a standard uncertainty)"); }
        NonNegative("relativeNoise", RelativeNoise);
        NonNegative("absoluteNoise", AbsoluteNoise);
        NonNegative("relativeScale", RelativeScale);
        NonNegative("smoothRelative.sigma", SmoothRelative);
        NonNegative("wavelengthShiftNm", WavelengthShiftNm);
        if (SmoothRelative > 0 && !(CorrelationLengthNm > 0)) list.Add("smoothRelative.correlationLengthNm must be > 0 when smoothRelative.sigma is given");
        if (BandwidthNm is { } b && (!double.IsFinite(b) || b < 0)) list.Add("bandwidthNm must be a finite number ≥ 0");
        if (RelativeNoise > 0.5 || RelativeScale > 0.5 || SmoothRelative > 0.5) list.Add("a relative standard uncertainty above 0.5 (50 %) is not a measurement model Lumen can propagate");
        return list;
    }

    /// <summary>True when no component is given.</summary>
    public bool IsZero => RelativeNoise == 0 && AbsoluteNoise == 0 && RelativeScale == 0 && SmoothRelative == 0 && WavelengthShiftNm == 0;

    /// <summary>The model in one line.</summary>
    public string Description
    {
        get
        {
            var parts = new List<string>();
            var inv = System.Globalization.CultureInfo.InvariantCulture;
            if (RelativeNoise > 0) parts.Add(string.Create(inv, $"relative noise {RelativeNoise:G4}"));
            if (AbsoluteNoise > 0) parts.Add(string.Create(inv, $"absolute noise {AbsoluteNoise:G4}"));
            if (RelativeScale > 0) parts.Add(string.Create(inv, $"scale {RelativeScale:G4}"));
            if (SmoothRelative > 0) parts.Add(string.Create(inv, $"smooth responsivity {SmoothRelative:G4} (ℓ = {CorrelationLengthNm:G4} nm)"));
            if (WavelengthShiftNm > 0) parts.Add(string.Create(inv, $"wavelength shift {WavelengthShiftNm:G4} nm"));
            if (BandwidthNm is { } b) parts.Add(string.Create(inv, $"bandwidth {b:G4} nm (not deconvolved)"));
            return parts.Count == 0 ? "no uncertainty components" : string.Join(", ", parts) + " (standard uncertainties, k = 1)";
        }
    }
}
