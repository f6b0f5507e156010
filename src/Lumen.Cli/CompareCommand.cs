using System.CommandLine;
using Lumen.Analysis;
using Lumen.Comparison;
using Lumen.Formats;
using Lumen.Spectra;

namespace Lumen.Cli;

/// <summary>
/// <c>lumen compare REFERENCE OTHER... [--reference NAME] [--filter FILE...]</c>: how far each source is from a reference,
/// the correction that closes the gap, and what it does to object colours. Parse → compare in Core → write.
/// </summary>
internal sealed class CompareCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Option<string?> Reference { get; } = new("--reference", "-r") { Description = "Name of the reference spectrum (default: the first spectrum read)." };
    public Option<string[]> Filters { get; } = new("--filter") { Description = "Filter transmittance files or folders (0–1 or percent, detected): each filter and every stack of two is tried on each source.", AllowMultipleArgumentsPerToken = true };
    public Option<string> Format { get; } = CommonOptions.Format("text", "json", "csv");
    public Option<string?> Out { get; } = OutputTarget.Option("Write the comparison to this file instead of standard output.");

    public Command Build()
    {
        var cmd = new Command("compare", "Compare sources with a reference: Δu'v', CCT and mired, Duv, the correcting mired and tint shift, filters, object-colour shift after white balance (CIEDE2000), and the Spectral Similarity Index.");
        _inputs.AddTo(cmd);
        cmd.Add(Reference); cmd.Add(Filters); cmd.Add(Format); cmd.Add(Out);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        var outPath = parse.GetValue(Out);
        if (!_inputs.TryResolve(parse, stderr, out var inputs, outPath)) return ExitCodes.UsageError;
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen: {conflict}."); return ExitCodes.UsageError; }
        var spectra = new List<SpectrumRecord>();
        bool anyError = false;
        foreach (var r in inputs.Records(stdin))
        {
            if (r is SpectrumRecord s) spectra.Add(s);
            else if (r is ErrorRecord e) { CommonOptions.ReportError(stderr, e.Error); anyError = true; }
        }
        var filters = new List<Spectrum>();
        foreach (var f in SpectrumFiles.Expand(parse.GetValue(Filters) ?? []))
        {
            if (f.Problem is { } p) { CommonOptions.ReportError(stderr, new ReadDiagnostic(f.Path, 0, 0, p)); anyError = true; continue; }
            foreach (var r in SpectrumFiles.Read(f.Path, SpectralUnit.Relative, stdin))
            {
                if (r is SpectrumRecord s) filters.Add(s.Spectrum);
                else if (r is ErrorRecord e) { CommonOptions.ReportError(stderr, e.Error); anyError = true; }
            }
        }
        if (spectra.Count < 2)
        {
            stderr.WriteLine($"lumen compare: need a reference and at least one other spectrum; found {spectra.Count} readable spectrum(s).");
            return anyError ? ExitCodes.InputErrors : ExitCodes.UsageError;
        }
        string? name = parse.GetValue(Reference);
        var reference = name is null ? spectra[0] : spectra.FirstOrDefault(s => s.Name == name);
        if (reference is null)
        {
            stderr.WriteLine($"lumen compare: no spectrum named '{name}'; names: {string.Join(", ", spectra.Select(s => s.Name).Take(20))}.");
            return ExitCodes.UsageError;
        }
        var results = spectra.Where(s => !ReferenceEquals(s, reference)).Select(s => SourceComparer.Compare(reference.Spectrum, s.Spectrum, filters)).ToList();
        var format = CommonOptions.ToOutputFormat(parse.GetValue(Format));
        if (OutputTarget.WriteText(outPath, stdout, w => ComparisonWriter.Write(results, format, w)) is { } failure)
            return CommonOptions.OutputFailed(stderr, failure);
        return anyError ? ExitCodes.InputErrors : ExitCodes.Success;
    }
}
