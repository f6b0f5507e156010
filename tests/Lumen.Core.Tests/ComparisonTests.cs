using System.Globalization;
using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Comparison;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Tests;

namespace Lumen.Core.Tests;

/// <summary>Colour differences and source comparison, anchored to published data (sources named beside each value).</summary>
public class ComparisonTests
{
    public static TheoryData<double, double, double, double, double, double, double> SharmaPairs()
    {
        var data = new TheoryData<double, double, double, double, double, double, double>();
        foreach (var line in File.ReadLines(Path.Combine(AppContext.BaseDirectory, "data", "ciede2000-sharma2005.csv")).Where(l => l.Length > 0 && l[0] != '#' && l[0] != 'L'))
        {
            var v = line.Split(',').Select(s => double.Parse(s, CultureInfo.InvariantCulture)).ToArray();
            data.Add(v[0], v[1], v[2], v[3], v[4], v[5], v[6]);
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(SharmaPairs))]
    public void Ciede2000_matches_Sharma_Wu_Dalal_2005_table_1(double l1, double a1, double b1, double l2, double a2, double b2, double expected)
    {
        // Source: Sharma, Wu & Dalal (2005), Color Res. Appl. 30(1), Table 1 (tests/Lumen.Core.Tests/data/ciede2000-sharma2005.csv), 4 decimals.
        var x = new Lab(l1, a1, b1);
        var y = new Lab(l2, a2, b2);
        Assert.Equal(expected, Ciede2000.Difference(x, y), 4);
        Assert.Equal(Ciede2000.Difference(x, y), Ciede2000.Difference(y, x), 12);
    }

    [Fact]
    public void Cat16_maps_white_to_white_and_round_trips()
    {
        var a = CieTables.IlluminantA.ToSpectrum("A");
        var white = Colorimeter.Relative(a, Observer.Cie1931TwoDegree);
        var d65 = Colorimeter.Relative(CieTables.IlluminantD65.ToSpectrum("D65"), Observer.Cie1931TwoDegree);
        var w = Cat16.Adapt(white, white, d65);
        Assert.Equal(d65.X, w.X, 9); Assert.Equal(d65.Y, w.Y, 9); Assert.Equal(d65.Z, w.Z, 9);
        var c = new Tristimulus(31.2, 25.7, 8.4);
        var back = Cat16.Adapt(Cat16.Adapt(c, white, d65), d65, white);
        Assert.Equal(c.X, back.X, 10); Assert.Equal(c.Y, back.Y, 10); Assert.Equal(c.Z, back.Z, 10);
    }

    [Fact]
    public void Cielab_of_the_white_is_100_0_0_and_of_black_is_0()
    {
        // Definition (CIE 15:2018 §8.2.1).
        var w = new Tristimulus(95.047, 100, 108.883);
        var lab = Cielab.FromXyz(w, w);
        Assert.Equal(100, lab.L, 12); Assert.Equal(0, lab.A, 12); Assert.Equal(0, lab.B, 12);
        Assert.Equal(0, Cielab.FromXyz(new Tristimulus(0, 0, 0), w).L, 12);
    }

    [Fact]
    public void Ssi_of_illuminant_C_against_D65_is_94()
    {
        // Source: the SSI documented example of the colour-science library 0.4.x: 94 (94.18 unrounded) — compare.md §3.
        var (value, unrounded) = SpectralSimilarityIndex.Compute(CieTables.IlluminantC.ToSpectrum("C"), CieTables.IlluminantD65.ToSpectrum("D65"));
        Assert.Equal(94, value);
        Assert.Equal(94.18, unrounded, 2);
    }

    [Fact]
    public void Ssi_is_100_for_the_same_spectrum_at_any_scale()
    {
        var fl2 = CieTables.FluorescentIlluminants1Nm.ToSpectrum("FL2");
        Assert.Equal(100, SpectralSimilarityIndex.Compute(fl2, fl2).Value);
        Assert.Equal(100, SpectralSimilarityIndex.Compute(fl2.Scale(37.5), fl2).Unrounded, 9);
    }

