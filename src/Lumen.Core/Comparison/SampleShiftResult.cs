namespace Lumen.Comparison;

/// <summary>How much object colours shift between two sources after white balance (CAT16 to D65, CIELAB, CIEDE2000).</summary>
/// <param name="Method">The method in words, for outputs.</param>
/// <param name="MeanDeltaE00">Mean ΔE00 over the 99 CIE 224 colour evaluation samples.</param>
/// <param name="MaxDeltaE00">Largest ΔE00 over those samples.</param>
/// <param name="Worst">The samples with the largest ΔE00, largest first: one-based CES number and ΔE00.</param>
/// <param name="Tcs13DeltaE00">ΔE00 of CIE 13.3 TCS13 (human complexion).</param>
/// <param name="CesDeltaE00">ΔE00 of every CES, CES1 first.</param>
public sealed record SampleShiftResult(string Method, double MeanDeltaE00, double MaxDeltaE00, IReadOnlyList<(int Sample, double DeltaE00)> Worst,
    double Tcs13DeltaE00, IReadOnlyList<double> CesDeltaE00);
