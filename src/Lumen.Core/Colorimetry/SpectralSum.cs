using System.Numerics.Tensors;

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
