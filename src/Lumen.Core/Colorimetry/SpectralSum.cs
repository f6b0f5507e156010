using System.Numerics.Tensors;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Lumen.Colorimetry;

/// <summary>The one integrator: Σ S(λ)·w(λ) over a regular grid.</summary>
internal static class SpectralSum
{
    /// <summary>Σ values·weights, vectorised (System.Numerics.Tensors).</summary>
    /// <param name="values">Spectral values.</param>
    /// <param name="weights">Weights of the same length (function × Δλ).</param>
    /// <returns>The sum.</returns>
    public static double Dot(ReadOnlySpan<double> values, ReadOnlySpan<double> weights) => TensorPrimitives.Dot(values, weights);

    /// <summary>
    /// Tristimulus-style sums of two spectra against three weight rows in one pass: (Σa·wx, Σa·wy, Σa·wz) and
    /// (Σb·wx, Σb·wy, Σb·wz). Each spectrum value is loaded once for three rows and six independent accumulators
    /// keep the floating-point units busy; this is the hot loop of CIE 224 (99 samples × test and reference).
    /// </summary>
    /// <param name="wx">x̄-type weights.</param>
    /// <param name="wy">ȳ-type weights.</param>
    /// <param name="wz">z̄-type weights.</param>
    /// <param name="a">First spectrum.</param>
    /// <param name="b">Second spectrum.</param>
    /// <returns>The six sums.</returns>
    public static (Colorimetry.Tristimulus A, Colorimetry.Tristimulus B) Tristimulus2(
        ReadOnlySpan<double> wx, ReadOnlySpan<double> wy, ReadOnlySpan<double> wz, ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        if (b.Length != n || wx.Length != n || wy.Length != n || wz.Length != n) throw new ArgumentException("Lengths differ.", nameof(a));
        int i = 0, width = System.Numerics.Vector<double>.Count;
        double ax = 0, ay = 0, az = 0, bx = 0, by = 0, bz = 0;
        if (System.Runtime.Intrinsics.Vector512.IsHardwareAccelerated && n >= 8)
        {
            ref double rx = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wx);
            ref double ry = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wy);
            ref double rz = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wz);
            ref double ra = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(a);
            ref double rb = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(b);
            var vax = System.Runtime.Intrinsics.Vector512<double>.Zero; var vay = vax; var vaz = vax; var vbx = vax; var vby = vax; var vbz = vax;
            for (; i <= n - 8; i += 8)
            {
                var va = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref ra, (nuint)i);
                var vb = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref rb, (nuint)i);
                var x = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref rx, (nuint)i);
                var y = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref ry, (nuint)i);
                var z = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref rz, (nuint)i);
                vax = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(x, va, vax);
                vay = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(y, va, vay);
                vaz = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(z, va, vaz);
                vbx = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(x, vb, vbx);
                vby = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(y, vb, vby);
                vbz = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(z, vb, vbz);
            }
            ax = System.Runtime.Intrinsics.Vector512.Sum(vax); ay = System.Runtime.Intrinsics.Vector512.Sum(vay); az = System.Runtime.Intrinsics.Vector512.Sum(vaz);
            bx = System.Runtime.Intrinsics.Vector512.Sum(vbx); by = System.Runtime.Intrinsics.Vector512.Sum(vby); bz = System.Runtime.Intrinsics.Vector512.Sum(vbz);
        }
        else if (System.Numerics.Vector.IsHardwareAccelerated && n >= width)
        {
            ref double rx = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wx);
            ref double ry = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wy);
            ref double rz = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wz);
            ref double ra = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(a);
            ref double rb = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(b);
            var vax = System.Numerics.Vector<double>.Zero; var vay = vax; var vaz = vax; var vbx = vax; var vby = vax; var vbz = vax;
            for (; i <= n - width; i += width)
            {
                var va = System.Numerics.Vector.LoadUnsafe(ref ra, (nuint)i);
                var vb = System.Numerics.Vector.LoadUnsafe(ref rb, (nuint)i);
                var x = System.Numerics.Vector.LoadUnsafe(ref rx, (nuint)i);
                var y = System.Numerics.Vector.LoadUnsafe(ref ry, (nuint)i);
                var z = System.Numerics.Vector.LoadUnsafe(ref rz, (nuint)i);
                vax = System.Numerics.Vector.FusedMultiplyAdd(x, va, vax);
                vay = System.Numerics.Vector.FusedMultiplyAdd(y, va, vay);
                vaz = System.Numerics.Vector.FusedMultiplyAdd(z, va, vaz);
                vbx = System.Numerics.Vector.FusedMultiplyAdd(x, vb, vbx);
                vby = System.Numerics.Vector.FusedMultiplyAdd(y, vb, vby);
                vbz = System.Numerics.Vector.FusedMultiplyAdd(z, vb, vbz);
            }
            ax = System.Numerics.Vector.Sum(vax); ay = System.Numerics.Vector.Sum(vay); az = System.Numerics.Vector.Sum(vaz);
            bx = System.Numerics.Vector.Sum(vbx); by = System.Numerics.Vector.Sum(vby); bz = System.Numerics.Vector.Sum(vbz);
        }
        for (; i < n; i++)
        {
            ax += a[i] * wx[i]; ay += a[i] * wy[i]; az += a[i] * wz[i];
            bx += b[i] * wx[i]; by += b[i] * wy[i]; bz += b[i] * wz[i];
        }
        return (new Colorimetry.Tristimulus(ax, ay, az), new Colorimetry.Tristimulus(bx, by, bz));
    }

    /// <summary>
    /// Blocked sums of many spectra against many weight rows: <c>result[v·R + r] = Σ_k vectors[v][k]·weights[r][k]</c>
    /// for every vector v and row r (R = number of rows, a multiple of 3: x̄-, ȳ-, z̄-type triples). This is the hot
    /// loop of the rendition indices for many spectra at once (issue 16): four spectra share each load of a weight
    /// triple, so the 297 × 401 CIE 224 weights stream through the cache once per four spectra instead of once per
    /// spectrum, and twelve independent accumulators keep the FMA units busy. Sums run in a different order than
    /// <see cref="Dot"/> (rounding differences of order 1e-16 relative).
    /// </summary>
    /// <param name="weights">Weight rows, all of the vectors' length; their count a multiple of 3.</param>
    /// <param name="vectors">Spectra on the weights' grid.</param>
    /// <param name="result">Output, at least vectors × rows long.</param>
    /// <exception cref="ArgumentException">Lengths do not match.</exception>
    public static void Many(IReadOnlyList<double[]> weights, IReadOnlyList<double[]> vectors, Span<double> result)
    {
        ArgumentNullException.ThrowIfNull(weights);
        ArgumentNullException.ThrowIfNull(vectors);
        int rows = weights.Count;
        if (rows % 3 != 0) throw new ArgumentException("The number of weight rows must be a multiple of 3.", nameof(weights));
        if (result.Length < rows * vectors.Count) throw new ArgumentException("The result is too short.", nameof(result));
        if (vectors.Count == 0 || rows == 0) return;
        int n = weights[0].Length;
        foreach (var w in weights) if (w.Length != n) throw new ArgumentException("Weight rows differ in length.", nameof(weights));
        foreach (var v in vectors) if (v.Length != n) throw new ArgumentException("A vector's length differs from the weights'.", nameof(vectors));
        Span<double> sums = stackalloc double[12];
        for (int v = 0; v < vectors.Count; v += 4)
        {
            // A last group of fewer than four repeats its last vector; the repeats' sums are not written.
            int last = vectors.Count - 1;
            var s0 = vectors[v]; var s1 = vectors[Math.Min(v + 1, last)]; var s2 = vectors[Math.Min(v + 2, last)]; var s3 = vectors[Math.Min(v + 3, last)];
            int inGroup = Math.Min(4, vectors.Count - v);
            for (int r = 0; r < rows; r += 3)
            {
                Group(weights[r], weights[r + 1], weights[r + 2], s0, s1, s2, s3, sums);
                for (int j = 0; j < inGroup; j++)
                {
                    int o = (v + j) * rows + r;
                    result[o] = sums[3 * j]; result[o + 1] = sums[3 * j + 1]; result[o + 2] = sums[3 * j + 2];
                }
            }
        }
    }

    /// <summary>Sums of four spectra against one weight triple: out = (x0, y0, z0, x1, …, z3).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)] // the hot loop from the first call (tables are built with it at start-up)
    private static void Group(double[] wx, double[] wy, double[] wz, double[] s0, double[] s1, double[] s2, double[] s3, Span<double> output)
    {
        int n = wx.Length, k = 0;
        ref double rx = ref MemoryMarshal.GetArrayDataReference(wx);
        ref double ry = ref MemoryMarshal.GetArrayDataReference(wy);
        ref double rz = ref MemoryMarshal.GetArrayDataReference(wz);
        ref double r0 = ref MemoryMarshal.GetArrayDataReference(s0);
        ref double r1 = ref MemoryMarshal.GetArrayDataReference(s1);
        ref double r2 = ref MemoryMarshal.GetArrayDataReference(s2);
        ref double r3 = ref MemoryMarshal.GetArrayDataReference(s3);
        double x0 = 0, y0 = 0, z0 = 0, x1 = 0, y1 = 0, z1 = 0, x2 = 0, y2 = 0, z2 = 0, x3 = 0, y3 = 0, z3 = 0;
        if (Vector256.IsHardwareAccelerated && n >= 4)
        {
            var ax0 = Vector256<double>.Zero; var ay0 = ax0; var az0 = ax0; var ax1 = ax0; var ay1 = ax0; var az1 = ax0;
            var ax2 = ax0; var ay2 = ax0; var az2 = ax0; var ax3 = ax0; var ay3 = ax0; var az3 = ax0;
            for (; k <= n - 4; k += 4)
            {
                var x = Vector256.LoadUnsafe(ref rx, (nuint)k); var y = Vector256.LoadUnsafe(ref ry, (nuint)k); var z = Vector256.LoadUnsafe(ref rz, (nuint)k);
                var a = Vector256.LoadUnsafe(ref r0, (nuint)k);
                ax0 = Vector256.FusedMultiplyAdd(x, a, ax0); ay0 = Vector256.FusedMultiplyAdd(y, a, ay0); az0 = Vector256.FusedMultiplyAdd(z, a, az0);
                a = Vector256.LoadUnsafe(ref r1, (nuint)k);
                ax1 = Vector256.FusedMultiplyAdd(x, a, ax1); ay1 = Vector256.FusedMultiplyAdd(y, a, ay1); az1 = Vector256.FusedMultiplyAdd(z, a, az1);
                a = Vector256.LoadUnsafe(ref r2, (nuint)k);
                ax2 = Vector256.FusedMultiplyAdd(x, a, ax2); ay2 = Vector256.FusedMultiplyAdd(y, a, ay2); az2 = Vector256.FusedMultiplyAdd(z, a, az2);
                a = Vector256.LoadUnsafe(ref r3, (nuint)k);
                ax3 = Vector256.FusedMultiplyAdd(x, a, ax3); ay3 = Vector256.FusedMultiplyAdd(y, a, ay3); az3 = Vector256.FusedMultiplyAdd(z, a, az3);
            }
            x0 = Vector256.Sum(ax0); y0 = Vector256.Sum(ay0); z0 = Vector256.Sum(az0); x1 = Vector256.Sum(ax1); y1 = Vector256.Sum(ay1); z1 = Vector256.Sum(az1);
            x2 = Vector256.Sum(ax2); y2 = Vector256.Sum(ay2); z2 = Vector256.Sum(az2); x3 = Vector256.Sum(ax3); y3 = Vector256.Sum(ay3); z3 = Vector256.Sum(az3);
        }
        for (; k < n; k++)
        {
            double x = Unsafe.Add(ref rx, k), y = Unsafe.Add(ref ry, k), z = Unsafe.Add(ref rz, k);
            double a = Unsafe.Add(ref r0, k); x0 += a * x; y0 += a * y; z0 += a * z;
            a = Unsafe.Add(ref r1, k); x1 += a * x; y1 += a * y; z1 += a * z;
            a = Unsafe.Add(ref r2, k); x2 += a * x; y2 += a * y; z2 += a * z;
            a = Unsafe.Add(ref r3, k); x3 += a * x; y3 += a * y; z3 += a * z;
        }
        output[0] = x0; output[1] = y0; output[2] = z0; output[3] = x1; output[4] = y1; output[5] = z1;
        output[6] = x2; output[7] = y2; output[8] = z2; output[9] = x3; output[10] = y3; output[11] = z3;
    }

    /// <summary>Scalar reference of <see cref="Dot"/>, kept to test the vector path against.</summary>
    /// <param name="values">Spectral values.</param>
    /// <param name="weights">Weights.</param>
    /// <returns>The sum.</returns>
    public static double DotScalar(ReadOnlySpan<double> values, ReadOnlySpan<double> weights)
    {
        if (values.Length != weights.Length) throw new ArgumentException("Lengths differ.", nameof(weights));
        double s = 0;
        for (int i = 0; i < values.Length; i++) s += values[i] * weights[i];
        return s;
    }
}
