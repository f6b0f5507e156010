using System.Globalization;
using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>
/// The shapes instrument software gives a column-layout export, made readable (rules of our own, stated in the README
/// and in each result's provenance):
/// <list type="bullet">
/// <item><b>Preamble.</b> Lines before the numeric block that read <c>key: value</c>, <c>key,value</c>,
/// <c>key;value</c> or <c>key&lt;TAB&gt;value</c> (a text key, one value) are metadata; other lines there are skipped
/// and counted. The line just before the numeric block is its header when it has as many cells.</item>
/// <item><b>Unit cells.</b> A wavelength may carry <c>nm</c> (<c>380nm</c>, <c>380 nm</c>); a value may carry its unit
/// (<c>5.2e-3 W/m²/nm</c>), which must agree with the file's unit (it sets it when the file declares none).</item>
/// <item><b>Wavelength unit.</b> A wavelength header naming µm (<c>µm</c>, <c>um</c>, <c>micrometre</c>) or Å
/// (<c>Å</c>, <c>angstrom</c>), or a <c># wavelength unit: µm</c> directive, converts the column to nm.</item>
/// </list>
/// Preamble lines are turned into <c># key: value</c> comments and skipped lines into plain comments, so line numbers
/// of every later diagnostic stay those of the file.
/// </summary>
public static class InstrumentExport
{
    /// <summary>The outcome of <see cref="Normalise"/>.</summary>
    /// <param name="Lines">The lines to parse (same count as the input).</param>
    /// <param name="Kept">Preamble lines kept as metadata.</param>
    /// <param name="Skipped">One-based numbers of lines skipped.</param>
    public sealed record Result(IReadOnlyList<string> Lines, int Kept, IReadOnlyList<int> Skipped);

    /// <summary>Finds the numeric block and turns the lines before its header into comments.</summary>
    /// <param name="lines">The file's lines.</param>
    /// <returns>The lines to parse and what was kept or skipped.</returns>
    public static Result Normalise(IReadOnlyList<string> lines)
    {
        ArgumentNullException.ThrowIfNull(lines);
        int block = -1;
        char d = ',';
        for (int i = 0; i < lines.Count; i++)
        {
            var t = lines[i].Trim().TrimStart('\uFEFF');
            if (t.Length == 0 || t[0] == '#') continue;
            d = DelimitedSpectrumReader.DetectDelimiter(t);
            var cells = DelimitedSpectrumReader.Split(t, d);
            if (cells.Length >= 2 && TryParseWavelength(cells[0], d, 1, out _) && NextIsNumeric(lines, i + 1)) { block = i; break; }
        }
        if (block < 0) return new Result(lines, 0, []);
        // The header: the nearest non-blank, non-comment line above the block, when it has as many cells.
        int header = -1;
        for (int i = block - 1; i >= 0; i--)
        {
            var t = lines[i].Trim().TrimStart('\uFEFF');
            if (t.Length == 0 || t[0] == '#') continue;
            var cells = DelimitedSpectrumReader.Split(t, DelimitedSpectrumReader.DetectDelimiter(t));
            var first = DelimitedSpectrumReader.Split(lines[block].Trim(), d);
            if (cells.Length == first.Length && cells.Length >= 2) header = i;
            break;
        }
        var result = lines.ToArray();
        int kept = 0;
        var skipped = new List<int>();
        int end = header >= 0 ? header : block;
        for (int i = 0; i < end; i++)
        {
            var t = result[i].Trim().TrimStart('\uFEFF');
            if (t.Length == 0 || t[0] == '#') continue;
            if (KeyValue(t) is { } kv) { result[i] = $"# {kv.Key}: {kv.Value}"; kept++; }
            else { result[i] = "# " + t; skipped.Add(i + 1); }
        }
        return new Result(result, kept, skipped);
    }

    private static bool NextIsNumeric(IReadOnlyList<string> lines, int from)
    {
        for (int i = from; i < lines.Count; i++)
        {
            var t = lines[i].Trim();
            if (t.Length == 0 || t[0] == '#') continue;
            char d = DelimitedSpectrumReader.DetectDelimiter(t);
            return TryParseWavelength(DelimitedSpectrumReader.Split(t, d)[0], d, 1, out _);
        }
        return true; // a one-row block
    }

