using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text;
using Lumen.Analysis;
using Lumen.BatchStatistics;
using Lumen.Conformance;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary><c>lumen batch INPUT... --spec SPEC</c>: streams many spectra through the assessment and a tolerance spec.</summary>
internal sealed class BatchCommand(TextReader stdin, TextWriter stdout, TextWriter stderr, bool stderrIsTerminal, CancellationToken interrupt = default, bool stdoutIsTerminal = false)
{
    private readonly InputOptions _inputs = new();
    private readonly SpecOptions _spec = new(required: true);
    private readonly UncertaintyOptions _uncertainty = new();
    public Option<string?> Out { get; } = OutputTarget.Option("Results file, one row per input record (.json for JSON, else CSV); default: CSV on standard output.");
    public Option<string?> Summary { get; } = new("--summary") { Description = "Summary file (.json for JSON, else text); default: standard output after a results file, or standard error." };
    public Option<int> Threads { get; } = CommonOptions.Threads();
    public Option<string?> FormatOption { get; } = new("--format") { Description = "Results format: csv, json (an array), jsonl (JSON Lines, one object per line) or parquet (Apache Parquet, typed columns; needs -o FILE). Default: from the --out name (.json, .jsonl, .ndjson, .parquet), else csv." };
    public Option<string?> Metrics { get; } = new("--metrics") { Description = "Extra result groups for the results and summary: cri, fidelity, photometry, nonvisual, spectral or all. Default: only what the spec's limits need (chromaticity always), the fastest." };
    public Option<string?> GroupBy { get; } = new("--group-by") { Description = "Metadata column (e.g. lot, station) or preamble key: a summary per value, and the subgroups of Cpk unless --subgroup-size is given." };
    public Option<int?> SubgroupSize { get; } = new Option<int?>("--subgroup-size") { Description = "Consecutive results per subgroup for Cpk (within-subgroup SD), at least 2." }.StrictWhole("5");

    private Lumen.Uncertainty.UncertaintyModel? _model;
    private Lumen.Uncertainty.MonteCarloOptions _run = new();
    private Lumen.Uncertainty.DecisionRule _rule;
    private MetricGroups _extraMetrics = MetricGroups.Colorimetry;

    /// <summary>Most rows of the terminal table, and most passing rows among them.</summary>
    private const int TerminalRowLimit = 200, TerminalPassRows = 20;

    /// <summary>The readable verdict table for a terminal: rounded to the digits that matter.</summary>
    private static readonly ColumnSchema<RecordOutcome> VerdictTable = new(
    [
        Column<RecordOutcome>.Text("id", o => o.Record.Name, "Unit"),
        Column<RecordOutcome>.Text("status", o => o.Status, "Verdict"),
        AnalysisColumns.Field("cct.kelvin", null, "CCT (K)"),
        AnalysisColumns.Field("cct.duv", null, "Duv"),
        Column<RecordOutcome>.Number("steps_from_target", o => o.Verdict?.StepsFromTarget, "0.0", "Steps"),
        AnalysisColumns.Field("cri.ra", null, "Ra"),
        AnalysisColumns.Field("cri.r9", null, "R9"),
        AnalysisColumns.Field("fidelity.rf", null, "Rf"),
        Column<RecordOutcome>.Text("failed", o => o.Verdict is { } v ? string.Join(" | ", v.Criteria.Where(c => !c.Pass).Select(c => c.Criterion)) : null, "Failed"),
    ]);

    public Command Build()
    {
        var cmd = new Command("batch", "Check many spectra against a tolerance spec: pass/fail per unit, batch statistics, outliers, Ppk with 95 % intervals.");
        _inputs.AddTo(cmd);
        _spec.AddTo(cmd);
        _uncertainty.AddTo(cmd);
        cmd.Add(Out); cmd.Add(Summary); cmd.Add(Threads); cmd.Add(GroupBy); cmd.Add(SubgroupSize); cmd.Add(FormatOption); cmd.Add(Metrics);
        FormatOption.AcceptOnlyFromAmong("csv", "json", "jsonl", "parquet");
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        try { return Judge(parse); }
        finally
        {
            // The scratch file's removal ran beside the output's flush and rename and the summary; it ends before the process.
            if (_scratchRemoval?.Result is { } failure) stderr.WriteLine($"lumen: note: {failure}");
        }
    }

