using System.Numerics;

namespace Lumen.Spectra;

/// <summary>
/// An immutable spectral distribution: ascending wavelengths (nm, any spacing) with one value each,
/// a unit, a name and an origin.
/// </summary>
/// <remarks>
/// Construction rejects NaN or infinite values, non-ascending or duplicate wavelengths and fewer than
/// three samples, with a message naming the origin. Small negative values (instrument noise after dark
/// subtraction) are kept, because clipping biases integrals (CIE 167 practice, see
/// docs/methods/colorimetry.md §1.4), and are counted in <see cref="NegativeSampleCount"/>.
/// </remarks>
public sealed class Spectrum
{
    private readonly double[] _wavelengthsNm;
    private readonly double[] _values;

    /// <summary>Builds a spectrum, validating its samples.</summary>
    /// <param name="wavelengthsNm">Wavelengths in nm, strictly ascending, within 100–100 000 nm, at least 0.01 nm apart.</param>
    /// <param name="values">One finite value per wavelength, in <paramref name="unit"/>.</param>
    /// <param name="unit">The unit of the values.</param>
    /// <param name="name">A display name.</param>
    /// <param name="origin">Where the data came from.</param>
    /// <exception cref="InvalidSpectrumException">When the samples are invalid (message names the origin).</exception>
    public Spectrum(ReadOnlySpan<double> wavelengthsNm, ReadOnlySpan<double> values, SpectralUnit unit, string name, SpectrumOrigin origin)
    {
        ArgumentNullException.ThrowIfNull(name);
        Name = name;
        Origin = origin;
        Unit = unit;
        if (wavelengthsNm.Length != values.Length)
            throw new InvalidSpectrumException($"{origin}: {wavelengthsNm.Length} wavelengths but {values.Length} values.");
        if (wavelengthsNm.Length < 3)
            throw new InvalidSpectrumException($"{origin}: a spectrum needs at least 3 samples, found {wavelengthsNm.Length}.");
        if (wavelengthsNm.Length > MaxSamples)
            throw new InvalidSpectrumException($"{origin}: {wavelengthsNm.Length:N0} samples is more than the {MaxSamples:N0} a spectrum may have; is this one spectrum?");
        for (int i = 0; i < wavelengthsNm.Length; i++)
        {
            double w = wavelengthsNm[i];
            if (!double.IsFinite(w) || w <= 0)
                throw new InvalidSpectrumException($"{origin}: wavelength #{i + 1} is {w}; expected a positive finite number of nm.", i);
            if (i > 0 && w <= wavelengthsNm[i - 1])
                throw new InvalidSpectrumException(
                    $"{origin}: wavelength {w} nm (#{i + 1}) does not follow {wavelengthsNm[i - 1]} nm; expected strictly ascending wavelengths without duplicates.", i);
            if (w < MinWavelengthNm || w > MaxWavelengthNm)
                throw new InvalidSpectrumException($"{origin}: wavelength {w:G6} (#{i + 1}) is outside {MinWavelengthNm:0}–{MaxWavelengthNm:0} nm; {UnitHint(wavelengthsNm)}", i);
            if (i > 0 && w - wavelengthsNm[i - 1] < MinStepNm)
                throw new InvalidSpectrumException($"{origin}: wavelengths {wavelengthsNm[i - 1]:G9} and {w:G9} nm are closer than {MinStepNm} nm; {UnitHint(wavelengthsNm)}", i);
            CheckValue(wavelengthsNm, values, i, origin); // in sample order: the first problem is the one reported
            if (values[i] < 0) NegativeSampleCount++;
        }
        _wavelengthsNm = wavelengthsNm.ToArray();
        _values = values.ToArray();
        RegularStepNm = RegularStep(_wavelengthsNm);
    }

