using FsCheck;
using FsCheck.Xunit;
using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;
using Lumen.Temperature;
using Lumen.Synthetic;

namespace Lumen.Core.Tests;

public class SpectrumTests
{
    private static readonly SpectrumOrigin Origin = new("lamp.csv", 3);

    [Fact]
    public void Construction_rejects_NaN_naming_origin_and_wavelength()
    {
        var ex = Assert.Throws<InvalidSpectrumException>(() => new Spectrum([400, 410, 420], [1, double.NaN, 1], SpectralUnit.Relative, "a", Origin));
        Assert.Contains("lamp.csv (column 3)", ex.Message, StringComparison.Ordinal);
        Assert.Contains("410 nm", ex.Message, StringComparison.Ordinal);
        Assert.Equal(1, ex.SampleIndex);
    }

    [Fact]
    public void Construction_rejects_infinite_values_descending_and_duplicate_wavelengths_and_too_few_points()
    {
        Assert.Throws<InvalidSpectrumException>(() => new Spectrum([400, 410, 420], [1, double.PositiveInfinity, 1], SpectralUnit.Relative, "a", Origin));
        Assert.Throws<InvalidSpectrumException>(() => new Spectrum([400, 390, 420], [1, 1, 1], SpectralUnit.Relative, "a", Origin));
        Assert.Throws<InvalidSpectrumException>(() => new Spectrum([400, 400, 420], [1, 1, 1], SpectralUnit.Relative, "a", Origin));
        Assert.Throws<InvalidSpectrumException>(() => new Spectrum([400, 410], [1, 1], SpectralUnit.Relative, "a", Origin));
    }

    [Fact]
    public void A_spectrum_on_another_ones_grid_shares_its_wavelengths_and_checks_only_its_values()
    {
        var grid = new Spectrum([400, 405, 410, 415], [1, 1, 1, 1], SpectralUnit.Relative, "grid", Origin);
        var s = new Spectrum(grid, [0.5, -0.1, 2, -0.3], SpectralUnit.IrradianceWattsPerSquareMetreNm, "unit 7", new SpectrumOrigin("rows.csv, line 9", 0));
        Assert.Equal(grid.WavelengthsNm.ToArray(), s.WavelengthsNm.ToArray());
        Assert.Equal([0.5, -0.1, 2, -0.3], s.Values.ToArray());
        Assert.Equal(2, s.NegativeSampleCount);
        Assert.Equal(5, s.RegularStepNm);
        Assert.Equal("unit 7", s.Name);
        Assert.Throws<InvalidSpectrumException>(() => new Spectrum(grid, [1, 2, 3], SpectralUnit.Relative, "short", Origin));
        var ex = Assert.Throws<InvalidSpectrumException>(() => new Spectrum(grid, [1, 2, double.NegativeInfinity, 4], SpectralUnit.Relative, "bad", Origin));
        Assert.Contains("410 nm", ex.Message, StringComparison.Ordinal);
        Assert.Equal(2, ex.SampleIndex);
    }

    [Fact]
    public void The_vectorised_value_check_finds_every_bad_value_and_counts_every_negative_one()
    {
        // Every length around the vector widths, a NaN or infinity at every index: the first bad index is named;
        // negative counts agree with a plain count. (Expected values: counted here by a scalar loop.)
        var rng = new Random(16);
        foreach (int n in new[] { 3, 4, 5, 7, 8, 9, 15, 16, 17, 31, 33, 401 })
        {
            var w = Enumerable.Range(0, n).Select(i => 380.0 + i).ToArray();
            var grid = new Spectrum(w, new double[n], SpectralUnit.Relative, "grid", Origin);
            var v = Enumerable.Range(0, n).Select(_ => rng.NextDouble() - 0.3).ToArray();
            Assert.Equal(v.Count(x => x < 0), new Spectrum(grid, v, SpectralUnit.Relative, "ok", Origin).NegativeSampleCount);
            Assert.Equal(v.Count(x => x < 0), new Spectrum(w, v, SpectralUnit.Relative, "ok", Origin).NegativeSampleCount);
            for (int bad = 0; bad < n; bad += Math.Max(1, n / 40))
            {
                var b = (double[])v.Clone();
                b[bad] = bad % 2 == 0 ? double.NaN : double.PositiveInfinity;
                Assert.Equal(bad, Assert.Throws<InvalidSpectrumException>(() => new Spectrum(grid, b, SpectralUnit.Relative, "bad", Origin)).SampleIndex);
            }
        }
    }

    [Fact]
    public void Small_negative_values_are_kept_and_counted()
    {
        var s = new Spectrum([400, 410, 420], [-0.01, 1, -0.02], SpectralUnit.Relative, "a", Origin);
        Assert.Equal(2, s.NegativeSampleCount);
        Assert.Equal(-0.02, s.Values[2]);
    }

