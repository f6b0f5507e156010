using System.CommandLine;
using Lumen.Analysis;
using Lumen.BatchStatistics;
using Lumen.Graphics;

namespace Lumen.Cli;

/// <summary><c>lumen report INPUT... [--spec SPEC] -o report.html</c>: a self-contained HTML report. Parse → assess and judge → render → write.</summary>
internal sealed class ReportCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Option<string?> Spec { get; } = new("--spec") { Description = "Tolerance spec: verdicts, and the batch layout for more than one spectrum." };
    public Option<string?> Out { get; } = OutputTarget.Option("HTML file.", required: true);
    public Option<bool> Compare { get; } = new("--compare") { Description = "A comparison report: every source against the reference (the first spectrum, or --reference)." };
    public Option<string?> Reference { get; } = new("--reference", "-r") { Description = "With --compare: the reference spectrum's name (default: the first)." };
    public Option<string[]> Filters { get; } = new("--filter") { Description = "With --compare: filter transmittance files or folders to try on each source.", AllowMultipleArgumentsPerToken = true };
    public Option<string> Diagram { get; } = new("--diagram") { Description = "Chromaticity diagram of the report: uv (CIE 1976 u'v', default) or xy (CIE 1931).", DefaultValueFactory = _ => "uv" };
    public Option<string> Paper { get; } = new("--paper") { Description = "Page size of the print layout: a4 (default) or letter.", DefaultValueFactory = _ => "a4" };
    public Option<string?> GroupBy { get; } = new("--group-by") { Description = "Batch report: a summary per value of this metadata column, and the subgroups of Cpk." };
    public Option<int?> SubgroupSize { get; } = new Option<int?>("--subgroup-size") { Description = "Batch report: consecutive results per subgroup for Cpk, at least 2." }.StrictWhole("5");

    public Command Build()
    {
        var cmd = new Command("report", "Write one self-contained HTML report (inline SVG and CSS, no scripts) for a source or a batch.");
        _inputs.AddTo(cmd);
        Diagram.AcceptOnlyFromAmong("uv", "xy");
        Paper.AcceptOnlyFromAmong("a4", "letter");
        cmd.Add(Spec); cmd.Add(Out); cmd.Add(Compare); cmd.Add(Reference); cmd.Add(Filters); cmd.Add(Diagram); cmd.Add(Paper); cmd.Add(GroupBy); cmd.Add(SubgroupSize);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        if (!CommonOptions.TryLoadSpec(parse.GetValue(Spec), stderr, out var spec)) return ExitCodes.UsageError;
        if (!_inputs.TryResolve(parse, stderr, out var inputs, parse.GetValue(Out))) return ExitCodes.UsageError;
        string outPath = parse.GetValue(Out)!;
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen report: {conflict}."); return ExitCodes.UsageError; }
        if (parse.GetValue(SubgroupSize) is < 2) { stderr.WriteLine("lumen report: --subgroup-size must be at least 2 (a subgroup of one has no spread)."); return ExitCodes.UsageError; }
        var context = new ReportContext(ReportDate(), LumenApp.Version)
        {
            Inputs = inputs.Inputs.Select(f => Describe(f.Path)).ToArray(),
            SpecText = parse.GetValue(Spec) is { } specPath ? File.ReadAllText(specPath) : null,
            Space = parse.GetValue(Diagram) == "xy" ? DiagramSpace.Xy : DiagramSpace.UPrimeVPrime,
            Paper = parse.GetValue(Paper) == "letter" ? PaperSize.Letter : PaperSize.A4,
        };
        var records = inputs.Records(stdin).ToList();
        var items = new RecordOutcome[records.Count];
        Parallel.For(0, records.Count, i => items[i] = RecordOutcome.Of(records[i], AssessmentOptions.Default, spec));
        foreach (var it in items) CommonOptions.ReportError(stderr, it.Error);
        string html;
        if (parse.GetValue(Compare))
        {
            var ok = items.Where(i => i.Assessment is not null).ToList();
            if (ok.Count < 2) { stderr.WriteLine("lumen report: --compare needs a reference and at least one other spectrum."); return ExitCodes.UsageError; }
            string? refName = parse.GetValue(Reference);
            var reference = refName is null ? ok[0] : ok.FirstOrDefault(i => i.Record.Name == refName);
            if (reference is null) { stderr.WriteLine($"lumen report: no spectrum named '{refName}'."); return ExitCodes.UsageError; }
            var filters = new List<Lumen.Spectra.Spectrum>();
            foreach (var f in Lumen.Formats.SpectrumFiles.Expand(parse.GetValue(Filters) ?? []))
                foreach (var r in Lumen.Formats.SpectrumFiles.Read(f.Path, Lumen.Spectra.SpectralUnit.Relative, stdin))
                    if (r is SpectrumRecord fs) filters.Add(fs.Spectrum); else if (r is ErrorRecord fe) CommonOptions.ReportError(stderr, fe.Error);
            var refSpectrum = ((SpectrumRecord)reference.Record).Spectrum;
            var others = ok.Where(i => !ReferenceEquals(i, reference)).Select(i => ((SpectrumRecord)i.Record).Spectrum).ToList();
            var comparisons = others.Select(o => Lumen.Comparison.SourceComparer.Compare(refSpectrum, o, filters)).ToList();
            html = HtmlReport.Comparison(comparisons, refSpectrum, others, reference.Assessment!.Fidelity);
        }
        else if (spec is not null && records.Count > 1)
        {
            var builder = new BatchSummaryBuilder(spec, new BatchSummaryOptions(parse.GetValue(GroupBy), parse.GetValue(SubgroupSize)));
            foreach (var it in items) builder.Add(it);
            html = HtmlReport.Batch(items, builder.Build(), spec, context);
        }
        else html = HtmlReport.Single(items, spec, context);
        if (OutputTarget.WriteText(outPath, stdout, w => w.Write(html)) is { } failure) return CommonOptions.OutputFailed(stderr, failure);
        if (!OutputTarget.IsStdout(outPath)) stdout.WriteLine($"wrote {outPath}");
        return items.Any(i => i.Error is not null) ? ExitCodes.InputErrors : ExitCodes.Success;
    }

    /// <summary>The date stamped in the report: now, or SOURCE_DATE_EPOCH (seconds since 1970, the common convention for
    /// reproducible outputs) when it is set.</summary>
    private static DateTimeOffset ReportDate() =>
        long.TryParse(Environment.GetEnvironmentVariable("SOURCE_DATE_EPOCH"), System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out long epoch)
            ? DateTimeOffset.FromUnixTimeSeconds(epoch) : DateTimeOffset.UtcNow;

    /// <summary>An input's size and SHA-256 (streamed; standard input and unreadable files are not hashed).</summary>
    private static ReportInput Describe(string path)
    {
        if (path == "-" || !File.Exists(path)) return new ReportInput(path, -1, null);
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
            var hash = System.Security.Cryptography.SHA256.HashData(stream);
            return new ReportInput(path, stream.Length, Convert.ToHexStringLower(hash));
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return new ReportInput(path, -1, null);
        }
    }
}
