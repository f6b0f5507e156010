namespace Lumen.Analysis;

/// <summary>
/// One record of an input: either a <see cref="SpectrumRecord"/> (a spectrum was read) or an <see cref="ErrorRecord"/>
/// (the reason it could not be). Every data column or row of every input becomes exactly one record, so nothing is lost
/// in a batch. The type is closed: its constructor is visible only inside Lumen.Core, so these two are its only kinds.
/// </summary>
public abstract record InputRecord
{
    private protected InputRecord(string source, int column, string name)
    {
        ArgumentNullException.ThrowIfNull(source);
        ArgumentNullException.ThrowIfNull(name);
        Source = source;
        Column = column;
        Name = name;
    }

    /// <summary>File path as given, or <c>-</c> for standard input.</summary>
    public string Source { get; init; }

    /// <summary>One-based file column of the spectrum (column layout); 0 in the row layout or when the whole file failed.</summary>
    public int Column { get; init; }

    /// <summary>Spectrum name: the header text, the row's ID, or <c>stem#k</c>.</summary>
    public string Name { get; init; }

    /// <summary>One-based line of the record in its file (row layout), or 0 (column layout).</summary>
    public int Line { get; init; }

    /// <summary>
    /// Metadata that came with the record, in file order: the <c># key: value</c> preamble of its file, then the
    /// metadata columns of the row layout (header name → this row's cell; the first ID column is <see cref="Name"/>).
    /// Keys are unique (a column overrides a preamble line of the same key). Empty when the file had none.
    /// </summary>
    public IReadOnlyList<KeyValuePair<string, string>> Metadata { get; init; } = [];

    /// <summary>The value of a metadata key, or null when the record has none.</summary>
    /// <param name="key">The key (ordinal, case-sensitive).</param>
    /// <returns>The value or null.</returns>
    public string? MetadataValue(string key)
    {
        foreach (var kv in Metadata)
            if (string.Equals(kv.Key, key, StringComparison.Ordinal)) return kv.Value;
        return null;
    }

    /// <summary>Where the record is: <c>file:line</c> (row layout), <c>file (column k)</c> or <c>file</c>.</summary>
    public string Location => Line > 0 ? $"{Source}:{Line}" : Column > 0 ? $"{Source} (column {Column})" : Source;
}
