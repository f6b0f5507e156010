namespace Lumen.Formats;

/// <summary>Layout of a delimited spectrum file.</summary>
public enum TableLayout
{
    /// <summary>Wavelengths down the first column, one spectrum per further column.</summary>
    Columns,

    /// <summary>Production-tester layout: first row the wavelengths (after optional ID/metadata columns), one spectrum per row.</summary>
    Rows,
}