    [Fact]
    public void Worked_pair_D65_against_FL11_matches_the_independent_computation()
    {
        // Source: the worked pair supplied with the task (compare.md §4), computed independently: 1 nm CIE tables, 2°.
        var d65 = CieTables.IlluminantD65.ToSpectrum("D65");
        var fl11 = CieTables.FluorescentIlluminants1Nm.ToSpectrum("FL11");
        var c = SourceComparer.Compare(d65, fl11, []);
        Assert.Equal(0.043064, c.DeltaUPrimeVPrime, 6);
        Assert.Equal(96.30, c.DeltaMired, 2);
        Assert.Equal(-96.30, c.Correction.MiredShift, 2);
        Assert.Equal(26.18, c.Ssi.Unrounded, 2);
        Assert.Equal(2.797, c.SampleShift!.MeanDeltaE00, 3);
        Assert.Equal(8.603, c.SampleShift.MaxDeltaE00, 3);
        Assert.Equal(25, c.SampleShift.Worst[0].Sample);
        // TCS13: the independent value interpolated the 5 nm TCS table linearly to 1 nm; Lumen interpolates it by Sprague
        // (CIE 167), as its CIE 13.3 code does, which gives 0.817. The linear convention is reproduced exactly below.
        Assert.Equal(0.804, c.SampleShift.Tcs13DeltaE00, 1);
    }

    [Fact]
    public void Tcs13_shift_with_linearly_interpolated_samples_reproduces_the_independent_value()
    {
        // Source: compare.md §4 worked pair, TCS13 ΔE00 = 0.804 (1 nm, 360–830 nm, 2°, TCS interpolated linearly).
        var d65 = CieTables.IlluminantD65.ToSpectrum("D65");
        var fl11 = CieTables.FluorescentIlluminants1Nm.ToSpectrum("FL11");
        var tcs13 = CieTables.CriTestSamples.ToSpectrum(CieTables.CriTestSamples.ColumnNames[12]);
        var cmf = CieTables.Cmf1931TwoDegree;
        var d65White = Colorimeter.Relative(d65, Observer.Cie1931TwoDegree);
        Lab Adapted(Spectrum light)
        {
            double x = 0, y = 0, z = 0, xw = 0, yw = 0, zw = 0;
            for (int w = 360; w <= 830; w++)
            {
                double l = light.ValueAt(w), r = tcs13.ValueAt(w), xb = cmf.At("x_bar", w), yb = cmf.At("y_bar", w), zb = cmf.At("z_bar", w);
                x += l * r * xb; y += l * r * yb; z += l * r * zb; xw += l * xb; yw += l * yb; zw += l * zb;
            }
            double k = 100 / yw;
            return Cielab.FromXyz(Cat16.Adapt(new Tristimulus(k * x, k * y, k * z), new Tristimulus(k * xw, 100, k * zw), d65White), d65White);
        }
        Assert.Equal(0.804, Ciede2000.Difference(Adapted(d65), Adapted(fl11)), 3);
    }

    [Fact]
    public void A_source_compared_with_itself_gives_zeros_and_SSI_100()
    {
        var a = CieTables.IlluminantA.ToSpectrum("A");
        var c = SourceComparer.Compare(a, a.Scale(3), []);
        Assert.Equal(0, c.DeltaUPrimeVPrime, 12);
        Assert.Equal(0, c.Correction.MiredShift, 9);
        Assert.Equal(0, c.Correction.DuvShift, 12);
        Assert.Equal(100, c.Ssi.Value);
        Assert.Equal(0, c.SampleShift!.MaxDeltaE00, 9);
    }

    [Fact]
    public void Swapping_reference_and_other_flips_the_shifts_and_keeps_the_distance()
    {
        var a = CieTables.FluorescentIlluminants1Nm.ToSpectrum("FL2");
        var b = CieTables.IlluminantA.ToSpectrum("A");
        var ab = SourceComparer.Compare(a, b, []);
        var ba = SourceComparer.Compare(b, a, []);
        Assert.Equal(ab.DeltaUPrimeVPrime, ba.DeltaUPrimeVPrime, 12);
        Assert.Equal(ab.Correction.MiredShift, -ba.Correction.MiredShift, 9);
        Assert.Equal(ab.Correction.DuvShift, -ba.Correction.DuvShift, 12);
    }

