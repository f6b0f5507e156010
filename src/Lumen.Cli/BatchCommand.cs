using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using Lumen.Assessment;
using Lumen.Conformance;
using Lumen.Formats;
using Lumen.Quality;
using Lumen.Spectra;

namespace Lumen.Cli;

/// <summary><c>lumen batch INPUT... --spec SPEC</c>: streams many spectra through the assessment and a tolerance spec.</summary>
internal sealed class BatchCommand(TextWriter stdout, TextWriter stderr, bool stderrIsTerminal)
{
    public Argument<string[]> Inputs { get; } = new("inputs") { Description = "Files or folders (searched recursively for .csv, .tsv, .txt).", Arity = ArgumentArity.OneOrMore };
    public Option<string> Spec { get; } = new("--spec") { Description = "Tolerance specification (JSON; see examples/spec-dl30.json).", Required = true };
    public Option<string?> Out { get; } = new("--out") { Description = "Results file, one row per input record (.csv or .json); default: CSV on standard output." };
    public Option<string?> Summary { get; } = new("--summary") { Description = "Summary file (.json for JSON, else text); default: standard output after --out, or standard error." };
    public Option<string> Layout { get; } = new("--layout") { Description = "Input layout: auto, rows (one spectrum per row) or columns.", DefaultValueFactory = _ => "auto" };
    public Option<string?> Unit { get; } = new("--unit") { Description = "Unit when files do not declare one (as for analyze)." };
    public Option<int> Threads { get; } = new("--threads") { Description = "Worker threads (default: all cores).", DefaultValueFactory = _ => Environment.ProcessorCount };

    /// <summary>Records computed per parallel chunk (input order is kept).</summary>
    internal const int ChunkSize = 512;

    public Command Build()
    {
        Layout.AcceptOnlyFromAmong("auto", "rows", "columns");
        var cmd = new Command("batch", "Check many spectra against a tolerance spec: pass/fail per unit, batch statistics, outliers, Cpk.")
        {
            Inputs, Spec, Out, Summary, Layout, Unit, Threads,
        };
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        var spec = SpecReader.ReadFile(parse.GetValue(Spec)!, out var specErrors);
        if (spec is null)
        {
            foreach (var e in specErrors) stderr.WriteLine($"lumen: {e}");
            return ExitCodes.UsageOrInputError;
        }
        SpectralUnit? unit = null;
        if (parse.GetValue(Unit) is { } ut)
        {
            if (!SpectralUnits.TryParse(ut, out var u)) { stderr.WriteLine($"lumen: --unit '{ut}' is not a unit."); return ExitCodes.UsageOrInputError; }
            unit = u;
        }
        var files = SpectrumFiles.Expand(parse.GetValue(Inputs) ?? []);
        string layout = parse.GetValue(Layout)!;
        int threads = Math.Max(1, parse.GetValue(Threads));

        string? outPath = parse.GetValue(Out);
        TextWriter? outFile = null;
        try
        {
            outFile = outPath is null ? null : new StreamWriter(outPath);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            stderr.WriteLine($"lumen: cannot write '{outPath}': {ex.Message}");
            return ExitCodes.UsageOrInputError;
        }
        BatchSummary summary;
        try
        {
            using (outFile)
            using (var writer = BatchWriter.Create(outFile ?? stdout, outPath?.EndsWith(".json", StringComparison.OrdinalIgnoreCase) == true, spec))
            {
                summary = Run(files, layout, unit, spec, writer, threads);
                writer.Complete();
            }
        }
        catch (IOException ex)
        {
            stderr.WriteLine($"lumen: {ex.Message}");
            return ExitCodes.UsageOrInputError;
        }

        string? summaryPath = parse.GetValue(Summary);
        var summaryTarget = summaryPath is null ? (outPath is null ? stderr : stdout) : null;
        try
        {
            using var sw = summaryPath is null ? null : new StreamWriter(summaryPath);
            var target = sw ?? summaryTarget!;
            if (summaryPath?.EndsWith(".json", StringComparison.OrdinalIgnoreCase) == true) BatchSummaryWriter.WriteJson(summary, spec, target);
            else BatchSummaryWriter.WriteText(summary, spec, target);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            stderr.WriteLine($"lumen: cannot write '{summaryPath}': {ex.Message}");
            return ExitCodes.UsageOrInputError;
        }
        if (summary.Errors > 0) return ExitCodes.UsageOrInputError;
        return summary.Failed > 0 ? ExitCodes.SpecificationFailed : ExitCodes.Success;
    }

