namespace Lumen.Analysis;

/// <summary>Groups of results a user can ask for (colorimetry is always computed: everything needs it).</summary>
[Flags]
public enum MetricGroups
{
    /// <summary>XYZ, chromaticity, CCT and Duv.</summary>
    Colorimetry = 1,

    /// <summary>CIE 13.3 Ra and R1–R14.</summary>
    Cri = 2,

    /// <summary>CIE 224 Rf and IES TM-30 Rg and hue-bin values.</summary>
    Fidelity = 4,

    /// <summary>LER, S/P ratio and absolute photometric quantities.</summary>
    Photometry = 8,

    /// <summary>CIE S 026 α-opic quantities.</summary>
    NonVisual = 16,

    /// <summary>Peak, centroid, FWHM, dominant wavelength and purity.</summary>
    Spectral = 32,

    /// <summary>Everything.</summary>
    All = Colorimetry | Cri | Fidelity | Photometry | NonVisual | Spectral,
}
