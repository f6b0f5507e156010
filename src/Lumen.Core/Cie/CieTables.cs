using System.Collections.Concurrent;
using System.Reflection;

namespace Lumen.Cie;

/// <summary>The CIE standard colorimetric observers.</summary>
public enum Observer
{
    /// <summary>CIE 1931 2° standard colorimetric observer (ISO/CIE 11664-1:2019).</summary>
    Cie1931TwoDegree = 2,

    /// <summary>CIE 1964 10° standard colorimetric observer (ISO/CIE 11664-1:2019).</summary>
    Cie1964TenDegree = 10,
}

/// <summary>
/// The CIE tables embedded in Lumen.Core, each loaded once, lazily and thread-safely.
/// </summary>
/// <remarks>Source of every table: the CIE datasets (CC BY-SA 4.0, © CIE); titles, DOIs and checksums in
/// data-cie/README.md.</remarks>
public static class CieTables
{
    private static readonly ConcurrentDictionary<string, Lazy<CieTable>> Cache = new(StringComparer.Ordinal);

    /// <summary>Loads a table by its data-cie file name (without extension).</summary>
    /// <param name="name">For example <c>cmf_1931_2deg</c>.</param>
    /// <returns>The table.</returns>
    /// <exception cref="ArgumentException">No such embedded table.</exception>
    public static CieTable Load(string name) =>
        Cache.GetOrAdd(name, n => new Lazy<CieTable>(() => Read(n), LazyThreadSafetyMode.ExecutionAndPublication)).Value;

    private static CieTable Read(string name)
    {
        var asm = typeof(CieTables).Assembly;
        using var stream = asm.GetManifestResourceStream($"data-cie/{name}.csv")
            ?? throw new ArgumentException($"No embedded CIE table named '{name}'.", nameof(name));
        using var reader = new StreamReader(stream);
        return CieTable.Parse(name, reader);
    }

    /// <summary>Names of every embedded table.</summary>
    public static IReadOnlyList<string> Names { get; } = typeof(CieTables).Assembly.GetManifestResourceNames()
        .Where(n => n.StartsWith("data-cie/", StringComparison.Ordinal))
        .Select(n => n["data-cie/".Length..^".csv".Length]).OrderBy(n => n, StringComparer.Ordinal).ToArray();

    /// <summary>Colour-matching functions x̄, ȳ, z̄ of an observer, 360–830 nm at 1 nm.</summary>
    /// <param name="observer">The observer.</param>
    /// <returns>Table with columns <c>x_bar</c>, <c>y_bar</c>, <c>z_bar</c> (2°) or <c>x_bar_10</c>… (10°).</returns>
    public static CieTable ColourMatchingFunctions(Observer observer) =>
        observer == Observer.Cie1931TwoDegree ? Load("cmf_1931_2deg") : Load("cmf_1964_10deg");

    /// <summary>Column names of the colour-matching functions of <paramref name="observer"/>.</summary>
    /// <param name="observer">The observer.</param>
    /// <returns>(x̄, ȳ, z̄) column names.</returns>
    public static (string X, string Y, string Z) CmfColumns(Observer observer) =>
        observer == Observer.Cie1931TwoDegree ? ("x_bar", "y_bar", "z_bar") : ("x_bar_10", "y_bar_10", "z_bar_10");
}
