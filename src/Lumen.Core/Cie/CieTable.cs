using System.Globalization;
using Lumen.Spectra;

namespace Lumen.Cie;

/// <summary>
/// One CIE data table on a regular whole-nanometre grid: a wavelength column and named value columns.
/// </summary>
/// <remarks>Loaded from Lumen's embedded copy of the CIE datasets (data-cie/README.md, CC BY-SA 4.0, the CIE).
/// A value the CIE publishes as NaN ("no value in the source publication") is read as 0, as the CIE
/// metadata's <c>extrapolationMethod: zero</c> says.</remarks>
public sealed class CieTable
{
    private readonly Dictionary<string, double[]> _columns;

    internal CieTable(string name, int startNm, int stepNm, IReadOnlyList<string> columnNames, Dictionary<string, double[]> columns)
    {
        Name = name;
        StartNm = startNm;
        StepNm = stepNm;
        ColumnNames = columnNames;
        _columns = columns;
        Count = columns[columnNames[0]].Length;
    }

    /// <summary>The table's file name in data-cie (without extension).</summary>
    public string Name { get; }

    /// <summary>First wavelength, nm.</summary>
    public int StartNm { get; }

    /// <summary>Wavelength step, nm.</summary>
    public int StepNm { get; }

    /// <summary>Number of rows.</summary>
    public int Count { get; }

    /// <summary>Last wavelength, nm.</summary>
    public int EndNm => StartNm + (Count - 1) * StepNm;

    /// <summary>Names of the value columns, in file order.</summary>
    public IReadOnlyList<string> ColumnNames { get; }

    /// <summary>The values of one column.</summary>
    /// <param name="column">Column name, e.g. <c>y_bar</c>.</param>
    /// <returns>The values, row by row.</returns>
    /// <exception cref="KeyNotFoundException">No such column.</exception>
    public ReadOnlySpan<double> Column(string column) => _columns[column];

    /// <summary>A column's value at a wavelength on the table's grid; 0 outside the table.</summary>
    /// <param name="column">A column name of the table, as in its header (e.g. <c>y_bar</c>); case-sensitive.</param>
    /// <param name="wavelengthNm">Wavelength in nm, a grid point.</param>
    /// <returns>The value, or 0 outside the range.</returns>
    public double At(string column, int wavelengthNm) => At(_columns[column], wavelengthNm);

    /// <summary><see cref="At(string, int)"/> for a column already looked up (<see cref="Column"/>): for loops over
    /// wavelengths, which otherwise look the column up by name once per value.</summary>
    /// <param name="values">The column's values.</param>
    /// <param name="wavelengthNm">Wavelength in nm, a grid point.</param>
    /// <returns>The value, or 0 outside the range.</returns>
    internal double At(ReadOnlySpan<double> values, int wavelengthNm)
    {
        int offset = wavelengthNm - StartNm;
        if (offset < 0 || offset % StepNm != 0) return 0;
        int i = offset / StepNm;
        return i < Count ? values[i] : 0;
    }

    /// <summary>One column as a relative spectrum.</summary>
    /// <param name="column">A column name of the table, as in its header (e.g. <c>y_bar</c>); case-sensitive.</param>
    /// <returns>The spectrum, named after the column, origin <c>CIE table name</c>.</returns>
    public Spectrum ToSpectrum(string column)
    {
        var w = new double[Count];
        for (int i = 0; i < Count; i++) w[i] = StartNm + i * StepNm;
        return new Spectrum(w, _columns[column], SpectralUnit.Relative, column, SpectrumOrigin.Generated($"CIE {Name}"));
    }

    /// <summary>
    /// This table interpolated to 1 nm by Sprague (CIE 167) over its own range; the table itself when already at 1 nm.
    /// </summary>
    /// <returns>A 1 nm table named <c>name@1nm</c>.</returns>
    internal CieTable SpragueToOneNm()
    {
        if (StepNm == 1) return this;
        return LazyInitializer.EnsureInitialized(ref _oneNm, BuildOneNm);
    }

    private CieTable? _oneNm; // the 1 nm Sprague interpolation, built once per table

    private CieTable BuildOneNm()
    {
        var dict = new Dictionary<string, double[]>(StringComparer.Ordinal);
        foreach (var c in ColumnNames)
            dict[c] = Lumen.Spectra.Resampler.SpragueToOneNm(StartNm, StepNm, _columns[c]).Values;
        return new CieTable(Name + "@1nm", StartNm, 1, ColumnNames, dict);
    }

    internal static CieTable Parse(string name, TextReader reader)
    {
        string header = reader.ReadLine() ?? throw new InvalidDataException($"data-cie/{name}.csv is empty.");
        var names = header.Split(',').Skip(1).ToArray();
        var wavelengths = new List<int>();
        var cols = names.Select(_ => new List<double>()).ToArray();
        string? line;
        int lineNo = 1;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNo++;
            if (line.Length == 0) continue;
            // Cells read in place (every process reads these tables before its first result; splitting each line into
            // strings was a third of that).
            ReadOnlySpan<char> rest = line;
            if (rest.Count(',') != names.Length)
                throw new InvalidDataException($"data-cie/{name}.csv line {lineNo}: expected {names.Length + 1} cells.");
            int comma = rest.IndexOf(',');
            wavelengths.Add(int.Parse(rest[..comma], NumberStyles.Integer, CultureInfo.InvariantCulture));
            rest = rest[(comma + 1)..];
            for (int c = 0; c < names.Length; c++)
            {
                comma = rest.IndexOf(',');
                var cell = comma < 0 ? rest : rest[..comma];
                cols[c].Add(cell.Length == 0 ? 0.0 : double.Parse(cell, NumberStyles.Float, CultureInfo.InvariantCulture));
                rest = comma < 0 ? default : rest[(comma + 1)..];
            }
        }
        int step = wavelengths[1] - wavelengths[0];
        var dict = new Dictionary<string, double[]>(StringComparer.Ordinal);
        for (int c = 0; c < names.Length; c++) dict[names[c]] = cols[c].ToArray();
        return new CieTable(name, wavelengths[0], step, names, dict);
    }
}
