using Lumen.Conformance;
using Lumen.Uncertainty;

namespace Lumen.Analysis;

/// <summary>
/// What became of one input record: its assessment (and verdict, when a specification was given), or its error.
/// Every writer, plot and report reads these, in input order.
/// </summary>
/// <param name="Record">The input record.</param>
/// <param name="Assessment">The assessment; null exactly when <see cref="Error"/> is not.</param>
/// <param name="Verdict">The verdict against the specification; null without a specification or for an error.</param>
/// <param name="Error">Why the record has no result (unreadable, or its computation failed); null when it has one.</param>
public sealed record RecordOutcome(InputRecord Record, Assessment? Assessment, Verdict? Verdict, ReadDiagnostic? Error)
{
    /// <summary>The measurement uncertainty of the results (Monte Carlo), or null when none was asked for.</summary>
    public UncertaintyResult? Uncertainty { get; init; }

    /// <summary>The decision rule the verdict is read under (simple acceptance unless guarded acceptance was asked for).</summary>
    public DecisionRule Rule { get; init; } = DecisionRule.Simple;

    /// <summary>The verdict under <see cref="Rule"/> with <see cref="Uncertainty"/>: the unit's decision and each
    /// criterion's; null without a verdict.</summary>
    public (Decision Unit, IReadOnlyList<Decision> Criteria)? Judgement => Verdict is { } v ? Decisions.Of(v, Uncertainty, Rule) : null;

    /// <summary><c>pass</c>, <c>fail</c>, <c>inconclusive</c> (guarded acceptance: too close to a limit to call),
    /// <c>ok</c> (a result without a specification) or <c>error</c>.</summary>
    public string Status => Assessment is null ? "error" : Verdict is null ? "ok" : Rule == DecisionRule.Simple ? (Verdict.Pass ? "pass" : "fail") : Judgement!.Value.Unit switch
    {
        Lumen.Uncertainty.Decision.Pass => "pass",
        Lumen.Uncertainty.Decision.Fail => "fail",
        _ => "inconclusive",
    };

    /// <summary>Assesses a record and, with a specification, judges it; an error record passes through.</summary>
    /// <param name="record">The input record.</param>
    /// <param name="options">What to compute.</param>
    /// <param name="spec">The specification, or null for none.</param>
    /// <returns>The outcome (never throws for a record that was read: a failing computation becomes its error).</returns>
    public static RecordOutcome Of(InputRecord record, AssessmentOptions options, PreparedSpec? spec = null)
    {
        ArgumentNullException.ThrowIfNull(record);
        ArgumentNullException.ThrowIfNull(options);
        switch (record)
        {
            case SpectrumRecord s:
                try
                {
                    var a = Assessor.Assess(s.Spectrum, options);
                    return new RecordOutcome(record, a, spec?.Evaluate(a), null);
                }
                catch (Exception ex) when (ex is not OutOfMemoryException and not OperationCanceledException)
                {
                    // Per-record isolation: a computation that fails on one spectrum becomes that record's error row.
                    return Failed(record, ex);
                }
            case ErrorRecord e:
                return new RecordOutcome(record, null, null, e.Error);
            default:
                throw new ArgumentException("Unknown record kind.", nameof(record));
        }
    }

    /// <summary>
    /// Assesses and judges many records at once: the same outcomes as <see cref="Of"/> on each, with the spectra's
    /// rendition indices computed together (<see cref="Assessor.AssessMany"/>). Should the block's computation fail,
    /// each record is computed alone, so a failure stays that one record's error row.
    /// </summary>
    /// <param name="records">The input records (spectra and error records, in any mix).</param>
    /// <param name="options">What to compute.</param>
    /// <param name="spec">The specification, or null for none.</param>
    /// <returns>One outcome per record, in order.</returns>
    public static RecordOutcome[] OfMany(IReadOnlyList<InputRecord> records, AssessmentOptions options, PreparedSpec? spec = null)
    {
        ArgumentNullException.ThrowIfNull(records);
        ArgumentNullException.ThrowIfNull(options);
        var spectra = new List<Spectra.Spectrum>(records.Count);
        foreach (var r in records) if (r is SpectrumRecord s) spectra.Add(s.Spectrum);
        var outcomes = new RecordOutcome[records.Count];
        Assessment[] assessments;
        try { assessments = Assessor.AssessMany(spectra, options); }
        catch (Exception ex) when (ex is not OutOfMemoryException and not OperationCanceledException)
        {
            for (int i = 0; i < records.Count; i++) outcomes[i] = Of(records[i], options, spec);
            return outcomes;
        }
        int next = 0;
        for (int i = 0; i < records.Count; i++)
        {
            var record = records[i] ?? throw new ArgumentException("A record is null.", nameof(records));
            if (record is not SpectrumRecord) { outcomes[i] = Of(record, options, spec); continue; }
            var a = assessments[next++];
            try { outcomes[i] = new RecordOutcome(record, a, spec?.Evaluate(a), null); }
            catch (Exception ex) when (ex is not OutOfMemoryException and not OperationCanceledException) { outcomes[i] = Failed(record, ex); }
        }
        return outcomes;
    }

    private static RecordOutcome Failed(InputRecord record, Exception ex) =>
        new(record, null, null, new ReadDiagnostic(record.Source, record.Line, record.Column,
            $"could not compute this spectrum ({ex.GetType().Name}: {ex.Message}); please report it with the input"));
}
