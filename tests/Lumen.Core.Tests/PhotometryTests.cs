using Lumen.Analysis;
using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Descriptors;
using Lumen.Photometry;
using Lumen.Spectra;
using Lumen.Synthetic;

namespace Lumen.Core.Tests;

/// <summary>Photometry, CIE S 026 and spectral descriptors against published values.</summary>
public class PhotometryTests
{
    private static RegularSamples Band5nm(string table, string column)
    {
        var t = CieTables.Load(table);
        return new RegularSamples(380, 5, Enumerable.Range(0, 81).Select(i => t.At(column, 380 + 5 * i)).ToArray(), "5 nm 380–780");
    }

    [Theory]
    // Source: methods note photometry-nonvisual.md §2–3 [NUM], 5 nm CIE tables, band 380–780 nm:
    // LER A 154.1, D65 203.5, FL2 336.4 lm/W; S/P A 1.412, D65 2.465, FL2 1.571.
    [InlineData("illuminant_A", "A", 154.1, 1.412)]
    [InlineData("illuminant_D65", "D65", 203.5, 2.465)]
    [InlineData("illuminants_FL_5nm", "FL2", 336.4, 1.571)]
    public void Ler_and_SP_ratio_of_CIE_illuminants_match(string table, string column, double ler, double sp)
    {
        var p = Photometer.Compute(Band5nm(table, column), SpectralUnit.Relative);
        Assert.InRange(p.LerLumensPerWatt, ler - 0.05, ler + 0.05);
        Assert.InRange(p.SpRatio, sp - 0.0005, sp + 0.0005);
        Assert.Null(p.Photometric);
    }

    [Fact]
    public void Sp_ratio_of_illuminant_A_is_1_41()
    {
        // Source: shared/reference id photometry.SP_ratio.A = 1.41 (from memory there), ± 0.01.
        var p = Photometer.Compute(Band5nm("illuminant_A", "A"), SpectralUnit.Relative);
        Assert.InRange(p.SpRatio, 1.40, 1.42);
    }

    [Fact]
    public void Monochromatic_555_nm_has_LER_Km()
    {
        // Source: CIE — K_m = 683.002 lm/W at the peak of V(λ) (id photometry.Km_photopic); V(555 nm) = 1 in CIE 018 Table 1.
        var v = new double[401];
        v[555 - 380] = 1;
        var p = Photometer.Compute(new RegularSamples(380, 1, v, "mono"), SpectralUnit.FluxWattsPerNm);
        Assert.Equal(683.002, p.LerLumensPerWatt, 9);
        Assert.Equal(683.002, p.Photometric!.Value, 9);
        Assert.Equal(PhotometricQuantity.FluxLumen, p.Quantity);
    }

    [Fact]
    public void Absolute_irradiance_gives_illuminance_in_lux()
    {
        // Definition (CIE 018): E_v = K_m Σ E_e,λ V Δλ; a flat 0.01 W/(m²·nm) over 360–830 nm gives 683.002 × 0.01 × ΣV.
        var v = Enumerable.Repeat(0.01, 471).ToArray();
        var p = Photometer.Compute(new RegularSamples(360, 1, v, "flat"), SpectralUnit.IrradianceWattsPerSquareMetreNm);
        double sumV = 0;
        foreach (var x in CieTables.PhotopicLuminousEfficiency.Column("V")) sumV += x;
        Assert.Equal(683.002 * 0.01 * sumV, p.Photometric!.Value, 6);
        Assert.Equal(PhotometricQuantity.IlluminanceLux, p.Quantity);
        Assert.Equal(0.01 * 471, p.Radiometric!.Value, 9);
    }

    [Theory]
    // Source: CIE S 026:2018 D65 α-opic ELR (shared/reference ids s026.ELR_D65.*; from memory there except
    // melanopic 1.3262 mW/lm, confirmed by secondary sources), ± 0.0002 mW/lm.
    [InlineData(AlphaOpicKind.Melanopic, 1.3262)]
    [InlineData(AlphaOpicKind.SConeOpic, 0.8173)]
    [InlineData(AlphaOpicKind.MConeOpic, 1.4558)]
    [InlineData(AlphaOpicKind.LConeOpic, 1.6289)]
    [InlineData(AlphaOpicKind.Rhodopic, 1.4497)]
    public void D65_alpha_opic_efficacies_match_CIE_S026(AlphaOpicKind kind, double mwPerLm)
    {
        Assert.InRange(AlphaOpic.D65EfficacyMilliwattsPerLumen[(int)kind], mwPerLm - 0.0002, mwPerLm + 0.0002);
    }

