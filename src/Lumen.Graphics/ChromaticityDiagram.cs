using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Conformance;
using Lumen.Temperature;
using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>
/// A CIE 1931 xy or CIE 1976 u′v′ diagram: the spectrum locus with a colour fill, the Planckian locus with
/// CCT ticks and isotemperature lines, Duv = ±0.01 and ±0.02 lines, optional spec geometry, and measured
/// points marked by pass/fail — zoomed automatically to the points.
/// </summary>
public static class ChromaticityDiagram
{
    private static readonly int[] TickCcts = [1500, 2000, 2500, 2700, 3000, 3500, 4000, 4500, 5000, 5700, 6500, 8000, 10000, 15000];

    /// <summary>The axis mapping the diagram uses for these options and size (tests use it to find pixels).</summary>
    /// <param name="options">Options.</param>
    /// <param name="size">Image size.</param>
    /// <returns>The mapping.</returns>
    public static AxisMapping Layout(DiagramOptions options, SKSize size)
    {
        ArgumentNullException.ThrowIfNull(options);
        float s = Style.Scale(size);
        var plot = new SKRect(90 * s, 60 * s, size.Width - 40 * s, size.Height - 80 * s);
        double x0, x1, y0, y1;
        var pts = options.Points.Where(p => p.Chromaticity.IsDefined).Select(p => Coord(p.Chromaticity, options.Space)).ToList();
        foreach (var p in options.Points) pts.AddRange(p.UncertaintyEllipse(16).Select(c => Coord(c, options.Space)));
        if (options.Spec?.Spec.Target is { } t) pts.Add(Coord(t.Centre, options.Space));
        if (pts.Count == 0)
        {
            (x0, x1, y0, y1) = options.Space == DiagramSpace.Xy ? (0.0, 0.8, 0.0, 0.9) : (0.0, 0.65, 0.0, 0.62);
        }
        else
        {
            x0 = pts.Min(p => p.X); x1 = pts.Max(p => p.X); y0 = pts.Min(p => p.Y); y1 = pts.Max(p => p.Y);
            double span = Math.Max(Math.Max(x1 - x0, y1 - y0) * 1.6, options.Space == DiagramSpace.Xy ? 0.05 : 0.035);
            double cx = (x0 + x1) / 2, cy = (y0 + y1) / 2;
            x0 = cx - span / 2; x1 = cx + span / 2; y0 = cy - span / 2; y1 = cy + span / 2;
        }
        // Equal scale on both axes: widen the data range to the plot's aspect ratio.
        double perPxX = (x1 - x0) / plot.Width, perPxY = (y1 - y0) / plot.Height;
        if (perPxX > perPxY) { double mid = (y0 + y1) / 2, half = perPxX * plot.Height / 2; y0 = mid - half; y1 = mid + half; }
        else { double mid = (x0 + x1) / 2, half = perPxY * plot.Width / 2; x0 = mid - half; x1 = mid + half; }
        return new AxisMapping(plot, x0, x1, y0, y1);
    }

    /// <summary>Coordinates of a chromaticity in a diagram space.</summary>
    /// <param name="c">Chromaticity.</param>
    /// <param name="space">Space.</param>
    /// <returns>(x, y) or (u′, v′).</returns>
    public static (double X, double Y) Coord(Chromaticity c, DiagramSpace space) =>
        space == DiagramSpace.Xy ? (c.SmallX, c.SmallY) : (c.UPrime, c.VPrime);