    [Fact]
    public void Sprague_returns_the_nodes_and_CIE_1nm_FL11_colorimetry()
    {
        // Source: methods note colorimetry.md §1.4 [NUM] — FL11 5 nm sum y = 0.37692, Sprague→1 nm y = 0.37691.
        var fl11 = CieTables.FluorescentIlluminants5Nm.ToSpectrum("FL11");
        var s = Resampler.SpragueToOneNm(fl11.FirstNm, 5, fl11.Values);
        Assert.Equal(401, s.Values.Length);
        for (int i = 0; i < fl11.Count; i++) Assert.Equal(fl11.Values[i], s.Values[i * 5], 9);
        var c = Colorimeter.Relative(s, Observer.Cie1931TwoDegree).Chromaticity;
        Assert.InRange(c.SmallY, 0.37691 - 2e-5, 0.37691 + 2e-5);
    }

    [Fact]
    public void Aligned_1nm_and_5nm_grids_are_summed_at_their_own_step_and_others_interpolated()
    {
        var five = CieTables.FluorescentIlluminants5Nm.ToSpectrum("FL2");
        Assert.Equal(5, Resampler.ForCieSums(five).StepNm);
        var shifted = new Spectrum(five.WavelengthsNm.ToArray().Select(w => w + 2.5).ToArray(), five.Values, SpectralUnit.Relative, "s", Origin);
        var r = Resampler.ForCieSums(shifted);
        Assert.Equal(1, r.StepNm);
        Assert.Contains("Sprague", r.Method, StringComparison.Ordinal);
        var irregular = new Spectrum([380, 381.5, 390, 700, 780], [1, 1, 1, 1, 1], SpectralUnit.Relative, "i", Origin);
        Assert.Contains("linear", Resampler.ForCieSums(irregular).Method, StringComparison.Ordinal);
    }

    [Fact]
    public void Fine_irregular_grid_gives_the_same_chromaticity_as_the_1nm_table()
    {
        // Property: an array-spectrometer grid (0.7 nm pixels) of a smooth source gives the same chromaticity as 1 nm data.
        var a = CieTables.IlluminantA.ToSpectrum("A");
        var pix = new List<double>();
        for (double w = 360.2; w < 830; w += 0.7) pix.Add(w);
        var fine = new Spectrum(pix.ToArray(), pix.Select(a.ValueAt).ToArray(), SpectralUnit.Relative, "fine", Origin);
        var c1 = Colorimeter.Relative(a, Observer.Cie1931TwoDegree).Chromaticity;
        var c2 = Colorimeter.Relative(fine, Observer.Cie1931TwoDegree).Chromaticity;
        Assert.InRange(c1.DeltaUPrimeVPrime(c2), 0, 2e-5);
    }

    [Fact]
    public void Spectrum_not_covering_380_to_780_is_computed_with_a_warning_naming_the_gap()
    {
        var d65 = CieTables.IlluminantD65.ToSpectrum("D65");
        var w = d65.WavelengthsNm.ToArray().Where(x => x >= 400 && x <= 730).ToArray();
        var cut = new Spectrum(w, w.Select(d65.ValueAt).ToArray(), SpectralUnit.Relative, "cut", Origin);
        var a = Assessor.Assess(cut);
        Assert.True(a.Chromaticity.IsDefined);
        Assert.Contains(a.Warnings, x => x.Contains("380–400 nm", StringComparison.Ordinal) && x.Contains("730–780 nm", StringComparison.Ordinal));
    }

    [Fact]
    public void Narrow_band_source_gets_a_result_and_the_far_from_locus_warning()
    {
        var grid = SyntheticSpectra.Grid(380, 780, 1);
        var green = new Spectrum(grid, grid.Select(x => Math.Exp(-0.5 * Math.Pow((x - 530) / 10, 2))).ToArray(), SpectralUnit.Relative, "green", Origin);
        var a = Assessor.Assess(green);
        Assert.True(a.Cct.Conditions.HasFlag(CctConditions.FarFromLocus));
        Assert.Contains(a.Warnings, x => x.Contains("not meaningful", StringComparison.Ordinal));
    }

    [Property(MaxTest = 60)]
    public bool Cct_and_chromaticity_are_invariant_to_scaling_the_spectrum(PositiveInt k)
    {
        // Property: relative colorimetry does not depend on the spectrum's scale.
        var fl2 = CieTables.FluorescentIlluminants5Nm.ToSpectrum("FL2");
        double factor = k.Get * 0.37;
        var a = Assessor.Assess(fl2);
        var b = Assessor.Assess(fl2.Scale(factor));
        return Math.Abs(a.Cct.CctKelvin - b.Cct.CctKelvin) < 1e-6 && Math.Abs(a.Chromaticity.SmallX - b.Chromaticity.SmallX) < 1e-12;
    }

    [Fact]
    public void Black_spectrum_gives_undefined_cct_and_a_warning_not_NaN_numbers_silently()
    {
        var s = new Spectrum([400, 500, 600], [0, 0, 0], SpectralUnit.Relative, "dark", Origin);
        var a = Assessor.Assess(s);
        Assert.True(a.Cct.Conditions.HasFlag(CctConditions.Undefined));
        Assert.Contains(a.Warnings, x => x.Contains("undefined", StringComparison.Ordinal));
    }
}