    [Fact]
    public void D65_has_DER_1_and_EDI_equal_to_its_illuminance()
    {
        // Source: CIE S 026 by definition (ids s026.mDER.D65 = 1, s026.mEDI.D65_100lx = 100).
        var d65 = CieTables.IlluminantD65;
        var v = Enumerable.Range(0, 401).Select(i => d65.At("D65", 380 + i)).ToArray();
        var raw = new RegularSamples(380, 1, v, "D65");
        double ev = Photometer.Compute(raw, SpectralUnit.IrradianceWattsPerSquareMetreNm).Photometric!.Value;
        var scaled = new RegularSamples(380, 1, v.Select(x => x * 100 / ev).ToArray(), "D65 100 lx");
        foreach (var r in AlphaOpic.Compute(scaled, SpectralUnit.IrradianceWattsPerSquareMetreNm))
        {
            Assert.Equal(1.0, r.Der, 9);
            Assert.Equal(100.0, r.Edi!.Value, 6);
        }
    }

    [Fact]
    public void Melanopic_DER_of_illuminant_A_equals_an_independent_recomputation()
    {
        // Independent reference written here from the raw CIE tables (no published value was at hand in
        // shared/reference; it comes to 0.4957). Also a property: warm light has a melanopic DER well below 1.
        var a = CieTables.IlluminantA; var d = CieTables.IlluminantD65;
        var act = CieTables.AlphaOpicActionSpectra; var vt = CieTables.PhotopicLuminousEfficiency;
        double Ratio(CieTable t, string c)
        {
            double m = 0, y = 0;
            for (int w = 380; w <= 780; w++) { m += t.At(c, w) * act.At("melanopic", w); y += t.At(c, w) * vt.At("V", w); }
            return m / y;
        }
        double expected = Ratio(a, "A") / Ratio(d, "D65");
        var r = AlphaOpic.Compute(new RegularSamples(380, 1, Enumerable.Range(0, 401).Select(i => a.At("A", 380 + i)).ToArray(), "A"), SpectralUnit.Relative);
        Assert.Equal(expected, r[0].Der, 10);
        Assert.InRange(r[0].Der, 0.45, 0.55);
    }

    [Theory]
    // Source: CIE S 026 action spectra peaks (handbook: melanopic 490 nm, rhodopic = V'(λ) peak 507 nm;
    // ids s026.melanopic_peak_wavelength, s026.rhodopic_peak_wavelength).
    [InlineData("melanopic", 490)]
    [InlineData("rhodopic", 507)]
    public void Action_spectra_peak_where_published(string column, int peakNm)
    {
        // The table prints 3–6 decimals, so the rhodopic maximum 1 spans 506–508 nm: check that the published peak
        // wavelength holds the maximum value 1.
        var t = CieTables.AlphaOpicActionSpectra;
        double max = 0;
        foreach (var x in t.Column(column)) max = Math.Max(max, x);
        Assert.Equal(1.0, max, 9);
        Assert.Equal(max, t.At(column, peakNm), 9);
    }

    [Fact]
    public void Dominant_wavelength_and_purity_match_reference_library()
    {
        // Source: colour-science doctests (methods note colorimetry.md §4): xy (0.54369557, 0.32107944), N = (0.3127, 0.3290):
        // λd = 616 nm (nearest sample; interpolation gives within ±0.5 nm), p_e = 0.6228856.
        var r = SpectralDescriptors.Dominant(0.54369557, 0.32107944, 0.31270, 0.32900)!.Value;
        Assert.InRange(r.WavelengthNm, 615.5, 616.5);
        Assert.InRange(r.ExcitationPurity, 0.6228856 - 2e-3, 0.6228856 + 2e-3);
        Assert.False(r.IsComplementary);
        // Purple sample (0.37605506, 0.24452225): complementary 509 nm, reported negative.
        var p = SpectralDescriptors.Dominant(0.37605506, 0.24452225, 0.31270, 0.32900)!.Value;
        Assert.True(p.IsComplementary);
        Assert.InRange(p.WavelengthNm, -509.5, -508.5);
        Assert.InRange(p.IntersectionX, 0.4572314 - 2e-3, 0.4572314 + 2e-3);
    }

