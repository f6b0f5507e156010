using System.Collections.Concurrent;

namespace Lumen.Cie;

/// <summary>
/// The CIE tables embedded in Lumen.Core, each loaded once, lazily and thread-safely.
/// </summary>
/// <remarks>Source of every table: the CIE datasets (CC BY-SA 4.0, © CIE); titles, DOIs and checksums in
/// data-cie/README.md.</remarks>
public static class CieTables
{
    private static readonly ConcurrentDictionary<string, Lazy<CieTable>> Cache = new(StringComparer.Ordinal);

    /// <summary>Loads a table by its data-cie file name (without extension); internal: callers use the typed accessors.</summary>
    /// <param name="name">For example <c>cmf_1931_2deg</c>.</param>
    /// <returns>The table.</returns>
    /// <exception cref="ArgumentException">No such embedded table.</exception>
    internal static CieTable Load(string name) =>
        Cache.GetOrAdd(name, n => new Lazy<CieTable>(() => Read(n), LazyThreadSafetyMode.ExecutionAndPublication)).Value;

    private static CieTable Read(string name)
    {
        var asm = typeof(CieTables).Assembly;
        using var stream = asm.GetManifestResourceStream($"data-cie/{name}.csv")
            ?? throw new ArgumentException($"No embedded CIE table named '{name}'.", nameof(name));
        using var reader = new StreamReader(stream);
        return CieTable.Parse(name, reader);
    }

    /// <summary>Names of every embedded table (data-cie file names without extension).</summary>
    internal static IReadOnlyList<string> Names { get; } = typeof(CieTables).Assembly.GetManifestResourceNames()
        .Where(n => n.StartsWith("data-cie/", StringComparison.Ordinal))
        .Select(n => n["data-cie/".Length..^".csv".Length]).OrderBy(n => n, StringComparer.Ordinal).ToArray();

    /// <summary>Colour-matching functions x̄, ȳ, z̄ of an observer, 360–830 nm at 1 nm.</summary>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° standard observer.</param>
    /// <returns>Table with columns <c>x_bar</c>, <c>y_bar</c>, <c>z_bar</c> (2°) or <c>x_bar_10</c>… (10°).</returns>
    public static CieTable ColorMatchingFunctions(Observer observer) =>
        observer == Observer.Cie1931TwoDegree ? Cmf1931TwoDegree : Cmf1964TenDegree;

    /// <summary>Column names of the colour-matching functions of <paramref name="observer"/>.</summary>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° standard observer.</param>
    /// <returns>(x̄, ȳ, z̄) column names.</returns>
    internal static (string X, string Y, string Z) CmfColumns(Observer observer) =>
        observer == Observer.Cie1931TwoDegree ? ("x_bar", "y_bar", "z_bar") : ("x_bar_10", "y_bar_10", "z_bar_10");

    /// <summary>CIE S 026:2018 α-opic action spectra (S-cone, M-cone, L-cone, rhodopic, melanopic), 380–780 nm at 1 nm (data-cie/alpha_opic_action_spectra.csv).</summary>
    public static CieTable AlphaOpicActionSpectra => Load("alpha_opic_action_spectra");

    /// <summary>CIE 224:2017 99 colour evaluation samples, spectral radiance factors at 1 nm (data-cie/cfi_colour_evaluation_samples_1nm.csv).</summary>
    public static CieTable ColorEvaluationSamples1Nm => Load("cfi_colour_evaluation_samples_1nm");

    /// <summary>CIE 224:2017 99 colour evaluation samples, spectral radiance factors at 5 nm (data-cie/cfi_colour_evaluation_samples_5nm.csv).</summary>
    public static CieTable ColorEvaluationSamples5Nm => Load("cfi_colour_evaluation_samples_5nm");

    /// <summary>CIE 1931 2° colour-matching functions x̄, ȳ, z̄, 360–830 nm at 1 nm (data-cie/cmf_1931_2deg.csv).</summary>
    public static CieTable Cmf1931TwoDegree => Load("cmf_1931_2deg");

    /// <summary>CIE 1964 10° colour-matching functions x̄₁₀, ȳ₁₀, z̄₁₀, 360–830 nm at 1 nm (data-cie/cmf_1964_10deg.csv).</summary>
    public static CieTable Cmf1964TenDegree => Load("cmf_1964_10deg");

    /// <summary>CIE 13.3-1995 test colour samples TCS01–TCS14, spectral radiance factors (data-cie/cri_test_samples.csv).</summary>
    public static CieTable CriTestSamples => Load("cri_test_samples");

    /// <summary>CIE daylight components S0, S1, S2 (CIE 15) (data-cie/daylight_components.csv).</summary>
    public static CieTable DaylightComponents => Load("daylight_components");

    /// <summary>CIE standard illuminant A, relative SPD at 1 nm (data-cie/illuminant_A.csv).</summary>
    public static CieTable IlluminantA => Load("illuminant_A");

    /// <summary>CIE illuminant C, relative SPD (data-cie/illuminant_C.csv).</summary>
    public static CieTable IlluminantC => Load("illuminant_C");

    /// <summary>CIE illuminant D50, relative SPD (data-cie/illuminant_D50.csv).</summary>
    public static CieTable IlluminantD50 => Load("illuminant_D50");

    /// <summary>CIE illuminant D55, relative SPD (data-cie/illuminant_D55.csv).</summary>
    public static CieTable IlluminantD55 => Load("illuminant_D55");

    /// <summary>CIE standard illuminant D65, relative SPD at 1 nm (data-cie/illuminant_D65.csv).</summary>
    public static CieTable IlluminantD65 => Load("illuminant_D65");

    /// <summary>CIE illuminant D75, relative SPD (data-cie/illuminant_D75.csv).</summary>
    public static CieTable IlluminantD75 => Load("illuminant_D75");

    /// <summary>CIE fluorescent illuminants FL1–FL12 and FL3.1–FL3.15 at 1 nm (data-cie/illuminants_FL_1nm.csv).</summary>
    public static CieTable FluorescentIlluminants1Nm => Load("illuminants_FL_1nm");

    /// <summary>CIE fluorescent illuminants FL1–FL12 and FL3.1–FL3.15 at 5 nm (data-cie/illuminants_FL_5nm.csv).</summary>
    public static CieTable FluorescentIlluminants5Nm => Load("illuminants_FL_5nm");

    /// <summary>CIE high-pressure discharge illuminants HP1–HP5 at 5 nm (data-cie/illuminants_HP_5nm.csv).</summary>
    public static CieTable HighPressureIlluminants5Nm => Load("illuminants_HP_5nm");

    /// <summary>CIE LED illuminants LED-B1…LED-V2 at 1 nm (data-cie/illuminants_LED_1nm.csv).</summary>
    public static CieTable LedIlluminants1Nm => Load("illuminants_LED_1nm");

    /// <summary>CIE LED illuminants LED-B1…LED-V2 at 5 nm (data-cie/illuminants_LED_5nm.csv).</summary>
    public static CieTable LedIlluminants5Nm => Load("illuminants_LED_5nm");

    /// <summary>CIE photopic luminous efficiency function V(λ) (data-cie/luminous_efficiency_photopic.csv).</summary>
    public static CieTable PhotopicLuminousEfficiency => Load("luminous_efficiency_photopic");

    /// <summary>CIE scotopic luminous efficiency function V′(λ) (data-cie/luminous_efficiency_scotopic.csv).</summary>
    public static CieTable ScotopicLuminousEfficiency => Load("luminous_efficiency_scotopic");
}