    /// <summary>
    /// Builds a spectrum on the wavelengths of <paramref name="sameWavelengthsAs"/>, validating only the values: for
    /// readers that build many spectra on one grid (one row per unit), which then share one copy of the wavelengths
    /// (issue 16: checking and copying the same 401 wavelengths for every row cost as much as reading its numbers).
    /// </summary>
    /// <param name="sameWavelengthsAs">A spectrum whose wavelengths this one has (only its wavelengths are used).</param>
    /// <param name="values">One finite value per wavelength, in <paramref name="unit"/>.</param>
    /// <param name="unit">The unit of the values.</param>
    /// <param name="name">A display name.</param>
    /// <param name="origin">Where the data came from.</param>
    /// <exception cref="InvalidSpectrumException">When a value is not finite or the count differs (message names the origin).</exception>
    public Spectrum(Spectrum sameWavelengthsAs, ReadOnlySpan<double> values, SpectralUnit unit, string name, SpectrumOrigin origin)
    {
        ArgumentNullException.ThrowIfNull(sameWavelengthsAs);
        ArgumentNullException.ThrowIfNull(name);
        Name = name;
        Origin = origin;
        Unit = unit;
        if (sameWavelengthsAs.Count != values.Length)
            throw new InvalidSpectrumException($"{origin}: {sameWavelengthsAs.Count} wavelengths but {values.Length} values.");
        NegativeSampleCount = CheckValues(sameWavelengthsAs._wavelengthsNm, values, origin);
        _wavelengthsNm = sameWavelengthsAs._wavelengthsNm; // immutable: never written after construction
        _values = GC.AllocateUninitializedArray<double>(values.Length); // every value is written next: no zeroing (issue 16)
        values.CopyTo(_values);
        RegularStepNm = sameWavelengthsAs.RegularStepNm;
    }

    /// <summary>Checks that every value is finite; returns how many are below zero. Vectorised: v − v is 0 for a finite v
    /// and NaN otherwise, so one NaN in the running sum sends the check to the sample-by-sample loop that names it.</summary>
    private static int CheckValues(ReadOnlySpan<double> wavelengthsNm, ReadOnlySpan<double> values, SpectrumOrigin origin)
    {
        var probe = Vector<double>.Zero;
        var below = Vector<long>.Zero;
        int i = 0, negative = 0;
        for (; i <= values.Length - Vector<double>.Count; i += Vector<double>.Count)
        {
            var v = new Vector<double>(values[i..]);
            probe += v - v;
            below -= Vector.LessThan(v, Vector<double>.Zero); // each true lane is −1
        }
        if (double.IsNaN(Vector.Sum(probe))) i = 0;
        else negative = (int)Vector.Sum(below);
        for (; i < values.Length; i++)
        {
            CheckValue(wavelengthsNm, values, i, origin);
            if (values[i] < 0) negative++;
        }
        return negative;
    }

    private static void CheckValue(ReadOnlySpan<double> wavelengthsNm, ReadOnlySpan<double> values, int i, SpectrumOrigin origin)
    {
        if (!double.IsFinite(values[i]))
            throw new InvalidSpectrumException($"{origin}: the value at {wavelengthsNm[i]} nm is {values[i]}; expected a finite number.", i);
    }

    /// <summary>The step of a grid whose every interval equals the first within 1e-6 nm; otherwise null.</summary>
    private static double? RegularStep(double[] wavelengthsNm)
    {
        double step = wavelengthsNm[1] - wavelengthsNm[0];
        for (int i = 2; i < wavelengthsNm.Length; i++)
            if (Math.Abs(wavelengthsNm[i] - wavelengthsNm[i - 1] - step) > 1e-6) return null;
        return step;
    }

    /// <summary>Shortest wavelength a spectrum may have, nm (a plausibility gate: far UV).</summary>
    public const double MinWavelengthNm = 100;

    /// <summary>Longest wavelength a spectrum may have, nm (a plausibility gate: far infrared, 100 µm).</summary>
    public const double MaxWavelengthNm = 100_000;

    /// <summary>Smallest step between two wavelengths, nm (finer than any spectroradiometer).</summary>
    public const double MinStepNm = 0.01;

    /// <summary>Most samples a spectrum may have (far more than any instrument writes).</summary>
    public const int MaxSamples = 1_000_000;