    /// <summary>Reads, assesses and judges every record, writing rows in input order; memory stays flat.</summary>
    internal BatchSummary Run(IReadOnlyList<string> files, string layout, SpectralUnit? unit, ToleranceSpec spec, BatchWriter writer, int threads)
    {
        var options = new AssessmentOptions(Metrics: MetricsFor(spec));
        var prepared = SpecEvaluator.Prepare(spec);
        var ellipse = prepared.Ellipse;
        var builder = new BatchSummaryBuilder(spec.Limits.Select(l => (l.Field, l.Min, l.Max)).ToArray(),
            ellipse is null ? null : (x1, y1, x2, y2) => ellipse.MovedTo(x2, y2).Steps(x1, y1));
        var clock = Stopwatch.StartNew();
        long done = 0;
        var progress = new ReadProgress();
        long totalBytes = files.Where(File.Exists).Sum(f => new FileInfo(f).Length);
        var po = new ParallelOptions { MaxDegreeOfParallelism = threads };

        // Three stages: a reader task fills chunks ahead, this thread computes each chunk in parallel, and a
        // writer task writes rows and feeds the summary in input order. Queues are bounded (a few chunks in
        // flight), so memory stays flat; writing overlaps computing of the next chunk.
        using var toCompute = new System.Collections.Concurrent.BlockingCollection<List<SpectrumRecord>>(4);
        using var toWrite = new System.Collections.Concurrent.BlockingCollection<BatchItem[]>(2);
        var reader = Task.Run(() =>
        {
            try
            {
                var chunk = new List<SpectrumRecord>(ChunkSize);
                foreach (var record in Records(files, layout, unit, progress))
                {
                    chunk.Add(record);
                    if (chunk.Count == ChunkSize) { toCompute.Add(chunk); chunk = new List<SpectrumRecord>(ChunkSize); }
                }
                if (chunk.Count > 0) toCompute.Add(chunk);
            }
            finally { toCompute.CompleteAdding(); }
        });
        void WriteChunk(BatchItem[] items)
        {
            foreach (var item in items)
            {
                writer.Write(item);
                if (item.Result is { } a && item.Verdict is { } v)
                    builder.AddResult(item.Record.Name, a.Chromaticity2Degree, v.Pass, p => AssessmentFields.Get(a, p), v.StepsFromTarget);
                else
                {
                    builder.AddError();
                    stderr.WriteLine($"lumen: {item.Record.Error}");
                }
            }
            done += items.Length;
            if (stderrIsTerminal)
            {
                double rate = done / Math.Max(1e-9, clock.Elapsed.TotalSeconds);
                // ETA from the share of input bytes consumed (the reader runs a few chunks ahead, so it is slightly optimistic).
                double share = totalBytes > 0 ? Math.Clamp((double)progress.Bytes / totalBytes, 1e-6, 1) : 1;
                var eta = TimeSpan.FromSeconds(clock.Elapsed.TotalSeconds * (1 / share - 1));
                stderr.Write(string.Create(CultureInfo.InvariantCulture, $"\r{done:N0} records, {rate:N0}/s, {clock.Elapsed:mm\\:ss} elapsed, about {eta:mm\\:ss} to go   "));
            }
        }

        Exception? writeFailure = null;
        var writerTask = Task.Run(() =>
        {
            foreach (var items in toWrite.GetConsumingEnumerable())
            {
                if (writeFailure is not null) continue; // keep draining so the computing stage never blocks
                try { WriteChunk(items); }
                catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { writeFailure = ex; }
            }
        });
        try
        {
            foreach (var chunk in toCompute.GetConsumingEnumerable())
            {
                var results = new BatchItem[chunk.Count];
                Parallel.For(0, chunk.Count, po, i => results[i] = Judge(chunk[i], prepared, options));
                toWrite.Add(results);
            }
        }
        finally { toWrite.CompleteAdding(); }
        reader.GetAwaiter().GetResult();
        writerTask.GetAwaiter().GetResult();
        if (writeFailure is not null) throw new IOException($"writing the results failed: {writeFailure.Message}", writeFailure);
        if (stderrIsTerminal) stderr.WriteLine();
        return builder.Build();
    }

    /// <summary>The result groups a batch needs: colorimetry, CIE 13.3 and CIE 224 (for the summary), and any group a limit names.</summary>
    internal static MetricGroups MetricsFor(ToleranceSpec spec)
    {
        var m = MetricGroups.Colorimetry | MetricGroups.Cri | MetricGroups.Fidelity;
        foreach (var l in spec.Limits)
        {
            m |= l.Field.Split('.')[0] switch
            {
                "photometry" => MetricGroups.Photometry,
                "nonVisual" => MetricGroups.NonVisual,
                "spectral" => MetricGroups.Spectral,
                _ => MetricGroups.Colorimetry,
            };
        }
        return m;
    }

    internal static BatchItem Judge(SpectrumRecord record, PreparedSpec spec, AssessmentOptions options)
    {
        if (record.Spectrum is null) return new BatchItem(record, null, null);
        var a = Assessor.Assess(record.Spectrum, options);
        var verdict = spec.Evaluate(a.Chromaticity2Degree, p => AssessmentFields.Get(a, p));
        return new BatchItem(record, a, verdict);
    }

    /// <summary>All records of all files, streamed (row layout) or per file (column layout).</summary>
    internal static IEnumerable<SpectrumRecord> Records(IEnumerable<string> files, string layout, SpectralUnit? unit, ReadProgress? progress = null)
    {
        TableLayout? kind = layout switch { "rows" => TableLayout.Rows, "columns" => TableLayout.Columns, _ => null };
        foreach (var file in files)
            foreach (var r in SpectrumFiles.Read(file, unit, null, kind, progress)) yield return r;
    }
}
