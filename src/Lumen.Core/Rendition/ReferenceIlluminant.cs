using Lumen.Spectra;

namespace Lumen.Rendition;

/// <summary>A reference illuminant on a grid, with what it is.</summary>
/// <param name="Kind">Planckian, daylight or blend.</param>
/// <param name="CctKelvin">The temperature it was built for, K.</param>
/// <param name="DaylightFraction">Fraction of CIE daylight in a blend (0 for Planckian, 1 for daylight).</param>
/// <param name="Samples">The relative spectrum on the requested grid.</param>
public sealed record ReferenceIlluminant(ReferenceKind Kind, double CctKelvin, double DaylightFraction, RegularSamples Samples)
{
    /// <summary>Readable description, e.g. "Planckian 4225 K" or "blend 4500 K (50 % CIE daylight)".</summary>
    public string Description => Kind switch
    {
        ReferenceKind.Planckian => $"Planckian radiator at {CctKelvin:0} K",
        ReferenceKind.CieDaylight => $"CIE daylight at {CctKelvin:0} K",
        _ => $"blend at {CctKelvin:0} K ({DaylightFraction * 100:0} % CIE daylight, {(1 - DaylightFraction) * 100:0} % Planckian)",
    };
}