    [Fact]
    public void Peak_centroid_and_fwhm_of_a_gaussian_band()
    {
        // Common practice: a Gaussian with FWHM 2.3548σ; symmetric, so its centroid is its peak.
        var grid = SyntheticSpectra.Grid(380, 780, 1);
        var s = new Spectrum(grid, grid.Select(x => Math.Exp(-0.5 * Math.Pow((x - 530) / (20 / 2.354820045), 2))).ToArray(), SpectralUnit.Relative, "g", SpectrumOrigin.Generated("t"));
        var d = Assessor.Assess(s).Spectral!;
        Assert.Equal(530, d.PeakNm);
        Assert.Equal(530, d.CentroidNm, 6);
        Assert.InRange(d.FwhmNm!.Value, 19.95, 20.05);
        Assert.InRange(d.DominantNm!.Value, 520, 560);
        Assert.InRange(d.Purity, 0.8, 1.0);
    }
}

/// <summary>Blackbody toolkit against CODATA and published check values.</summary>
public class BlackbodyTests
{
    [Fact]
    public void Constants_match_CODATA_2018()
    {
        // Source: CODATA 2018 (ids constant.wien_b.CODATA2018, constant.stefan_boltzmann.CODATA2018; methods note planck.md §2.1).
        Assert.Equal(2.897771955e-3, RadiationConstants.WienMetreKelvin, 1e-12);
        Assert.Equal(5.670374419e-8, RadiationConstants.StefanBoltzmann, 1e-17);
        Assert.Equal(1.438776877e-2, RadiationConstants.C2, 1e-11);
        Assert.Equal(3.741771852e-16, RadiationConstants.C1, 1e-25);
    }

    [Theory]
    // Source: colour-science test_blackbody (ids planck.radiance.*): c1 = 3.741771e-16, c2 = 1.4388e-2, n = 1.
    [InlineData(5000, 256, 1422301922547.989)]
    [InlineData(5000, 512, 12310717051408.45)]
    [InlineData(10000, 512, 216822672986686.8)]
    [InlineData(1667, 1024, 23117906548.45391)]
    [InlineData(100000, 32, 4.002679163635765e19)]
    [InlineData(5500, 500, 20472701909806.5)]
    public void Planck_radiance_matches_reference_library(double t, double nm, double expected)
    {
        var c = new PlanckConstants(3.741771e-16, 0.014388, 1);
        Assert.Equal(1.0, Planck.SpectralRadiancePerMetre(nm * 1e-9, t, c) / expected, 9);
    }

    [Theory]
    // Source: CIE 15 illuminant A formula (ids illuminant_A.relative_spd.*): 100·(560/λ)⁵·(e^(1.435e7/(2848·560)) − 1)/(e^(1.435e7/(2848·λ)) − 1).
    [InlineData(380, 9.79509961)]
    [InlineData(555, 96.44230599)]
    [InlineData(780, 241.67538835)]
    public void Planck_with_c2_1435_at_2848_K_reproduces_illuminant_A(double nm, double expected)
    {
        var c = new PlanckConstants(RadiationConstants.C1, 1.435e-2, 1);
        double rel = 100 * Planck.SpectralRadianceNm(nm, 2848, c) / Planck.SpectralRadianceNm(560, 2848, c);
        Assert.Equal(expected, rel, 6);
    }

    [Theory]
    [InlineData(1000.0)]
    [InlineData(3000.0)]
    [InlineData(6500.0)]
    public void Integrated_exitance_equals_sigma_T4_to_1e6(double t)
    {
        // Source: Stefan–Boltzmann law (CODATA σ); methods note planck.md §3 check. Trapezoid in ln λ, 10 nm – 1 m.
        var c = PlanckConstants.For(C2Convention.Codata2018);
        double sum = 0, lnA = Math.Log(10e-9), lnB = Math.Log(1.0);
        int n = 200_000;
        double h = (lnB - lnA) / n;
        for (int i = 0; i <= n; i++)
        {
            double l = Math.Exp(lnA + i * h);
            double f = Math.PI * Planck.SpectralRadiancePerMetre(l, t, c) * l; // dλ = λ d(ln λ)
            sum += (i == 0 || i == n ? 0.5 : 1) * f;
        }
        Assert.Equal(1.0, sum * h / Radiator.ExitanceWattsPerSquareMetre(t), 6);
    }

