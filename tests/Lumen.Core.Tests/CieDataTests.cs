using System.Globalization;
using Lumen.Cie;
using Lumen.Tests;

namespace Lumen.Core.Tests;

public class CieDataTests
{
    private static readonly (string Cie, string Lumen)[] Pairs =
    {
        ("CIE_xyz_1931_2deg", "cmf_1931_2deg"), ("CIE_xyz_1964_10deg", "cmf_1964_10deg"),
        ("CIE_std_illum_A_1nm", "illuminant_A"), ("CIE_std_illum_D65", "illuminant_D65"),
        ("CIE_std_illum_D50", "illuminant_D50"), ("CIE_illum_Dxx_comp", "daylight_components"),
        ("CIE_srf_cri", "cri_test_samples"), ("CIE_srf_cfi_1nm", "cfi_colour_evaluation_samples_1nm"),
        ("CIE_srf_cfi", "cfi_colour_evaluation_samples_5nm"), ("CIE_sle_photopic", "luminous_efficiency_photopic"),
        ("CIE_sle_scotopic", "luminous_efficiency_scotopic"), ("CIE_a-opic_action_spectra", "alpha_opic_action_spectra"),
        ("CIE_illum_FLs", "illuminants_FL_5nm"), ("CIE_illum_FLs_1nm", "illuminants_FL_1nm"),
        ("CIE_illum_HPs", "illuminants_HP_5nm"), ("CIE_illum_LEDs", "illuminants_LED_5nm"),
        ("CIE_illum_LEDs_1nm", "illuminants_LED_1nm"), ("CIE_illum_C", "illuminant_C"),
        ("CIE_illum_D55", "illuminant_D55"), ("CIE_illum_D75", "illuminant_D75"),
    };

    private static string Originals => Path.Combine(RepoPaths.Root, "data-cie", "originals");

    [Fact]
    public void Every_CIE_original_in_the_repository_has_its_published_SHA_256()
    {
        // Source: the SHA-256 the CIE publishes in each dataset's metadata (copied into data-cie/originals/SHA256SUMS).
        var sums = File.ReadAllLines(Path.Combine(Originals, "SHA256SUMS"))
            .Where(l => l.Length > 0).Select(l => l.Split("  ")).ToDictionary(p => p[1], p => p[0], StringComparer.Ordinal);
        foreach (var (cie, _) in Pairs)
        {
            var bytes = File.ReadAllBytes(Path.Combine(Originals, cie + ".csv"));
            Assert.Equal(sums[cie + ".csv"], Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes)));
            // The metadata file names the same checksum.
            Assert.Contains(sums[cie + ".csv"], File.ReadAllText(Path.Combine(Originals, cie + ".csv_metadata.json")), StringComparison.OrdinalIgnoreCase);
        }
    }

    [Fact]
    public void Every_embedded_value_equals_the_CIE_published_file()
    {
        // Source: the CIE datasets kept unchanged in data-cie/originals (SHA-256 checked by the test above).
        int compared = 0;
        foreach (var (cie, lumen) in Pairs)
        {
            var table = CieTables.Load(lumen);
            var lines = File.ReadAllLines(Path.Combine(Originals, cie + ".csv"))
                .Select(l => l.Trim('\uFEFF', ' ')).Where(l => l.Length > 0).ToArray();
            Assert.Equal(lines.Length, table.Count);
            for (int r = 0; r < lines.Length; r++)
            {
                var cells = lines[r].Split(',');
                Assert.Equal(table.StartNm + r * table.StepNm, int.Parse(cells[0], CultureInfo.InvariantCulture));
                for (int c = 1; c < cells.Length; c++)
                {
                    double expected = cells[c] == "NaN" ? 0.0 : double.Parse(cells[c], CultureInfo.InvariantCulture);
                    Assert.Equal(expected, table.Column(table.ColumnNames[c - 1])[r]);
                    compared++;
                }
            }
        }
        Assert.True(compared > 50_000, $"only {compared} values compared");
    }

    [Fact]
    public void Every_table_the_project_needs_is_embedded()
    {
        foreach (var (_, lumen) in Pairs) Assert.Contains(lumen, CieTables.Names);
    }

    [Fact]
    public void Colour_matching_functions_span_360_to_830_nm_at_1_nm()
    {
        // Source: CIE 018:2019 Table 6 / ISO/CIE 11664-1:2019 Table 2 (range stated in the dataset metadata).
        foreach (var obs in new[] { Observer.Cie1931TwoDegree, Observer.Cie1964TenDegree })
        {
            var t = CieTables.ColorMatchingFunctions(obs);
            Assert.Equal(360, t.StartNm);
            Assert.Equal(830, t.EndNm);
            Assert.Equal(1, t.StepNm);
        }
        // CIE validation value: sample row 479 nm of the 1931 table is 0.1042979, 0.1334528, 0.8566193.
        var cmf = CieTables.ColorMatchingFunctions(Observer.Cie1931TwoDegree);
        Assert.Equal(0.1334528, cmf.At("y_bar", 479), 12);
    }
}