    [Fact]
    public void An_ideal_conversion_filter_leaves_almost_no_residual()
    {
        // A filter built as the ratio of two blackbodies shifts one blackbody exactly onto the other: τ = L(3200 K)/L(5600 K),
        // scaled to a peak of 1. Applied to the 5600 K source it must reproduce the 3200 K chromaticity (residual < 1e-4).
        var grid = WavelengthGrid.Regular(360, 830, 1);
        Spectrum Bb(double t) => new(grid, grid.Select(w => Lumen.Blackbody.Planck.SpectralRadianceNm(w, t, Lumen.Blackbody.PlanckConstants.Cie15)).ToArray(), SpectralUnit.Relative, $"{t} K", SpectrumOrigin.Generated("test"));
        var warm = Bb(3200);
        var cool = Bb(5600);
        var ratio = grid.Select(w => warm.ValueAt(w) / cool.ValueAt(w)).ToArray();
        double peak = ratio.Max();
        var filter = new Spectrum(grid, ratio.Select(r => r / peak).ToArray(), SpectralUnit.Relative, "ideal CTO", SpectrumOrigin.Generated("test"));
        var c = SourceComparer.Compare(warm, cool, [filter]);
        var f = Assert.Single(c.Filters);
        Assert.True(f.ResidualDeltaUPrimeVPrime < 1e-4, f.ResidualDeltaUPrimeVPrime.ToString(CultureInfo.InvariantCulture));
        Assert.Equal(c.Correction.MiredShift, f.MiredShift, 1);
    }

    [Fact]
    public void Filter_in_percent_is_detected_and_equals_the_fraction()
    {
        var grid = WavelengthGrid.Regular(380, 780, 5);
        var frac = new Spectrum(grid, grid.Select(w => 0.3 + 0.6 * (w - 380) / 400).ToArray(), SpectralUnit.Relative, "f", SpectrumOrigin.Generated("t"));
        var pct = frac.Scale(100);
        var (a, pa) = Filter.Apply(CieTables.IlluminantA.ToSpectrum("A"), frac);
        var (b, pb) = Filter.Apply(CieTables.IlluminantA.ToSpectrum("A"), pct);
        Assert.False(pa);
        Assert.True(pb);
        Assert.Equal(a.ValueAt(550), b.ValueAt(550), 9);
    }

    [Fact]
    public void Weak_comparisons_are_flagged()
    {
        var grid = WavelengthGrid.Regular(400, 700, 5);
        var narrow = new Spectrum(grid, grid.Select(w => Math.Exp(-Math.Pow((w - 520) / 15.0, 2))).ToArray(), SpectralUnit.Relative, "green LED", SpectrumOrigin.Generated("t"));
        var c = SourceComparer.Compare(CieTables.IlluminantD65.ToSpectrum("D65"), narrow, []);
        Assert.Contains(c.Warnings, w => w.Contains("|Duv| > 0.05", StringComparison.Ordinal));
        Assert.Contains(c.Warnings, w => w.Contains("not all of 375–780 nm", StringComparison.Ordinal));
        Assert.Empty(SourceComparer.Compare(CieTables.IlluminantD65.ToSpectrum("D65"), CieTables.IlluminantA.ToSpectrum("A"), []).Warnings);
    }

    [Theory]
    [InlineData(45, 0.002, "needs about +45 MK⁻¹ of warming and a slight green shift")]
    [InlineData(-120, -0.004, "needs about -120 MK⁻¹ of cooling and a moderate magenta shift")]
    [InlineData(0.2, 0.0001, "needs no colour-temperature change and no green/magenta shift")]
    public void The_correction_reads_as_plain_words(double mired, double duv, string expected)
    {
        // Wording of our own (compare.md §1): slight below 0.003 Duv, moderate to 0.006, strong above.
        Assert.Equal(expected, SourceComparer.Describe(mired, duv));
    }
}
