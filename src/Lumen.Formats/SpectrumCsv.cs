using System.Globalization;
using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>One spectrum as the column-layout CSV every verb reads: a comment, the <c># unit:</c> directive, a header
/// <c>nm,NAME</c>, then wavelength and value per line, every number round-tripping exactly ("R").</summary>
public static class SpectrumCsv
{
    /// <summary>Writes the spectrum.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="spectrum">The spectrum.</param>
    /// <param name="comment">A first comment line (without <c>#</c>), or null.</param>
    public static void Write(TextWriter output, Spectrum spectrum, string? comment = null)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(spectrum);
        if (comment is not null) output.Write("# " + comment.ReplaceLineEndings(" ") + "\n");
        output.Write("# unit: " + SpectralUnits.Symbol(spectrum.Unit) + "\n");
        output.Write("nm," + Csv.Quote(spectrum.Name) + "\n");
        for (int i = 0; i < spectrum.Count; i++)
            output.Write(spectrum.WavelengthsNm[i].ToString("R", CultureInfo.InvariantCulture) + "," + spectrum.Values[i].ToString("R", CultureInfo.InvariantCulture) + "\n");
    }
}
