using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Thermostrat.Model.Numerics;

/// <summary>Small SIMD kernels (System.Numerics.Vector) for the integrators' inner loops.</summary>
internal static class VectorOps
{
    /// <summary>y += a·x.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static void Axpy(double a, ReadOnlySpan<double> x, Span<double> y)
    {
        int n = y.Length;
        int i = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count)
        {
            var va = new Vector<double>(a);
            var vx = MemoryMarshal.Cast<double, Vector<double>>(x[..n]);
            var vy = MemoryMarshal.Cast<double, Vector<double>>(y);
            for (int k = 0; k < vy.Length; k++) vy[k] += va * vx[k];
            i = vy.Length * Vector<double>.Count;
        }
        for (; i < n; i++) y[i] += a * x[i];
    }

    /// <summary>Σ x_i y_i.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length;
        int i = 0;
        double s = 0.0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count)
        {
            var vx = MemoryMarshal.Cast<double, Vector<double>>(x);
            var vy = MemoryMarshal.Cast<double, Vector<double>>(y[..n]);
            var acc = Vector<double>.Zero;
            for (int k = 0; k < vx.Length; k++) acc += vx[k] * vy[k];
            s = Vector.Sum(acc);
            i = vx.Length * Vector<double>.Count;
        }
        for (; i < n; i++) s += x[i] * y[i];
        return s;
    }

    /// <summary>
    /// The weighted RMS norm of Hairer, Nørsett and Wanner (Solving ODEs I, Sect. II.4, eq. 4.11):
    /// √(1/n Σ (e_i / sc_i)²) with sc_i = atol_i + rtol·max(|y_i|, |ŷ_i|).
    /// </summary>
    public static double ErrorNorm(ReadOnlySpan<double> e, ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, ReadOnlySpan<double> atol, double rtol)
    {
        int n = e.Length;
        if (n == 0) return 0.0;
        int i = 0;
        double s = 0.0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count)
        {
            var ve = MemoryMarshal.Cast<double, Vector<double>>(e);
            var vy = MemoryMarshal.Cast<double, Vector<double>>(y[..n]);
            var vn = MemoryMarshal.Cast<double, Vector<double>>(yNew[..n]);
            var va = MemoryMarshal.Cast<double, Vector<double>>(atol[..n]);
            var vr = new Vector<double>(rtol);
            var acc = Vector<double>.Zero;
            for (int k = 0; k < ve.Length; k++)
            {
                var sc = va[k] + vr * Vector.Max(Vector.Abs(vy[k]), Vector.Abs(vn[k]));
                var q = ve[k] / sc;
                acc += q * q;
            }
            s = Vector.Sum(acc);
            i = ve.Length * Vector<double>.Count;
        }
        for (; i < n; i++)
        {
            double q = e[i] / (atol[i] + rtol * Math.Max(Math.Abs(y[i]), Math.Abs(yNew[i])));
            s += q * q;
        }
        return Math.Sqrt(s / n);
    }

    /// <summary>Index of the first non-finite entry, or −1.</summary>
    public static int FirstNonFinite(ReadOnlySpan<double> x)
    {
        // x·0 is 0 for finite x and NaN for ±∞ or NaN, so the sum is 0 exactly when every entry is finite.
        double s = 0.0;
        for (int i = 0; i < x.Length; i++) s += x[i] * 0.0;
        if (s == 0.0) return -1;
        for (int i = 0; i < x.Length; i++)
            if (!double.IsFinite(x[i])) return i;
        return -1;
    }
}

/// <summary>Fused stage combinations over a flat stage array K (stage j at K[j·n .. j·n + n)).</summary>
[SkipLocalsInit] // the stack buffers below are written before they are read; zeroing them cost ~10 % of an explicit step
internal static class StageOps
{
    /// <summary>Most stages whose broadcast coefficients go on the stack.</summary>
    private const int MaxStackStages = 16;

