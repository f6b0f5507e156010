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
    /// loop of the rendition indices for many spectra at once (issue 16): several spectra share each load of a weight
    /// triple, so the 297 × 401 CIE 224 weights stream through the cache once per group of spectra instead of once per
    /// spectrum, and independent accumulators keep the FMA units busy. Sums run in a different order than
    /// <see cref="Dot"/> (rounding differences of order 1e-16 relative), but in the same order on every machine: where
    /// 512-bit vectors run, each holds two spectra's 4-wide partial sums side by side (<see cref="GroupOfEight"/>),
    /// which add up exactly as the 256-bit path's do, so a result does not depend on the processor's vector width.
    /// </summary>
    /// <param name="weights">Weight rows, all of the vectors' length; their count a multiple of 3.</param>
    /// <param name="vectors">Spectra on the weights' grid.</param>
    /// <param name="result">Output, at least vectors × rows long.</param>
    /// <param name="eightWide">Use groups of eight spectra in 512-bit vectors where they run (the default; tests turn it
    /// off to compare the two paths bit for bit).</param>
    /// <exception cref="ArgumentException">Lengths do not match.</exception>
    public static void Many(IReadOnlyList<double[]> weights, IReadOnlyList<double[]> vectors, Span<double> result, bool eightWide = true)
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
        Span<double> sums = stackalloc double[24];
        int first = 0;
        if (eightWide && Vector512.IsHardwareAccelerated && n >= 4 && vectors.Count >= 8)
        {
            int main = n - n % 4;
            var (packed, offset) = AlignedScratch(8 * main);
            for (; vectors.Count - first >= 8; first += 8)
            {
                for (int p = 0; p < 4; p++) Interleave(vectors[first + 2 * p], vectors[first + 2 * p + 1], main, packed.AsSpan(offset + 2 * p * main, 2 * main));
                for (int r = 0; r < rows; r += 3)
                {
                    GroupOfEight(weights[r], weights[r + 1], weights[r + 2], packed, offset, main, vectors, first, sums);
                    for (int j = 0; j < 8; j++)
                    {
                        int o = (first + j) * rows + r;
                        result[o] = sums[3 * j]; result[o + 1] = sums[3 * j + 1]; result[o + 2] = sums[3 * j + 2];
                    }
                }
            }
        }
        for (int v = first; v < vectors.Count; v += 4)
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

    [ThreadStatic] private static double[]? _scratch;
    [ThreadStatic] private static int _scratchOffset;

    /// <summary>
    /// This thread's scratch of at least <paramref name="length"/> doubles starting on a 64-byte boundary (at
    /// <c>offset</c>): a 512-bit load that straddles two cache lines costs two. Pinned, so the boundary holds.
    /// </summary>
    private static (double[] Buffer, int Offset) AlignedScratch(int length)
    {
        if (_scratch is null || _scratch.Length < length + 8)
        {
            var buffer = GC.AllocateUninitializedArray<double>(length + 8, pinned: true);
            var handle = GCHandle.Alloc(buffer, GCHandleType.Pinned);
            long address = handle.AddrOfPinnedObject();
            handle.Free();
            _scratch = buffer;
            _scratchOffset = (int)((64 - address % 64) % 64 / 8);
        }
        return (_scratch, _scratchOffset);
    }

    /// <summary>Two spectra's first <paramref name="main"/> values (a multiple of 4) as [a0..a3, b0..b3, a4..a7, b4..b7, …].</summary>
    private static void Interleave(double[] a, double[] b, int main, Span<double> target)
    {
        ref double ra = ref MemoryMarshal.GetArrayDataReference(a);
        ref double rb = ref MemoryMarshal.GetArrayDataReference(b);
        ref double rt = ref MemoryMarshal.GetReference(target);
        for (int k = 0; k < main; k += 4)
        {
            Vector256.LoadUnsafe(ref ra, (nuint)k).StoreUnsafe(ref rt, (nuint)(2 * k));
            Vector256.LoadUnsafe(ref rb, (nuint)k).StoreUnsafe(ref rt, (nuint)(2 * k + 4));
        }
    }

    /// <summary>
    /// Sums of eight spectra against one weight triple, out = (x0, y0, z0, x1, …, z7), in 512-bit vectors: each holds
    /// the 4-wide partial sums of two spectra (<see cref="Interleave"/>d in <paramref name="packed"/>, pair p at
    /// p·2·main) against the weights repeated in both halves. Every lane adds the same products in the same order as
    /// <see cref="Group"/>'s 256-bit lanes, each half is reduced by the same <see cref="Vector256.Sum{T}"/> and the last
    /// n mod 4 values are added by the same scalar steps, so the sums are bit for bit <see cref="Group"/>'s; the
    /// weights are read once per eight spectra instead of four, and each instruction does twice the work.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void GroupOfEight(double[] wx, double[] wy, double[] wz, double[] packed, int offset, int main, IReadOnlyList<double[]> vectors, int first, Span<double> output)
    {
        ref double rx = ref MemoryMarshal.GetArrayDataReference(wx);
        ref double ry = ref MemoryMarshal.GetArrayDataReference(wy);
        ref double rz = ref MemoryMarshal.GetArrayDataReference(wz);
        ref double r0 = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(packed), offset);
        ref double r1 = ref Unsafe.Add(ref r0, 2 * main);
        ref double r2 = ref Unsafe.Add(ref r0, 4 * main);
        ref double r3 = ref Unsafe.Add(ref r0, 6 * main);
        var ax0 = Vector512<double>.Zero; var ay0 = ax0; var az0 = ax0; var ax1 = ax0; var ay1 = ax0; var az1 = ax0;
        var ax2 = ax0; var ay2 = ax0; var az2 = ax0; var ax3 = ax0; var ay3 = ax0; var az3 = ax0;
        for (int k = 0; k < main; k += 4)
        {
            var x = Twice(Vector256.LoadUnsafe(ref rx, (nuint)k));
            var y = Twice(Vector256.LoadUnsafe(ref ry, (nuint)k));
            var z = Twice(Vector256.LoadUnsafe(ref rz, (nuint)k));
            nuint at = (nuint)(2 * k);
            var a = Vector512.LoadUnsafe(ref r0, at);
            ax0 = Vector512.FusedMultiplyAdd(x, a, ax0); ay0 = Vector512.FusedMultiplyAdd(y, a, ay0); az0 = Vector512.FusedMultiplyAdd(z, a, az0);
            a = Vector512.LoadUnsafe(ref r1, at);
            ax1 = Vector512.FusedMultiplyAdd(x, a, ax1); ay1 = Vector512.FusedMultiplyAdd(y, a, ay1); az1 = Vector512.FusedMultiplyAdd(z, a, az1);
            a = Vector512.LoadUnsafe(ref r2, at);
            ax2 = Vector512.FusedMultiplyAdd(x, a, ax2); ay2 = Vector512.FusedMultiplyAdd(y, a, ay2); az2 = Vector512.FusedMultiplyAdd(z, a, az2);
            a = Vector512.LoadUnsafe(ref r3, at);
            ax3 = Vector512.FusedMultiplyAdd(x, a, ax3); ay3 = Vector512.FusedMultiplyAdd(y, a, ay3); az3 = Vector512.FusedMultiplyAdd(z, a, az3);
        }
        Reduce(ax0, ay0, az0, output[..6]);
        Reduce(ax1, ay1, az1, output.Slice(6, 6));
        Reduce(ax2, ay2, az2, output.Slice(12, 6));
        Reduce(ax3, ay3, az3, output.Slice(18, 6));
        int n = wx.Length;
        for (int j = 0; j < 8; j++)
        {
            double[] s = vectors[first + j];
            double sx = output[3 * j], sy = output[3 * j + 1], sz = output[3 * j + 2];
            for (int k = main; k < n; k++)
            {
                double a = s[k];
                sx += a * wx[k]; sy += a * wy[k]; sz += a * wz[k];
            }
            output[3 * j] = sx; output[3 * j + 1] = sy; output[3 * j + 2] = sz;
        }
    }

    /// <summary>A 256-bit vector in both halves of a 512-bit one, by one lane shuffle with no dependence on an earlier value
    /// (<c>Vector512.Create</c> of a 256-bit vector inserts twice into the previous register, which chained the loop's
    /// iterations).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector512<double> Twice(Vector256<double> v)
    {
        var wide = v.ToVector512Unsafe();
        return System.Runtime.Intrinsics.X86.Avx512F.Shuffle4x128(wide, wide, 0b01_00_01_00);
    }

    /// <summary>The two spectra of a pair's accumulators, reduced half by half: (x, y, z) of the first, then the second's.</summary>
    private static void Reduce(Vector512<double> x, Vector512<double> y, Vector512<double> z, Span<double> output)
    {
        output[0] = Vector256.Sum(x.GetLower()); output[1] = Vector256.Sum(y.GetLower()); output[2] = Vector256.Sum(z.GetLower());
        output[3] = Vector256.Sum(x.GetUpper()); output[4] = Vector256.Sum(y.GetUpper()); output[5] = Vector256.Sum(z.GetUpper());
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