    /// <summary>A hint at the unit a wavelength column that fails the plausibility gates was probably written in.</summary>
    private static string UnitHint(ReadOnlySpan<double> w)
    {
        double first = w[0], last = w[^1];
        if (last <= 1e-5) return "the wavelengths look like metres: multiply by 10⁹ to get nm.";
        if (last <= 100 && first >= 0.1) return "the wavelengths look like micrometres (µm): multiply by 1000 to get nm.";
        if (first >= 1000 && last <= 1e6) return "if the wavelengths are in ångström (Å), divide by 10 to get nm.";
        return "expected wavelengths in nm (for example 380–780).";
    }

    /// <summary>Display name (from the file header, or <c>stem#k</c>).</summary>
    public string Name { get; }

    /// <summary>Where the data came from.</summary>
    public SpectrumOrigin Origin { get; }

    /// <summary>Unit of <see cref="Values"/>.</summary>
    public SpectralUnit Unit { get; }

    /// <summary>Wavelengths in nm, strictly ascending.</summary>
    public ReadOnlySpan<double> WavelengthsNm => _wavelengthsNm;

    /// <summary>Values, one per wavelength.</summary>
    public ReadOnlySpan<double> Values => _values;

    /// <summary>The values' own array, for samples that share it (<see cref="Resampler.ForCieSums"/>); never written.</summary>
    internal double[] ValueArray => _values;

    /// <summary>Number of samples.</summary>
    public int Count => _values.Length;

    /// <summary>First wavelength, nm.</summary>
    public double FirstNm => _wavelengthsNm[0];

    /// <summary>Last wavelength, nm.</summary>
    public double LastNm => _wavelengthsNm[^1];

    /// <summary>Number of samples below zero (instrument noise; kept in all sums).</summary>
    public int NegativeSampleCount { get; }

    /// <summary>
    /// The regular step of the grid in nm when every interval equals the first within 1e-6 nm; otherwise null.
    /// </summary>
    public double? RegularStepNm { get; }

    /// <summary>A copy with every value multiplied by <paramref name="factor"/>.</summary>
    /// <param name="factor">A finite scale factor.</param>
    /// <returns>The scaled spectrum (same grid, unit, name and origin).</returns>
    public Spectrum Scale(double factor)
    {
        var v = new double[_values.Length];
        for (int i = 0; i < v.Length; i++) v[i] = _values[i] * factor;
        return new Spectrum(this, v, Unit, Name, Origin);
    }

    /// <summary>A copy with every value multiplied by 2^<paramref name="exponent"/> — exact, and safe for subnormal values
    /// (the factor itself is never formed).</summary>
    /// <param name="exponent">The power of two.</param>
    /// <returns>The scaled spectrum.</returns>
    internal Spectrum ScaleByPowerOfTwo(int exponent)
    {
        var v = new double[_values.Length];
        for (int i = 0; i < v.Length; i++) v[i] = Math.ScaleB(_values[i], exponent);
        return new Spectrum(this, v, Unit, Name, Origin);
    }

    /// <summary>A copy with another name.</summary>
    /// <param name="name">The new name (any text, not null).</param>
    /// <returns>The renamed spectrum.</returns>
    public Spectrum WithName(string name) => new(this, _values, Unit, name, Origin);

    /// <summary>A copy with another unit (the values are unchanged).</summary>
    /// <param name="unit">The new unit of the same values (no conversion is done).</param>
    /// <returns>The spectrum.</returns>
    public Spectrum WithUnit(SpectralUnit unit) => new(this, _values, unit, Name, Origin);

    /// <summary>Linear interpolation at one wavelength; zero outside the measured range.</summary>
    /// <param name="wavelengthNm">Wavelength in nm.</param>
    /// <returns>The interpolated value.</returns>
    public double ValueAt(double wavelengthNm)
    {
        var w = _wavelengthsNm;
        if (wavelengthNm < w[0] || wavelengthNm > w[^1]) return 0;
        int i = Array.BinarySearch(w, wavelengthNm);
        if (i >= 0) return _values[i];
        i = ~i;
        double t = (wavelengthNm - w[i - 1]) / (w[i] - w[i - 1]);
        return _values[i - 1] + t * (_values[i] - _values[i - 1]);
    }
}
