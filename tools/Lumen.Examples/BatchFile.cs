using System.Globalization;
using System.Text;
using Lumen.Spectra;
using Lumen.Synthetic;

/// <summary>
/// Writes a production-tester style row file (invented data): unit_id, lot, then one 5 nm spectrum per row,
/// 380–780 nm. One unit in ten comes from a second phosphor lot (lot B) that runs about 370 K higher in CCT
/// (a shifted subgroup). With faults: a text cell, a NaN cell, an empty cell and a short (ragged) row are injected at
/// known rows so tests can check that every fault is reported and nothing is lost.
/// </summary>
public static class BatchFile
{
    /// <summary>Row numbers (1-based data rows) that get faults when asked.</summary>
    public static readonly int[] FaultRows = [7, 19, 33, 58];

    public static void Write(string path, int rows, int seed, bool faults, int stepNm = 5)
    {
        var inv = CultureInfo.InvariantCulture;
        var grid = SyntheticSpectra.Grid(380, 780, stepNm);
        var rng = new Random(seed);
        using var w = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 16);
        w.Write("# Quillfern Lighting Works (fictional) DL-30 end-of-line test, invented data from tools/Lumen.Examples\n");
        w.Write("# unit: relative\n");
        w.Write("unit_id,lot");
        foreach (var x in grid) w.Write(',' + x.ToString("0", inv));
        w.Write('\n');
        var sb = new StringBuilder(1024);
        var values = new double[grid.Length];
        for (int r = 1; r <= rows; r++)
        {
            bool shifted = r % 10 == 3; // one unit in ten from lot B
            // Weights tuned so that lot A sits at 3000 K, Duv 0 and lot B near 3370 K, Duv −0.0015.
            double blue = (shifted ? 0.9215 * 1.3 : 0.9215) * (1 + 0.02 * Gauss(rng));
            double red = (shifted ? 1.3841 * 0.8 : 1.3841) * (1 + 0.02 * Gauss(rng));
            double bluePeak = 451 + 1.0 * Gauss(rng);
            Fill(values, grid, bluePeak, blue, red, rng);
            sb.Clear();
            sb.Append("DL30-").Append(r.ToString("0000000", inv)).Append(',').Append(shifted ? "B" : "A");
            int fault = faults ? Array.IndexOf(FaultRows, r) : -1;
            for (int i = 0; i < values.Length; i++)
            {
                if (fault == 3 && i == values.Length - 1) break; // ragged: last cell missing
                sb.Append(',');
                if (fault == 0 && i == 20) sb.Append("n/a");
                else if (fault == 1 && i == 30) sb.Append("NaN");
                else if (fault == 2 && i == 40) { }
                else sb.Append(values[i].ToString("0.#####", inv));
            }
            sb.Append('\n');
            w.Write(sb);
        }
    }

    private static void Fill(double[] v, double[] grid, double bluePeak, double blue, double red, Random rng)
    {
        for (int i = 0; i < grid.Length; i++)
        {
            double x = grid[i];
            v[i] = blue * G(x, bluePeak, 20) + G(x, 552, 110) + red * G(x, 625, 85) + 0.001 * Gauss(rng);
        }
    }

    private static double G(double x, double mu, double fwhm) { double d = (x - mu) / (fwhm / 2.354820045); return Math.Exp(-0.5 * d * d); }

    private static double Gauss(Random rng) => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
}