    /// <summary>output_i = y_i + h Σ_{j &lt; count} a_j K[j·n + i]. <paramref name="output"/> may be <paramref name="y"/>.</summary>
    public static void Combine(ReadOnlySpan<double> y, double h, ReadOnlySpan<double> a, int count, ReadOnlySpan<double> k, int n, Span<double> output)
    {
        if (y.Length < n || output.Length < n || a.Length < count || k.Length < count * n || count > MaxStackStages) ThrowShort();
        ref double ry = ref MemoryMarshal.GetReference(y);
        ref double rk = ref MemoryMarshal.GetReference(k);
        ref double ro = ref MemoryMarshal.GetReference(output);
        Span<double> ha = stackalloc double[MaxStackStages];
        for (int j = 0; j < count; j++) ha[j] = h * a[j];
        int i = 0;
        int w = Vector<double>.Count;
        if (Vector.IsHardwareAccelerated && n >= w)
        {
            Span<Vector<double>> va = stackalloc Vector<double>[MaxStackStages];
            for (int j = 0; j < count; j++) va[j] = new Vector<double>(ha[j]);
            for (; i <= n - w; i += w)
            {
                var acc = Vector.LoadUnsafe(ref ry, (nuint)i);
                for (int j = 0; j < count; j++)
                    acc += va[j] * Vector.LoadUnsafe(ref rk, (nuint)(j * n + i));
                acc.StoreUnsafe(ref ro, (nuint)i);
            }
        }
        for (; i < n; i++)
        {
            double acc = Unsafe.Add(ref ry, i);
            for (int j = 0; j < count; j++) acc += ha[j] * Unsafe.Add(ref rk, j * n + i);
            Unsafe.Add(ref ro, i) = acc;
        }
    }

    /// <summary>
    /// The weighted RMS norm (see <see cref="VectorOps.ErrorNorm"/>) of e = h Σ_j E_j K_j, without storing e.
    /// </summary>
    public static double ErrorNorm(double h, ReadOnlySpan<double> e, int count, ReadOnlySpan<double> k, int n,
        ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, ReadOnlySpan<double> atol, double rtol)
    {
        if (n == 0) return 0.0;
        if (y.Length < n || yNew.Length < n || atol.Length < n || e.Length < count || k.Length < count * n || count > MaxStackStages) ThrowShort();
        ref double rk = ref MemoryMarshal.GetReference(k);
        ref double ry = ref MemoryMarshal.GetReference(y);
        ref double rn = ref MemoryMarshal.GetReference(yNew);
        ref double ra = ref MemoryMarshal.GetReference(atol);
        Span<double> he = stackalloc double[MaxStackStages];
        for (int j = 0; j < count; j++) he[j] = h * e[j];
        int i = 0;
        double s = 0.0;
        int w = Vector<double>.Count;
        if (Vector.IsHardwareAccelerated && n >= w)
        {
            Span<Vector<double>> ve = stackalloc Vector<double>[MaxStackStages];
            for (int j = 0; j < count; j++) ve[j] = new Vector<double>(he[j]);
            var vr = new Vector<double>(rtol);
            var sum = Vector<double>.Zero;
            for (; i <= n - w; i += w)
            {
                var acc = Vector<double>.Zero;
                for (int j = 0; j < count; j++)
                    acc += ve[j] * Vector.LoadUnsafe(ref rk, (nuint)(j * n + i));
                var sc = Vector.LoadUnsafe(ref ra, (nuint)i) + vr * Vector.Max(Vector.Abs(Vector.LoadUnsafe(ref ry, (nuint)i)), Vector.Abs(Vector.LoadUnsafe(ref rn, (nuint)i)));
                var q = acc / sc;
                sum += q * q;
            }
            s = Vector.Sum(sum);
        }
        for (; i < n; i++)
        {
            double acc = 0.0;
            for (int j = 0; j < count; j++) acc += he[j] * Unsafe.Add(ref rk, j * n + i);
            double sc = Unsafe.Add(ref ra, i) + rtol * Math.Max(Math.Abs(Unsafe.Add(ref ry, i)), Math.Abs(Unsafe.Add(ref rn, i)));
            double q = acc / sc;
            s += q * q;
        }
        return Math.Sqrt(s / n);
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowShort() => throw new ArgumentException("Stage buffers are shorter than the system dimension.");
}
