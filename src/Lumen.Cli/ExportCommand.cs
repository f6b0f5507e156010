using System.CommandLine;
using Lumen.Analysis;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary><c>lumen export INPUT... -o PATH</c>: writes every spectrum Lumen reads as IES TM-27 spectral data XML (or as column-layout CSV).</summary>
internal sealed class ExportCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Option<string?> Out { get; } = OutputTarget.Option("A .spdx file for one spectrum, or a folder (created if needed) that gets NAME.spdx per spectrum.", required: true);
    public Option<string> Format { get; } = new("--format") { Description = "Exchange format: tm27 (IES TM-27 spectral data XML, default) or csv (the column layout every verb reads).", DefaultValueFactory = _ => "tm27" };

    public Command Build()
    {
        Format.AcceptOnlyFromAmong("tm27", "csv");
        var cmd = new Command("export", "Write spectra in an open exchange format (IES TM-27 XML), keeping their header fields (metadata).");
        _inputs.AddTo(cmd);
        cmd.Add(Out); cmd.Add(Format);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        string outPath = parse.GetValue(Out)!;
        if (!_inputs.TryResolve(parse, stderr, out var inputs, outPath)) return ExitCodes.UsageError;
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen export: {conflict}."); return ExitCodes.UsageError; }
        var records = inputs.Records(stdin).ToList();
        bool errors = false;
        foreach (var r in records.OfType<ErrorRecord>()) { CommonOptions.ReportError(stderr, r.Error); errors = true; }
        var spectra = records.OfType<SpectrumRecord>().ToList();
        if (spectra.Count == 0) { stderr.WriteLine("lumen export: no readable spectrum to export."); return errors ? ExitCodes.InputErrors : ExitCodes.UsageError; }
        bool csv = parse.GetValue(Format) == "csv";
        string ext = csv ? ".csv" : ".spdx";
        bool single = outPath.EndsWith(ext, StringComparison.OrdinalIgnoreCase) || OutputTarget.IsStdout(outPath);
        if (single && spectra.Count > 1) { stderr.WriteLine($"lumen export: {spectra.Count} spectra need a folder as -o (one {ext} each), not '{outPath}'."); return ExitCodes.UsageError; }
        var used = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        foreach (var s in spectra)
        {
            string target = single ? outPath : Path.Combine(outPath, Unique(FileName(s.Name), used) + ext);
            if (!single)
            {
                try { Directory.CreateDirectory(outPath); }
                catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { return CommonOptions.OutputFailed(stderr, $"cannot create the folder '{outPath}': {ex.Message}"); }
            }
            var header = s.Metadata.Count > 0 ? s.Metadata : [new("Description", s.Name), new("DocumentCreator", "Lumen " + LumenApp.Version), new("Comments", "exported from " + s.Location)];
            void Write(TextWriter w)
            {
                if (csv) SpectrumCsv.Write(w, s.Spectrum, "exported from " + s.Location);
                else Tm27.Write(w, s.Spectrum, header);
            }
            if (OutputTarget.WriteText(target, stdout, Write) is { } failure) return CommonOptions.OutputFailed(stderr, failure);
            if (!OutputTarget.IsStdout(target)) stdout.WriteLine($"wrote {target}");
        }
        return errors ? ExitCodes.InputErrors : ExitCodes.Success;
    }

    /// <summary>A file name from a spectrum name: letters, digits, '-', '_' and '.' kept, the rest '_'.</summary>
    internal static string FileName(string name)
    {
        var chars = name.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' ? c : '_').ToArray();
        var s = new string(chars).Trim('.', '_');
        return s.Length == 0 ? "spectrum" : s.Length > 80 ? s[..80] : s;
    }

    private static string Unique(string stem, HashSet<string> used)
    {
        string name = stem;
        for (int k = 2; !used.Add(name); k++) name = $"{stem}-{k}";
        return name;
    }
}
