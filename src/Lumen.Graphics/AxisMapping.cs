using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>A linear mapping from data coordinates to a pixel rectangle (y up in data, down in pixels).</summary>
/// <param name="Plot">The plot rectangle in pixels.</param>
/// <param name="XMin">Data x at the left edge.</param>
/// <param name="XMax">Data x at the right edge.</param>
/// <param name="YMin">Data y at the bottom edge.</param>
/// <param name="YMax">Data y at the top edge.</param>
public sealed record AxisMapping(SKRect Plot, double XMin, double XMax, double YMin, double YMax)
{
    /// <summary>Pixel x of a data x.</summary>
    /// <param name="x">Data x.</param>
    /// <returns>Pixel x.</returns>
    public float Px(double x) => (float)(Plot.Left + (x - XMin) / (XMax - XMin) * Plot.Width);

    /// <summary>Pixel y of a data y.</summary>
    /// <param name="y">Data y.</param>
    /// <returns>Pixel y.</returns>
    public float Py(double y) => (float)(Plot.Bottom - (y - YMin) / (YMax - YMin) * Plot.Height);

    /// <summary>Data x of a pixel x.</summary>
    /// <param name="px">Pixel x.</param>
    /// <returns>Data x.</returns>
    public double X(float px) => XMin + (px - Plot.Left) / Plot.Width * (XMax - XMin);

    /// <summary>Data y of a pixel y.</summary>
    /// <param name="py">Pixel y.</param>
    /// <returns>Data y.</returns>
    public double Y(float py) => YMin + (Plot.Bottom - py) / Plot.Height * (YMax - YMin);

    /// <summary>Draws the panel, grid, ticks, tick labels and axis titles.</summary>
    internal void DrawAxes(SKCanvas canvas, string xTitle, string yTitle, float s, string xFormat = "0.###", string yFormat = "0.###")
    {
        using var panel = Style.Fill(Style.Panel);
        canvas.DrawRect(Plot, panel);
        using var grid = Style.Stroke(Style.Grid, 1 * s);
        using var frame = Style.Stroke(Style.Muted, 1.2f * s);
        foreach (var x in Ticks(XMin, XMax, 8))
        {
            float px = Px(x);
            canvas.DrawLine(px, Plot.Top, px, Plot.Bottom, grid);
            canvas.DrawLine(px, Plot.Bottom, px, Plot.Bottom + 5 * s, frame);
            Style.Text(canvas, x.ToString(xFormat, System.Globalization.CultureInfo.InvariantCulture), px, Plot.Bottom + 20 * s, 13 * s, Style.Ink, SKTextAlign.Center);
        }
        foreach (var y in Ticks(YMin, YMax, 7))
        {
            float py = Py(y);
            canvas.DrawLine(Plot.Left, py, Plot.Right, py, grid);
            canvas.DrawLine(Plot.Left - 5 * s, py, Plot.Left, py, frame);
            Style.Text(canvas, y.ToString(yFormat, System.Globalization.CultureInfo.InvariantCulture), Plot.Left - 8 * s, py + 4.5f * s, 13 * s, Style.Ink, SKTextAlign.Right);
        }
        canvas.DrawRect(Plot, frame);
        Style.Text(canvas, xTitle, Plot.MidX, Plot.Bottom + 44 * s, 15 * s, Style.Ink, SKTextAlign.Center);
        canvas.Save();
        canvas.RotateDegrees(-90, Plot.Left - 58 * s, Plot.MidY);
        Style.Text(canvas, yTitle, Plot.Left - 58 * s, Plot.MidY, 15 * s, Style.Ink, SKTextAlign.Center);
        canvas.Restore();
    }

    /// <summary>"Nice" tick values covering [min, max].</summary>
    internal static IEnumerable<double> Ticks(double min, double max, int target)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max) || !(max > min)) yield break;
        double raw = (max - min) / target;
        double mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = new[] { 1, 2, 2.5, 5, 10 }.Select(m => m * mag).First(v => v >= raw);
        for (double v = Math.Ceiling(min / step) * step; v <= max + step * 1e-9; v += step)
        {
            double t = Math.Round(v / step) * step;
            yield return t == 0 ? 0 : t; // no "-0" labels
        }
    }
}