    /// <summary>Draws the diagram.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="options">Options.</param>
    public static void Draw(SKCanvas canvas, SKSize size, DiagramOptions options)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(options);
        float s = Style.Scale(size);
        var m = Layout(options, size);
        var space = options.Space;
        m.DrawAxes(canvas, space == DiagramSpace.Xy ? "x (CIE 1931)" : "u′ (CIE 1976)", space == DiagramSpace.Xy ? "y (CIE 1931)" : "v′ (CIE 1976)", s);
        canvas.Save();
        canvas.ClipRect(m.Plot);
        DrawFill(canvas, m, space);
        var locus = SpectrumLocus(space);
        using (var path = new SKPath())
        {
            path.MoveTo(m.Px(locus[0].X), m.Py(locus[0].Y));
            foreach (var p in locus.Skip(1)) path.LineTo(m.Px(p.X), m.Py(p.Y));
            path.Close();
            using var pen = Style.Stroke(Style.Ink, 1.5f * s);
            canvas.DrawPath(path, pen);
        }
        for (int wl = 460; wl <= 620; wl += 20)
        {
            var c = LocusPoint(wl, space);
            if (c.X > m.XMin && c.X < m.XMax && c.Y > m.YMin && c.Y < m.YMax)
            {
                using var dot = Style.Fill(Style.Ink);
                canvas.DrawCircle(m.Px(c.X), m.Py(c.Y), 3 * s, dot);
                Style.Text(canvas, $"{wl} nm", m.Px(c.X) + 6 * s, m.Py(c.Y) - 4 * s, 12 * s, Style.Ink);
            }
        }
        DrawPlanckian(canvas, m, space, s);
        if (options.Spec is { } spec) DrawSpec(canvas, m, space, spec, s);
        if (options.DistinctSources)
        {
            DrawArrows(canvas, m, space, options.Arrows, s);
            DrawSources(canvas, m, space, options.Points, s);
        }
        else DrawPoints(canvas, m, space, options.Points, s);
        canvas.Restore();
        Style.Text(canvas, options.Title, m.Plot.Left, 36 * s, 20 * s, Style.Ink, bold: true);
        DrawLegend(canvas, m, options, s);
    }

    private static void DrawFill(SKCanvas canvas, AxisMapping m, DiagramSpace space)
    {
        // A light colour wash inside the spectrum locus: each cell's chromaticity at full brightness, mixed 55 % with white.
        var locus = SpectrumLocus(space);
        using var clip = new SKPath();
        clip.MoveTo(m.Px(locus[0].X), m.Py(locus[0].Y));
        foreach (var p in locus.Skip(1)) clip.LineTo(m.Px(p.X), m.Py(p.Y));
        clip.Close();
        int w = Math.Max(1, (int)(m.Plot.Width / 4)), h = Math.Max(1, (int)(m.Plot.Height / 4));
        using var bmp = new SKBitmap(w, h);
        for (int j = 0; j < h; j++)
            for (int i = 0; i < w; i++)
            {
                double a = m.XMin + (i + 0.5) / w * (m.XMax - m.XMin), b = m.YMax - (j + 0.5) / h * (m.YMax - m.YMin);
                var c = space == DiagramSpace.Xy ? Chromaticity.FromXy(a, b) : Chromaticity.FromUPrimeVPrime(a, b);
                if (!(c.SmallX > 0 && c.SmallY > 0 && c.SmallX + c.SmallY < 1)) { bmp.SetPixel(i, j, SKColors.White); continue; }
                var rgb = Srgb.LightColor(c);
                bmp.SetPixel(i, j, new SKColor((byte)(rgb.R * 0.45 + 255 * 0.55), (byte)(rgb.G * 0.45 + 255 * 0.55), (byte)(rgb.B * 0.45 + 255 * 0.55)));
            }
        canvas.Save();
        canvas.ClipPath(clip, antialias: true);
        using var image = SKImage.FromBitmap(bmp);
        using var paint = new SKPaint { IsAntialias = true };
        canvas.DrawImage(image, m.Plot, new SKSamplingOptions(SKFilterMode.Linear), paint);
        canvas.Restore();
    }

    private static void DrawPlanckian(SKCanvas canvas, AxisMapping m, DiagramSpace space, float s)
    {
        List<SKPoint> Curve(double duv)
        {
            // Only the part near the view, so that vector output stays small.
            var pts = new List<SKPoint>();
            for (double mired = 1e6 / 1000; mired >= 1e6 / 100000; mired /= 1.005)
            {
                var c = Coord(CctSolver.ToChromaticity(1e6 / mired, duv), space);
                float px = m.Px(c.X), py = m.Py(c.Y);
                if (px > m.Plot.Left - m.Plot.Width && px < m.Plot.Right + m.Plot.Width && py > m.Plot.Top - m.Plot.Height && py < m.Plot.Bottom + m.Plot.Height)
                    pts.Add(new SKPoint(px, py));
            }
            return pts;
        }
        using (var dashed = Style.Stroke(Style.Muted, 1f * s))
        {
            Style.DashedPolyline(canvas, Curve(0.01), dashed, 6 * s, 4 * s);
            Style.DashedPolyline(canvas, Curve(-0.01), dashed, 6 * s, 4 * s);
            Style.DashedPolyline(canvas, Curve(0.02), dashed, 2 * s, 4 * s);
            Style.DashedPolyline(canvas, Curve(-0.02), dashed, 2 * s, 4 * s);
        }
        using (var pen = Style.Stroke(Style.Locus, 2f * s))
        {
            var pts = Curve(0);
            if (pts.Count > 1)
            {
                using var path = new SKPath();
                path.AddPoly(pts.ToArray(), false);
                canvas.DrawPath(path, pen);
            }
        }
        using var iso = Style.Stroke(Style.Ink, 1f * s);
        bool zoomed = m.XMax - m.XMin < 0.2;
        foreach (int t in TickCcts)
        {
            var a = Coord(CctSolver.ToChromaticity(t, -0.02), space);
            var b = Coord(CctSolver.ToChromaticity(t, 0.02), space);
            canvas.DrawLine(m.Px(a.X), m.Py(a.Y), m.Px(b.X), m.Py(b.Y), iso);
            if (!zoomed && t is not (1500 or 2000 or 3000 or 4000 or 6500 or 10000)) continue;
            // Label where the isotemperature line is inside the view, preferring its upper end.
            foreach (double duv in new[] { 0.02, 0.012, 0.005, 0.0, -0.012 })
            {
                var p = Coord(CctSolver.ToChromaticity(t, duv), space);
                float px = m.Px(p.X), py = m.Py(p.Y);
                if (px > m.Plot.Left + 4 * s && px < m.Plot.Right - 50 * s && py > m.Plot.Top + 14 * s && py < m.Plot.Bottom - 4 * s)
                {
                    Style.Text(canvas, $"{t} K", px + 4 * s, py - 4 * s, 11.5f * s, Style.Ink);
                    break;
                }
            }
        }
        if (zoomed)
        {
            foreach (double duv in new[] { 0.02, 0.01, -0.01, -0.02 })
            {
                // Label each Duv line at the first point inside the view, scanning along the CCT.
                for (double t = 1500; t < 20000; t *= 1.02)
                {
                    var p = Coord(CctSolver.ToChromaticity(t, duv), space);
                    float px = m.Px(p.X), py = m.Py(p.Y);
                    if (px > m.Plot.Left + 40 * s && px < m.Plot.Right - 40 * s && py > m.Plot.Top + 14 * s && py < m.Plot.Bottom - 6 * s)
                    {
                        Style.Text(canvas, $"Duv {duv:+0.00;-0.00}", px, py - 4 * s, 11 * s, Style.Muted, SKTextAlign.Center);
                        break;
                    }
                }
            }
        }
    }

    private static void DrawSpec(SKCanvas canvas, AxisMapping m, DiagramSpace space, PreparedSpec spec, float s)
    {
        var target = spec.Spec.Target;
        if (target is null) return;
        using var pen = Style.Stroke(Style.Accent, 2f * s);
        var centre = Coord(target.Centre, space);
        using (var path = new SKPath())
        {
            switch (spec.Spec.Tolerance.Kind)
            {
                case ToleranceKind.Quadrangle:
                    var q = target.Category!.Quadrangle;
                    // Straight sides in xy: sample each side so it is drawn right in u′v′ too.
                    for (int i = 0; i < 4; i++)
                    {
                        var a = q.Corners[i]; var b = q.Corners[(i + 1) % 4];
                        for (int k = 0; k <= 20; k++)
                        {
                            var c = Coord(Chromaticity.FromXy(a.SmallX + (b.SmallX - a.SmallX) * k / 20, a.SmallY + (b.SmallY - a.SmallY) * k / 20), space);
                            if (i == 0 && k == 0) path.MoveTo(m.Px(c.X), m.Py(c.Y)); else path.LineTo(m.Px(c.X), m.Py(c.Y));
                        }
                    }
                    break;
                case ToleranceKind.EllipseSteps:
                    var e = spec.Ellipse!;
                    for (int k = 0; k <= 120; k++)
                    {
                        var p = e.PointAt(spec.Spec.Tolerance.Value, 2 * Math.PI * k / 120);
                        var c = Coord(Chromaticity.FromXy(p.SmallX, p.SmallY), space);
                        if (k == 0) path.MoveTo(m.Px(c.X), m.Py(c.Y)); else path.LineTo(m.Px(c.X), m.Py(c.Y));
                    }
                    break;
                case ToleranceKind.UPrimeVPrimeRadius:
                    var t = target.Centre;
                    for (int k = 0; k <= 120; k++)
                    {
                        double ang = 2 * Math.PI * k / 120, r = spec.Spec.Tolerance.Value;
                        var c = Coord(Chromaticity.FromUPrimeVPrime(t.UPrime + r * Math.Cos(ang), t.VPrime + r * Math.Sin(ang)), space);
                        if (k == 0) path.MoveTo(m.Px(c.X), m.Py(c.Y)); else path.LineTo(m.Px(c.X), m.Py(c.Y));
                    }
                    break;
            }
            path.Close();
            canvas.DrawPath(path, pen);
        }
        using var cross = Style.Stroke(Style.Accent, 2f * s);
        float cx = m.Px(centre.X), cy = m.Py(centre.Y), r2 = 6 * s;
        canvas.DrawLine(cx - r2, cy, cx + r2, cy, cross);
        canvas.DrawLine(cx, cy - r2, cx, cy + r2, cross);
    }

    private static void DrawPoints(SKCanvas canvas, AxisMapping m, DiagramSpace space, IReadOnlyList<DiagramPoint> points, float s)
    {
        float r = points.Count > 200 ? 2.5f * s : 5f * s;
        using var pass = Style.Fill(Style.Pass);
        using var neutral = Style.Fill(Style.Neutral);
        using var outline = Style.Stroke(SKColors.White, 1f * s);
        using var fail = Style.Stroke(Style.Fail, 2.2f * s);
        using var ellipsePen = Style.Stroke(Style.Neutral, 1.2f * s);
        foreach (var p in points)
        {
            var outline95 = p.UncertaintyEllipse();
            if (outline95.Count == 0) continue;
            using var path = new SKPath();
            for (int i = 0; i < outline95.Count; i++)
            {
                var e = Coord(outline95[i], space);
                if (i == 0) path.MoveTo(m.Px(e.X), m.Py(e.Y)); else path.LineTo(m.Px(e.X), m.Py(e.Y));
            }
            path.Close();
            canvas.DrawPath(path, ellipsePen);
        }
        foreach (var p in points)
        {
            if (!p.Chromaticity.IsDefined) continue;
            var c = Coord(p.Chromaticity, space);
            float x = m.Px(c.X), y = m.Py(c.Y);
            if (p.Status == PointStatus.Fail)
            {
                canvas.DrawLine(x - r, y - r, x + r, y + r, fail);
                canvas.DrawLine(x - r, y + r, x + r, y - r, fail);
            }
            else if (p.Status == PointStatus.Inconclusive)
            {
                using var ring = Style.Stroke(Style.Accent, 2.2f * s);
                canvas.DrawCircle(x, y, r, ring);
            }
            else
            {
                canvas.DrawCircle(x, y, r, p.Status == PointStatus.Pass ? pass : neutral);
                if (points.Count <= 200) canvas.DrawCircle(x, y, r, outline);
            }
            if (points.Count <= 4 || (points.Count <= 40 && p.Status == PointStatus.Fail && points.Count(q => q.Status == PointStatus.Fail) <= 8))
                Style.Text(canvas, p.Label, x + r + 4 * s, y + 4 * s, 12 * s, Style.Ink);
        }
    }

    private static void DrawArrows(SKCanvas canvas, AxisMapping m, DiagramSpace space, IReadOnlyList<(Chromaticity From, Chromaticity To)> arrows, float s)
    {
        using var pen = Style.Stroke(Style.Muted, 1.6f * s);
        using var head = Style.Fill(Style.Muted);
        foreach (var (from, to) in arrows)
        {
            if (!from.IsDefined || !to.IsDefined) continue;
            var a = Coord(from, space);
            var b = Coord(to, space);
            float x0 = m.Px(a.X), y0 = m.Py(a.Y), x1 = m.Px(b.X), y1 = m.Py(b.Y);
            float dx = x1 - x0, dy = y1 - y0, len = MathF.Sqrt(dx * dx + dy * dy);
            if (len < 12 * s) continue;
            float ux = dx / len, uy = dy / len;
            // Stop short of the target marker so the head stays visible.
            x1 -= ux * 9 * s; y1 -= uy * 9 * s;
            canvas.DrawLine(x0 + ux * 8 * s, y0 + uy * 8 * s, x1, y1, pen);
            using var path = new SKPath();
            path.MoveTo(x1, y1);
            path.LineTo(x1 - ux * 10 * s - uy * 5 * s, y1 - uy * 10 * s + ux * 5 * s);
            path.LineTo(x1 - ux * 10 * s + uy * 5 * s, y1 - uy * 10 * s - ux * 5 * s);
            path.Close();
            canvas.DrawPath(path, head);
        }
    }

    /// <summary>Each source with its own colour and marker, and a label placed clear of the other labels and markers.</summary>
    private static void DrawSources(SKCanvas canvas, AxisMapping m, DiagramSpace space, IReadOnlyList<DiagramPoint> points, float s)
    {
        float r = 6 * s, fontSize = 12.5f * s;
        var placed = new List<SKRect>();
        var centres = points.Where(p => p.Chromaticity.IsDefined).Select(p => { var c = Coord(p.Chromaticity, space); return new SKPoint(m.Px(c.X), m.Py(c.Y)); }).ToList();
        foreach (var c in centres) placed.Add(new SKRect(c.X - r - 2 * s, c.Y - r - 2 * s, c.X + r + 2 * s, c.Y + r + 2 * s));
        using var font = new SKFont(Typefaces.Regular, fontSize);
        for (int i = 0, k = 0; i < points.Count; i++)
        {
            var p = points[i];
            if (!p.Chromaticity.IsDefined) continue;
            var c = centres[k++];
            Style.Marker(canvas, i, c.X, c.Y, r, Style.Series[i % Style.Series.Length], s);
            float w = font.MeasureText(p.Label), h = fontSize;
            // Candidate label positions: beside the marker first, then further out in eight directions (with a leader line).
            SKRect? chosen = null;
            bool leader = false;
            foreach (float dist in new[] { 0f, 28 * s, 56 * s, 90 * s })
            {
                foreach (var (ox, oy) in new[] { (1f, 0f), (-1f, 0f), (0f, -1f), (0f, 1f), (1f, -1f), (-1f, -1f), (1f, 1f), (-1f, 1f) })
                {
                    float lx = ox > 0 ? c.X + r + 4 * s + dist : ox < 0 ? c.X - r - 4 * s - w - dist : c.X - w / 2;
                    float ly = oy < 0 ? c.Y - r - 4 * s - dist : oy > 0 ? c.Y + r + 4 * s + h + dist : c.Y + h / 3;
                    var rect = new SKRect(lx - 2 * s, ly - h, lx + w + 2 * s, ly + 3 * s);
                    if (!m.Plot.Contains(rect) || placed.Any(q => q.IntersectsWith(rect))) continue;
                    chosen = rect;
                    leader = dist > 0;
                    break;
                }
                if (chosen is not null) break;
            }
            var box = chosen ?? new SKRect(c.X + r + 4 * s, c.Y - h, c.X + r + 4 * s + w, c.Y + 3 * s);
            placed.Add(box);
            if (leader)
            {
                using var lp = Style.Stroke(Style.Muted, 1 * s);
                float tx = Math.Clamp(c.X, box.Left, box.Right), ty = Math.Clamp(c.Y, box.Top, box.Bottom);
                canvas.DrawLine(c.X, c.Y, tx, ty, lp);
            }
            using (var bg = Style.Fill(new SKColor(255, 255, 255, 215))) canvas.DrawRect(box, bg);
            Style.Text(canvas, p.Label, box.Left + 2 * s, box.Bottom - 3 * s, fontSize, Style.Series[i % Style.Series.Length], bold: true);
        }
    }

    private static void DrawLegend(SKCanvas canvas, AxisMapping m, DiagramOptions o, float s)
    {
        var items = new List<(string Text, Action<float, float> Glyph)>();
        items.Add(("Planckian locus, CCT ticks", (x, y) => { using var p = Style.Stroke(Style.Locus, 2 * s); canvas.DrawLine(x, y, x + 22 * s, y, p); }));
        items.Add(("Duv ±0.01 (dashed), ±0.02 (dotted)", (x, y) => { using var p = Style.Stroke(Style.Muted, 1 * s); Style.DashedLine(canvas, new SKPoint(x, y), new SKPoint(x + 22 * s, y), p, 6 * s, 4 * s); }));
        if (o.Spec?.Spec.Target is not null)
            items.Add((o.Spec.Spec.Tolerance.Kind switch
            {
                ToleranceKind.Quadrangle => "ANSI C78.377 quadrangle",
                ToleranceKind.EllipseSteps => $"{o.Spec.Spec.Tolerance.Value:0.#}-step ellipse",
                ToleranceKind.UPrimeVPrimeRadius => $"Δu′v′ circle {o.Spec.Spec.Tolerance.Value:0.####}",
                _ => "target",
            }, (x, y) => { using var p = Style.Stroke(Style.Accent, 2 * s); canvas.DrawLine(x, y, x + 22 * s, y, p); }));
        if (o.DistinctSources)
        {
            for (int i = 0; i < o.Points.Count; i++)
            {
                int k = i;
                items.Add((o.Points[i].Label, (x, y) => Style.Marker(canvas, k, x + 11 * s, y, 5.5f * s, Style.Series[k % Style.Series.Length], s)));
            }
            if (o.Arrows.Count > 0) items.Add(("correction (source → reference)", (x, y) => { using var p = Style.Stroke(Style.Muted, 1.6f * s); canvas.DrawLine(x, y, x + 22 * s, y, p); }));
        }
        int pass = o.DistinctSources ? 0 : o.Points.Count(p => p.Status == PointStatus.Pass), fail = o.DistinctSources ? 0 : o.Points.Count(p => p.Status == PointStatus.Fail), none = o.DistinctSources ? 0 : o.Points.Count(p => p.Status == PointStatus.None);
        if (pass > 0) items.Add(($"pass ({pass})", (x, y) => { using var p = Style.Fill(Style.Pass); canvas.DrawCircle(x + 11 * s, y, 5 * s, p); }));
        if (fail > 0) items.Add(($"fail ({fail})", (x, y) => { using var p = Style.Stroke(Style.Fail, 2.2f * s); canvas.DrawLine(x + 6 * s, y - 5 * s, x + 16 * s, y + 5 * s, p); canvas.DrawLine(x + 6 * s, y + 5 * s, x + 16 * s, y - 5 * s, p); }));
        int inconclusive = o.DistinctSources ? 0 : o.Points.Count(p => p.Status == PointStatus.Inconclusive);
        if (inconclusive > 0) items.Add(($"inconclusive ({inconclusive})", (x, y) => { using var p = Style.Stroke(Style.Accent, 2.2f * s); canvas.DrawCircle(x + 11 * s, y, 5 * s, p); }));
        if (o.Points.Any(p => p.UncertaintyEllipse(8).Count > 0))
            items.Add(("95 % uncertainty ellipse", (x, y) => { using var p = Style.Stroke(Style.Neutral, 1.2f * s); canvas.DrawOval(new SKRect(x + 2 * s, y - 5 * s, x + 20 * s, y + 5 * s), p); }));
        if (none > 0) items.Add(($"measured ({none})", (x, y) => { using var p = Style.Fill(Style.Neutral); canvas.DrawCircle(x + 11 * s, y, 5 * s, p); }));
        float w = 270 * s, h = (items.Count * 20 + 12) * s;
        var box = new SKRect(m.Plot.Right - w - 10 * s, m.Plot.Top + 10 * s, m.Plot.Right - 10 * s, m.Plot.Top + 10 * s + h);
        using (var bg = Style.Fill(new SKColor(255, 255, 255, 230))) canvas.DrawRect(box, bg);
        using (var border = Style.Stroke(Style.Grid, 1 * s)) canvas.DrawRect(box, border);
        for (int i = 0; i < items.Count; i++)
        {
            float y = box.Top + (16 + 20 * i) * s;
            items[i].Glyph(box.Left + 10 * s, y - 4 * s);
            Style.Text(canvas, items[i].Text, box.Left + 40 * s, y, 12.5f * s, Style.Ink);
        }
    }

    private static (double X, double Y)[] SpectrumLocus(DiagramSpace space)
    {
        var list = new List<(double, double)>();
        for (int wl = 380; wl <= 700; wl += 1) list.Add(LocusPoint(wl, space));
        return list.ToArray();
    }

    private static (double X, double Y) LocusPoint(int wl, DiagramSpace space)
    {
        var cmf = CieTables.ColorMatchingFunctions(Observer.Cie1931TwoDegree);
        var t = new Tristimulus(cmf.At("x_bar", wl), cmf.At("y_bar", wl), cmf.At("z_bar", wl));
        return Coord(t.Chromaticity, space);
    }
}
