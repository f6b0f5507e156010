namespace Lumen.Graphics;

/// <summary>
/// What a report states about itself so that a client can accept it: when and with which Lumen it was made, from which
/// input files (with their SHA-256), against which specification text, and how it is laid out. Project, client and
/// preparer come from the specification (<c>project</c>, <c>client</c>, <c>preparedBy</c>).
/// </summary>
/// <param name="Date">When the report was made.</param>
/// <param name="Version">Lumen's version.</param>
public sealed record ReportContext(DateTimeOffset Date, string Version)
{
    /// <summary>The input files, in the order given.</summary>
    public IReadOnlyList<ReportInput> Inputs { get; init; } = [];

    /// <summary>The specification as the user wrote it (the file's text), or null.</summary>
    public string? SpecText { get; init; }

    /// <summary>The chromaticity diagram of the report (the same for a single source and a batch).</summary>
    public DiagramSpace Space { get; init; } = DiagramSpace.UPrimeVPrime;

    /// <summary>The paper the print layout is for.</summary>
    public PaperSize Paper { get; init; } = PaperSize.A4;
}