    [Fact]
    public void Wien_peak_of_the_sun_is_502_nm()
    {
        // Source: methods note planck.md §6: λ_max at 5772 K = b/T = 502.0 nm.
        Assert.Equal(502.0, Radiator.WienPeakNm(5772), 1);
    }

    [Fact]
    public void Net_power_follows_sigma_A_eps_T4_minus_T04()
    {
        // Formula check (methods note planck.md §3): 1 m², ε = 0.5, 1000 K in 300 K surroundings.
        double expected = 0.5 * 5.670374419e-8 * (Math.Pow(1000, 4) - Math.Pow(300, 4));
        Assert.Equal(1.0, Radiator.NetPowerWatts(1000, 300, 1, 0.5) / expected, 9); // σ from exact h, c, k vs its 10-digit value
        Assert.Throws<ArgumentOutOfRangeException>(() => Radiator.NetPowerWatts(1000, 300, 1, 1.5));
    }

    [Theory]
    // Source: methods note planck.md §5 [NUM]: Wien/Planck at 2856 K, 780 nm = 0.99843; at 6500 K, 780 nm = 0.9414.
    [InlineData(2856, 780, 0.99843, 1e-5)]
    [InlineData(6500, 780, 0.9414, 1e-4)]
    public void Wien_approximation_error_matches(double t, double nm, double ratio, double tol)
    {
        double r = Radiator.RadianceNm(nm, t, PlanckApproximation.Wien) / Radiator.RadianceNm(nm, t, PlanckApproximation.None);
        Assert.InRange(r, ratio - tol, ratio + tol);
    }

    [Fact]
    public void Rayleigh_Jeans_radiance_matches_reference_library()
    {
        // Source: colour-science doctest via methods note planck.md §5: RJ at 500 nm, 5500 K = 7.2848e14 W/(sr·m³).
        double perMetre = Radiator.RadianceNm(500, 5500, PlanckApproximation.RayleighJeans) * 1e9;
        Assert.InRange(perMetre / 7.2848e14, 1 - 1e-4, 1 + 1e-4);
    }

    [Fact]
    public void Grey_body_fit_recovers_a_noisy_blackbody_within_its_interval()
    {
        var grid = SyntheticSpectra.Grid(380, 780, 2);
        var s = SyntheticSpectra.WithNoise(SyntheticSpectra.Blackbody(3200, grid, "bb").Scale(0.7), 0.01, 1234);
        var f = GreyBodyFit.Fit(s);
        Assert.True(f.Thermal);
        Assert.InRange(3200, f.TemperatureLowKelvin, f.TemperatureHighKelvin);
        Assert.InRange(f.TemperatureHighKelvin - f.TemperatureLowKelvin, 1, 200);
    }

    [Fact]
    public void Grey_body_fit_with_emissivity_slope_recovers_a_tilted_grey_body()
    {
        var grid = SyntheticSpectra.Grid(400, 760, 1);
        var bb = SyntheticSpectra.Blackbody(2500, grid, "bb");
        var tilted = new Spectrum(grid, grid.Select((x, i) => bb.Values[i] * (1 + 0.05 * (x - 560) / 100)).ToArray(), SpectralUnit.Relative, "t", SpectrumOrigin.Generated("t"));
        var f = GreyBodyFit.Fit(tilted, fitEmissivitySlope: true);
        Assert.Equal(2500, f.TemperatureKelvin, 0);
        Assert.Equal(0.05, f.EmissivitySlopePer100Nm, 3);
    }

    [Fact]
    public void Grey_body_fit_flags_an_LED_as_not_thermal()
    {
        var grid = SyntheticSpectra.Grid(380, 780, 1);
        var led = SyntheticSpectra.PhosphorLed(new PhosphorLedModel(450, 20, 0.9, 550, 110, 625, 85, 0.5), grid, "led");
        Assert.False(GreyBodyFit.Fit(led).Thermal);
    }

    [Fact]
    public void Colour_names_are_plain_words()
    {
        Assert.Equal("warm white", Radiator.ColorName(3000));
        Assert.Equal("daylight white", Radiator.ColorName(6500));
    }
}
