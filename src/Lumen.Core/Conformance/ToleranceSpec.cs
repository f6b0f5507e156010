namespace Lumen.Conformance;

/// <summary>A product's tolerance specification, written once by a QA engineer.</summary>
/// <param name="Name">Name of the specification.</param>
/// <param name="Target">Chromaticity target, or null.</param>
/// <param name="Tolerance">Chromaticity tolerance.</param>
/// <param name="Limits">Limits on result fields.</param>
public sealed record ToleranceSpec(string Name, ChromaticityTarget? Target, ChromaticityTolerance Tolerance, IReadOnlyList<FieldLimit> Limits)
{
    /// <summary>Warnings from reading the specification (e.g. a deprecated key), located by file, line and column.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

    /// <summary>The project the specification is for (optional; shown at the head of a report).</summary>
    public string? Project { get; init; }

    /// <summary>The client (optional; shown at the head of a report).</summary>
    public string? Client { get; init; }

    /// <summary>Who prepared the check (optional; shown at the head of a report).</summary>
    public string? PreparedBy { get; init; }

    /// <summary>One line that states the whole specification: name, target, chromaticity tolerance and every limit.</summary>
    public string Description
    {
        get
        {
            var sb = new System.Text.StringBuilder(Name);
            if (Target is { } t) sb.Append("; target ").Append(t.Description);
            sb.Append(Tolerance.Kind switch
            {
                ToleranceKind.Quadrangle => "; inside the ANSI C78.377 quadrangle",
                ToleranceKind.EllipseSteps => System.FormattableString.Invariant($"; within {Tolerance.Value:0.#} steps"),
                ToleranceKind.UPrimeVPrimeRadius => System.FormattableString.Invariant($"; within Δu'v' {Tolerance.Value:0.####}"),
                _ => "",
            });
            foreach (var l in Limits) sb.Append("; ").Append(l.Field).Append(' ').Append(l.Description);
            return sb.ToString();
        }
    }
}