    /// <summary>A preamble line as a key and value: <c>key: value</c>, or two cells (tab, semicolon or comma) of which
    /// the first is a plausible key (<see cref="Preamble"/>'s rule).</summary>
    internal static KeyValuePair<string, string>? KeyValue(string line)
    {
        foreach (char sep in new[] { '\t', ';', ',' })
        {
            var parts = line.Split(sep);
            if (parts.Length == 2 && Preamble.TryParse("# " + parts[0].Trim().Trim('"') + ": x", out var key, out _))
                return new(key, parts[1].Trim().Trim('"'));
        }
        if (Preamble.TryParse("# " + line, out var k, out var v)) return new(k, v);
        return null;
    }

    /// <summary>The factor to nm that a wavelength header or directive names: 1000 for µm, 0.1 for Å, else 1.</summary>
    /// <param name="text">The header cell or the directive's value.</param>
    /// <returns>The factor.</returns>
    public static double WavelengthFactor(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var t = text.ToLowerInvariant();
        if (t.Contains('µ') || t.Contains('μ') || t.Contains("(um)", StringComparison.Ordinal) || t.Contains("[um]", StringComparison.Ordinal) || t.Trim() == "um" || t.Contains("micrometre", StringComparison.Ordinal) || t.Contains("micrometer", StringComparison.Ordinal) || t.Contains("micron", StringComparison.Ordinal)) return 1000;
        if (t.Contains('å') || t.Contains("angstrom", StringComparison.Ordinal)) return 0.1;
        return 1;
    }

    /// <summary>A wavelength cell: a number, optionally followed by <c>nm</c>, times <paramref name="factor"/>.</summary>
    public static bool TryParseWavelength(string cell, char delimiter, double factor, out double nm)
    {
        ArgumentNullException.ThrowIfNull(cell);
        var t = cell.Trim();
        if (t.EndsWith("nm", StringComparison.OrdinalIgnoreCase)) t = t[..^2].TrimEnd();
        bool ok = DelimitedSpectrumReader.TryParseNumber(t, delimiter, out nm);
        nm *= factor;
        return ok;
    }

    /// <summary>A value cell: a number, optionally followed by a space and its unit.</summary>
    /// <param name="cell">The cell.</param>
    /// <param name="delimiter">The file's delimiter (decimal comma rule).</param>
    /// <param name="value">The number.</param>
    /// <param name="unit">The unit named in the cell, or null.</param>
    /// <returns>False when the cell is not a number (with or without a known unit).</returns>
    public static bool TryParseValue(string cell, char delimiter, out double value, out SpectralUnit? unit)
    {
        ArgumentNullException.ThrowIfNull(cell);
        unit = null;
        if (DelimitedSpectrumReader.TryParseNumber(cell, delimiter, out value)) return true;
        int space = cell.IndexOf(' ', StringComparison.Ordinal);
        if (space <= 0) return false;
        var text = cell[(space + 1)..].Trim().Replace('²', '2');
        if (!SpectralUnits.TryParse(text, out var u) || !DelimitedSpectrumReader.TryParseNumber(cell[..space], delimiter, out value)) return false;
        unit = u;
        return true;
    }

    /// <summary>The provenance sentence for what the normalisation did, or null when it did nothing.</summary>
    public static string? Describe(Result r, double factor)
    {
        ArgumentNullException.ThrowIfNull(r);
        var parts = new List<string>();
        if (r.Kept > 0) parts.Add($"{r.Kept} preamble line{(r.Kept == 1 ? "" : "s")} kept as metadata");
        if (r.Skipped.Count > 0) parts.Add($"{r.Skipped.Count} preamble line{(r.Skipped.Count == 1 ? "" : "s")} skipped (line {string.Join(", ", r.Skipped.Take(10))}{(r.Skipped.Count > 10 ? ", …" : "")})");
        if (factor != 1) parts.Add(string.Create(CultureInfo.InvariantCulture, $"wavelengths converted to nm (× {factor:G4})"));
        return parts.Count == 0 ? null : string.Join("; ", parts);
    }
}
