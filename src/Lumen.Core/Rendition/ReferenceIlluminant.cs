using Lumen.Spectra;

namespace Lumen.Rendition;

/// <summary>A reference illuminant on a grid, with what it is.</summary>
/// <remarks>
/// The spectrum itself may be built on first use: a batch needs only the reference's sums, which mostly come from
/// tables (<see cref="SampleSums"/>), while a plot or report reads <see cref="Samples"/> (issue 16).
/// </remarks>
public sealed record ReferenceIlluminant
{
    private readonly Lazy<RegularSamples> _samples;

    /// <summary>A reference whose spectrum is given.</summary>
    /// <param name="kind">Planckian, daylight or blend.</param>
    /// <param name="cctKelvin">The temperature it was built for, K.</param>
    /// <param name="daylightFraction">Fraction of CIE daylight in a blend (0 for Planckian, 1 for daylight).</param>
    /// <param name="samples">The relative spectrum on the requested grid.</param>
    public ReferenceIlluminant(ReferenceKind kind, double cctKelvin, double daylightFraction, RegularSamples samples)
        : this(kind, cctKelvin, daylightFraction, new Lazy<RegularSamples>(samples ?? throw new ArgumentNullException(nameof(samples))))
    {
    }

    /// <summary>A reference whose spectrum is built when first read (the function must be pure: it may run more than
    /// once when threads race, and the results must be the same).</summary>
    /// <param name="kind">Planckian, daylight or blend.</param>
    /// <param name="cctKelvin">The temperature it was built for, K.</param>
    /// <param name="daylightFraction">Fraction of CIE daylight in a blend (0 for Planckian, 1 for daylight).</param>
    /// <param name="samples">Builds the relative spectrum on the requested grid.</param>
    public ReferenceIlluminant(ReferenceKind kind, double cctKelvin, double daylightFraction, Func<RegularSamples> samples)
        : this(kind, cctKelvin, daylightFraction, new Lazy<RegularSamples>(samples ?? throw new ArgumentNullException(nameof(samples)), LazyThreadSafetyMode.PublicationOnly))
    {
    }

    private ReferenceIlluminant(ReferenceKind kind, double cctKelvin, double daylightFraction, Lazy<RegularSamples> samples)
    {
        Kind = kind;
        CctKelvin = cctKelvin;
        DaylightFraction = daylightFraction;
        _samples = samples;
    }

    /// <summary>Planckian, daylight or blend.</summary>
    public ReferenceKind Kind { get; }

    /// <summary>The temperature it was built for, K.</summary>
    public double CctKelvin { get; }

    /// <summary>Fraction of CIE daylight in a blend (0 for Planckian, 1 for daylight).</summary>
    public double DaylightFraction { get; }

    /// <summary>The relative spectrum on the requested grid.</summary>
    public RegularSamples Samples => _samples.Value;

    /// <summary>Readable description, e.g. "Planckian 4225 K" or "blend 4500 K (50 % CIE daylight)".</summary>
    public string Description => Kind switch
    {
        ReferenceKind.Planckian => $"Planckian radiator at {CctKelvin:0} K",
        ReferenceKind.CieDaylight => $"CIE daylight at {CctKelvin:0} K",
        _ => $"blend at {CctKelvin:0} K ({DaylightFraction * 100:0} % CIE daylight, {(1 - DaylightFraction) * 100:0} % Planckian)",
    };

    /// <summary>Equal when kind, temperature, fraction and spectrum values are equal.</summary>
    /// <param name="other">The other reference.</param>
    /// <returns>Whether they are equal.</returns>
    public bool Equals(ReferenceIlluminant? other) =>
        other is not null && Kind == other.Kind && CctKelvin.Equals(other.CctKelvin) && DaylightFraction.Equals(other.DaylightFraction)
        && Samples.StartNm == other.Samples.StartNm && Samples.StepNm == other.Samples.StepNm && Samples.Values.AsSpan().SequenceEqual(other.Samples.Values);

    /// <inheritdoc/>
    public override int GetHashCode() => HashCode.Combine(Kind, CctKelvin, DaylightFraction);
}
