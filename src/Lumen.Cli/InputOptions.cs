using System.CommandLine;
using Lumen.Analysis;
using Lumen.Formats;
using Lumen.Spectra;

namespace Lumen.Cli;

/// <summary>
/// The input options every verb that reads spectra shares: files, folders (searched recursively for .csv, .tsv, .txt and .spdx)
/// and <c>-</c> for standard input; the unit when a file declares none; the layout.
/// </summary>
internal sealed class InputOptions
{
    public Argument<string[]> Inputs { get; } = new("inputs")
    {
        Description = "Spectrum files or folders (searched recursively for .csv, .tsv, .txt, .spdx); '-' reads standard input.",
        Arity = ArgumentArity.OneOrMore,
    };

    public Option<string?> Unit { get; } = new("--unit")
    {
        Description = "Unit of the values when a file does not declare one: relative (default), W/m2/nm, W/sr/m2/nm, W/sr/nm or W/nm.",
    };

    public Option<string> Layout { get; } = new("--layout")
    {
        Description = "Input layout: auto (detected), rows (one spectrum per row) or columns (one spectrum per column).",
        DefaultValueFactory = _ => "auto",
    };

    /// <summary>Adds the options to a command.</summary>
    public void AddTo(Command command)
    {
        Layout.AcceptOnlyFromAmong("auto", "rows", "columns");
        command.Add(Inputs);
        command.Add(Unit);
        command.Add(Layout);
    }

    /// <summary>The input paths as given (before folder expansion).</summary>
    public IReadOnlyList<string> Given(ParseResult parse) => parse.GetValue(Inputs) ?? [];

    /// <summary>Checks the options and expands the inputs, leaving this run's outputs out of folder scans; false (with
    /// the message written) on a usage error.</summary>
    public bool TryResolve(ParseResult parse, TextWriter stderr, out InputSelection selection, params string?[] outputs)
    {
        selection = default!;
        foreach (var given in Given(parse))
        {
            // System.CommandLine passes an unknown "--name" through as an argument; a file of that name is rare, an
            // option typo is not.
            if (given.Length > 1 && given[0] == '-' && !File.Exists(given) && !Directory.Exists(given))
            {
                stderr.WriteLine($"lumen: unknown option '{given}' (to read a file whose name starts with '-', write ./{given}). Try 'lumen --help'.");
                return false;
            }
        }
        SpectralUnit? unit = null;
        if (parse.GetValue(Unit) is { } text)
        {
            if (!SpectralUnits.TryParse(text, out var u))
            {
                stderr.WriteLine($"lumen: --unit '{text}' is not a unit; expected relative, W/m2/nm, W/sr/m2/nm, W/sr/nm or W/nm.");
                return false;
            }
            unit = u;
        }
        TableLayout? layout = parse.GetValue(Layout) switch { "rows" => TableLayout.Rows, "columns" => TableLayout.Columns, _ => null };
        var exclude = outputs.Where(o => o is not null && o != "-").Select(o => o!).ToArray();
        // An output inside a scanned folder is left out of the scan (a rerun must not read its own earlier results), but
        // if that file holds spectra it is an input the user meant to read: writing would destroy it.
        foreach (var output in exclude)
            if (File.Exists(output) && InsideAFolder(output, Given(parse)) is { } folder && HoldsSpectra(output))
            {
                stderr.WriteLine($"lumen: the output '{output}' is a spectrum file in the input folder '{folder}'; writing it would replace that data: choose another output file.");
                return false;
            }
        selection = new InputSelection(SpectrumFiles.Expand(Given(parse), exclude), unit, layout);
        return true;
    }

    /// <summary>The given folder (if any) that holds <paramref name="path"/>, at any depth.</summary>
    private static string? InsideAFolder(string path, IEnumerable<string> given)
    {
        string full = Path.GetFullPath(path);
        foreach (var g in given)
            if (g != "-" && Directory.Exists(g) && full.StartsWith(Path.TrimEndingDirectorySeparator(Path.GetFullPath(g)) + Path.DirectorySeparatorChar, StringComparison.Ordinal))
                return g;
        return null;
    }

    /// <summary>Whether a file reads as spectra (one of its first records is a spectrum, not an error): a data file, not
    /// Lumen's own results.</summary>
    private static bool HoldsSpectra(string path)
    {
        try { return SpectrumFiles.Read(path).Take(16).Any(r => r is SpectrumRecord); }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { return false; }
    }
}

/// <summary>Resolved inputs: the files after folder expansion, the default unit and the layout.</summary>
internal sealed record InputSelection(IReadOnlyList<InputFile> Inputs, SpectralUnit? Unit, TableLayout? Layout)
{
    /// <summary>The paths of the inputs.</summary>
    public IReadOnlyList<string> Files => Inputs.Select(f => f.Path).ToArray();

    /// <summary>Every record of every file, in order (the row layout streams).</summary>
    public IEnumerable<InputRecord> Records(TextReader stdin, ReadProgress? progress = null) => Deferred(stdin, progress).Select(parse => parse());

    /// <summary>Every record of every file, in order, each parsed when its item is called (row-layout rows can then be
    /// parsed on the compute threads while this one reads).</summary>
    public IEnumerable<Func<InputRecord>> Deferred(TextReader stdin, ReadProgress? progress = null)
    {
        foreach (var file in Inputs)
        {
            if (file.Problem is { } problem) { var e = ErrorRecord.ForFile(file.Path, problem); yield return () => e; continue; }
            foreach (var r in SpectrumFiles.ReadDeferred(file.Path, Unit, stdin, Layout, progress)) yield return r;
        }
    }
}