    /// <summary>Removes the rows' scratch file on another thread: freeing its pages took 2-3 ms after the last row (issue 16).</summary>
    private Task<string?>? _scratchRemoval;

    private int Judge(ParseResult parse)
    {
        if (!_spec.TryLoad(parse, stdout, stderr, out var spec, out bool printed)) return ExitCodes.UsageError;
        if (printed) return ExitCodes.Success;
        if (!_inputs.TryResolve(parse, stderr, out var inputs, parse.GetValue(Out), parse.GetValue(Summary))) return ExitCodes.UsageError;
        if (!_uncertainty.TryLoad(parse, spec, stderr, out var model, out var mc, out var rule)) return ExitCodes.UsageError;
        _model = model;
        _run = mc with { Threads = 1 }; // the records run in parallel; each one's draws on its thread (same result either way)
        _rule = rule;
        string? outPath = parse.GetValue(Out), summaryPath = parse.GetValue(Summary);
        foreach (var p in new[] { outPath, summaryPath })
            if (OutputTarget.ConflictWithInputs(p, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen: {conflict}."); return ExitCodes.UsageError; }
        int threads = Math.Max(1, parse.GetValue(Threads));
        string format = parse.GetValue(FormatOption) ?? (outPath is null ? "csv"
            : outPath.EndsWith(".json", StringComparison.OrdinalIgnoreCase) ? "json"
            : outPath.EndsWith(".jsonl", StringComparison.OrdinalIgnoreCase) || outPath.EndsWith(".ndjson", StringComparison.OrdinalIgnoreCase) ? "jsonl"
            : outPath.EndsWith(".parquet", StringComparison.OrdinalIgnoreCase) ? "parquet" : "csv");
        bool parquet = format == "parquet", json = format is "json" or "jsonl", lines = format == "jsonl";
        if (parquet && (OutputTarget.IsStdout(outPath) || OutputTarget.IsDevice(Path.GetFullPath(outPath!))))
        {
            stderr.WriteLine("lumen: Parquet is a binary file format: give -o NAME.parquet (not standard output or a device).");
            return ExitCodes.UsageError;
        }
        if (!AnalyzeCommand.TryParseMetrics(parse.GetValue(Metrics) ?? "colorimetry", out var extra, out var badMetric))
        {
            stderr.WriteLine($"lumen: --metrics: '{badMetric}' is not a metric group; expected colorimetry, cri, fidelity, photometry, nonvisual, spectral or all.");
            return ExitCodes.UsageError;
        }
        _extraMetrics = extra;
        if (parse.GetValue(SubgroupSize) is < 2) { stderr.WriteLine("lumen: --subgroup-size must be at least 2 (a subgroup of one has no spread)."); return ExitCodes.UsageError; }
        var grouping = new BatchSummaryOptions(parse.GetValue(GroupBy), parse.GetValue(SubgroupSize));
        var metadataKeys = inputs.Files.SelectMany(f => SpectrumFiles.MetadataKeys(f, inputs.Layout)).Distinct(StringComparer.Ordinal).ToArray();
        if (grouping.GroupBy is { } by && metadataKeys.Length > 0 && !metadataKeys.Contains(by, StringComparer.Ordinal) && !inputs.Files.Contains("-"))
        {
            stderr.WriteLine($"lumen: --group-by '{by}' is not a metadata column or preamble key of the inputs; they have: {string.Join(", ", metadataKeys)}.");
            return ExitCodes.UsageError;
        }

        BatchSummary? summary = null;
        string? failure;
        if (outPath is null && stdoutIsTerminal && parse.GetValue(FormatOption) is null)
        {
            // At a terminal with no -o: a readable verdict table (failures first), not a wide CSV; -o - or a pipe gives CSV.
            var shown = new List<RecordOutcome>();
            int passes = 0;
            summary = Run(inputs, spec!, new BatchResultWriter(TextWriter.Null, json, spec!), new BatchSummaryBuilder(spec!, grouping), threads, o =>
            {
                if (o.Status == "pass" && ++passes > TerminalPassRows) return;
                if (shown.Count < TerminalRowLimit) shown.Add(o);
            });
            var ordered = shown.OrderBy(o => o.Status switch { "fail" => 0, "inconclusive" => 1, "error" => 2, _ => 3 }).ToList();
            VerdictTable.WriteTable(stdout, ordered, wholeLine: o => o.Error is { } e ? $"error  {e}" : null);
            if (passes > TerminalPassRows) stdout.WriteLine($"… and {passes - TerminalPassRows} more passing units (write every row with -o FILE or -o -).");
            stdout.WriteLine();
            stdout.WriteLine($"Specification: {spec!.Spec.Description}.");
            stdout.WriteLine($"Decision rule: {Lumen.Uncertainty.Decisions.Describe(rule)}.");
            if (spec.TargetDescription is { } target) stdout.WriteLine($"Target: {target}.");
            foreach (var c in spec.Cautions) stdout.WriteLine($"! {c}");
            stdout.WriteLine();
            BatchSummaryWriter.WriteText(summary, spec, stdout);
            stdout.Flush();
            if (interrupt.IsCancellationRequested) return ExitCodes.Interrupted;
            if (summary.Errors > 0) return ExitCodes.InputErrors;
            return Code(summary);
        }
        try
        {
            // Rows stream to a scratch file; once the batch is complete, the copy adds each row's robust z and
            // outlier flag, which need the whole batch (and, for Parquet, gives the columns their types).
            void Produce(Action<Stream, BatchSummaryBuilder, IReadOnlyList<bool>> finish)
            {
                var builder = new BatchSummaryBuilder(spec!, grouping);
                string scratch = Path.Combine(Path.GetTempPath(), $"lumen-rows-{Guid.NewGuid():N}.tmp");
                try
                {
                    IReadOnlyList<bool> numeric;
                    using (var rows = new StreamWriter(scratch, false, new UTF8Encoding(false), 1 << 16))
                    {
                        var writer = new BatchResultWriter(rows, json, spec!, metadataKeys, withUncertainty: model is not null, lines: lines);
                        summary = Run(inputs, spec!, writer, builder, threads);
                        writer.Complete();
                        numeric = writer.NumericColumns;
                    }
                    using var back = new FileStream(scratch, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 0);
                    finish(back, builder, numeric);
                }
                finally
                {
                    _scratchRemoval = Task.Run(() =>
                    {
                        try { File.Delete(scratch); return null; }
                        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { return $"could not remove the scratch file '{scratch}': {ex.Message}"; }
                    });
                }
            }
            failure = parquet
                ? OutputTarget.WriteFile(outPath!, stream => Produce((back, builder, numeric) => ParquetResults.Write(new StreamReader(back, Encoding.UTF8, false, 1 << 16), numeric, stream, builder.RobustZ, BatchSummaryBuilder.OutlierZ,
                    new Dictionary<string, string>(StringComparer.Ordinal)
                    {
                        ["lumen.version"] = LumenApp.Version,
                        ["lumen.spec"] = spec!.Spec.Description,
                        ["lumen.rule"] = Lumen.Uncertainty.Decisions.Describe(rule),
                        ["lumen.target"] = spec.TargetDescription ?? "",
                    })), partial: () => interrupt.IsCancellationRequested)
                : OutputTarget.WriteText(outPath, stdout, w => Produce((back, builder, _) => OutlierColumns.Copy(back, w, json, builder.RobustZ, BatchSummaryBuilder.OutlierZ)),
                    partial: () => interrupt.IsCancellationRequested);
        }
        catch (BatchWriteException ex) { failure = ex.Message; }
        if (failure is not null) return CommonOptions.OutputFailed(stderr, failure);
        if (interrupt.IsCancellationRequested)
        {
            string where = OutputTarget.IsStdout(outPath) ? "standard output" : $"'{OutputTarget.PartialPath(outPath!)}' ({(parquet ? "a complete Parquet file" : lines ? "complete JSON lines" : json ? "a complete JSON array" : "complete CSV rows")})";
            stderr.WriteLine($"lumen: interrupted: {summary!.RecordsRead:N0} records were written to {where}; "
                + (OutputTarget.IsStdout(outPath) ? "" : $"'{outPath}' was not changed. ")
                + "No summary was written. Run the batch again to get the complete results.");
            return ExitCodes.Interrupted;
        }

        // A CSV file has no place for the target the verdicts used: it goes to a sidecar beside it.
        if (!json && !parquet && !OutputTarget.IsStdout(outPath) && !OutputTarget.IsDevice(Path.GetFullPath(outPath!)) && (spec!.Centre is not null || rule != Lumen.Uncertainty.DecisionRule.Simple)
            && OutputTarget.WriteText(JsonTarget.SidecarPath(outPath!), stdout, w => JsonTarget.WriteSidecar(w, spec, Path.GetFileName(outPath!), rule)) is { } sidecarFailure)
            return CommonOptions.OutputFailed(stderr, sidecarFailure);

        var summaryTarget = summaryPath ?? (OutputTarget.IsStdout(outPath) ? null : "-");
        bool summaryJson = summaryPath?.EndsWith(".json", StringComparison.OrdinalIgnoreCase) == true;
        void WriteSummary(TextWriter w)
        {
            if (summaryJson) BatchSummaryWriter.WriteJson(summary!, spec!, w);
            else BatchSummaryWriter.WriteText(summary!, spec!, w);
        }
        if (summaryTarget is null) WriteSummary(stderr);
        else if (OutputTarget.WriteText(summaryTarget, stdout, WriteSummary) is { } f) return CommonOptions.OutputFailed(stderr, f);
        return Code(summary!);
    }

    private static int Code(BatchSummary s) =>
        s.Errors > 0 ? ExitCodes.InputErrors : s.Failed > 0 ? ExitCodes.SpecificationFailed : s.Inconclusive > 0 ? ExitCodes.Inconclusive : ExitCodes.Success;

    /// <summary>Reads, assesses and judges every record, writing rows in input order; memory stays flat.</summary>
    internal BatchSummary Run(InputSelection inputs, PreparedSpec spec, BatchResultWriter writer, BatchSummaryBuilder builder, int threads, Action<RecordOutcome>? observe = null)
    {
        var options = new AssessmentOptions(Metrics: spec.RequiredMetrics | _extraMetrics);
        var clock = Stopwatch.StartNew();
        long done = 0, nextProgressMs = 0;
        var progress = new ReadProgress();
        long totalBytes = inputs.Files.Where(File.Exists).Sum(f => new FileInfo(f).Length);

        // This thread reads, writes rows and feeds the summary in input order, and computes blocks while it waits; worker
        // threads compute the others (RecordBlocks). Memory stays flat.
        Exception? writeFailure = null;
        foreach (var item in RecordBlocks.Stream(inputs.Deferred(stdin, progress), options, spec, o => UncertaintyOptions.Propagate(o, options, spec, _model, _run, _rule), threads, interrupt))
        {
            try { writer.Write(item); }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { writeFailure = ex; break; } // stops the reader and the workers
            builder.Add(item);
            observe?.Invoke(item);
            CommonOptions.ReportError(stderr, item.Error);
            if (++done % RecordBlocks.BlockSize == 0 && stderrIsTerminal) ShowProgress();
        }
        if (writeFailure is not null) throw new BatchWriteException($"writing the results failed: {writeFailure.Message}", writeFailure);
        void ShowProgress()
        {
            if (clock.ElapsedMilliseconds < nextProgressMs) return;
            nextProgressMs = clock.ElapsedMilliseconds + 200;
            double rate = done / Math.Max(1e-9, clock.Elapsed.TotalSeconds);
            // ETA from the share of input bytes consumed (the reader runs a few blocks ahead, so it is slightly optimistic).
            double share = totalBytes > 0 ? Math.Clamp((double)progress.Bytes / totalBytes, 1e-6, 1) : 1;
            var eta = TimeSpan.FromSeconds(clock.Elapsed.TotalSeconds * (1 / share - 1));
            stderr.Write(string.Create(CultureInfo.InvariantCulture, $"\r{done:N0} records, {rate:N0}/s, {clock.Elapsed:mm\\:ss} elapsed, about {eta:mm\\:ss} to go   "));
        }
        if (stderrIsTerminal) stderr.WriteLine();
        return builder.Build();
    }
}

/// <summary>Writing batch results failed part-way (the target keeps its previous content).</summary>
internal sealed class BatchWriteException(string message, Exception inner) : IOException(message, inner);
