using System.Diagnostics;
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
    /// The square of the weighted RMS norm of Hairer, Nørsett and Wanner (Solving ODEs I, Sect. II.4, eq. 4.11):
    /// 1/n Σ (e_i / sc_i)² with sc_i = atol_i + rtol·max(|y_i|, |ŷ_i|). The square root is left to the caller: a step is
    /// accepted when the square is ≤ 1, and the step-size controller works on its logarithm.
    /// </summary>
    public static double ErrorMeanSquare(ReadOnlySpan<double> e, ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, ReadOnlySpan<double> atol, double rtol)
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
                acc += q * q + (vn[k] - vn[k]); // ŷ − ŷ: +0, or NaN for an overflowed ŷ (see StageOps.NormPass)
            }
            s = Vector.Sum(acc);
            i = ve.Length * Vector<double>.Count;
        }
        for (; i < n; i++)
        {
            double q = e[i] / (atol[i] + rtol * Math.Max(Math.Abs(y[i]), Math.Abs(yNew[i])));
            s += q * q + (yNew[i] - yNew[i]);
        }
        return s / n;
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
/// <remarks>
/// Each combination of up to eight stages is one pass over the components: a kernel compiled for its number of terms
/// (<see cref="ITermCount"/>) keeps the broadcast coefficients in registers and adds the terms to y in stage order, so the
/// result is the same in every bit as the plain loop y_i + a₀K₀ᵢ + a₁K₁ᵢ + … . More than eight stages take further
/// passes over the output. The error estimate is fused with its norm, which is returned squared (the step-size controller
/// works on its logarithm, so no square root or division stands between the last stage and the next step), and the
/// explicit stepper calls the passes unchecked on buffers it sized once (<see cref="CombineSized"/>). What a Dormand–Prince
/// step costs beyond its right-hand side is measured by bench/OdeBench.cs and recorded in bench/RESULTS.md.
/// </remarks>
internal static class StageOps
{
    /// <summary>Most stages per pass.</summary>
    private const int MaxTerms = 8;

    /// <summary>A compile-time term count for the kernels.</summary>
    private interface ITermCount
    {
        static abstract int Count { get; }
    }

    private readonly struct T1 : ITermCount { public static int Count => 1; }
    private readonly struct T2 : ITermCount { public static int Count => 2; }
    private readonly struct T3 : ITermCount { public static int Count => 3; }
    private readonly struct T4 : ITermCount { public static int Count => 4; }
    private readonly struct T5 : ITermCount { public static int Count => 5; }
    private readonly struct T6 : ITermCount { public static int Count => 6; }
    private readonly struct T7 : ITermCount { public static int Count => 7; }
    private readonly struct T8 : ITermCount { public static int Count => 8; }

    /// <summary>output_i = y_i + h Σ_{j &lt; count} a_j K[j·n + i]. <paramref name="output"/> may be <paramref name="y"/>.</summary>
    public static void Combine(ReadOnlySpan<double> y, double h, ReadOnlySpan<double> a, int count, ReadOnlySpan<double> k, int n, Span<double> output)
    {
        if (y.Length < n || output.Length < n || a.Length < count || k.Length < count * n) ThrowShort();
        ref double ro = ref MemoryMarshal.GetReference(output);
        ref double from = ref MemoryMarshal.GetReference(y);
        ref double rk = ref MemoryMarshal.GetReference(k);
        if (count == 0)
        {
            if (!Unsafe.AreSame(ref from, ref ro)) y[..n].CopyTo(output);
            return;
        }
        for (int j = 0; j < count; j += MaxTerms)
        {
            int m = Math.Min(MaxTerms, count - j);
            PassAny(ref from, true, ref Unsafe.Add(ref rk, j * n), n, h, a.Slice(j, m), m, ref ro);
            from = ref ro;
        }
    }

    /// <summary>
    /// The square of the weighted RMS norm (see <see cref="VectorOps.ErrorMeanSquare"/>) of e = h Σ_j E_j K_j, fused with
    /// forming e when at most eight stages take part; otherwise e is formed in <paramref name="scratch"/> (length ≥ n) first.
    /// </summary>
    /// <remarks>The mean is taken by multiplying with 1/n, which is computed while the pass runs, so that only a
    /// multiplication (no division, no square root) follows the last stage on the way to the next step size.</remarks>
    public static double ErrorMeanSquare(double h, ReadOnlySpan<double> e, int count, ReadOnlySpan<double> k, int n,
        ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, ReadOnlySpan<double> atol, double rtol, Span<double> scratch)
    {
        if (n == 0) return 0.0;
        if (y.Length < n || yNew.Length < n || atol.Length < n || e.Length < count || k.Length < count * n || scratch.Length < n) ThrowShort();
        if (count == 0) return 0.0;
        double invN = 1.0 / n;
        ref double rk = ref MemoryMarshal.GetReference(k);
        ref double ry = ref MemoryMarshal.GetReference(y);
        ref double rn = ref MemoryMarshal.GetReference(yNew);
        ref double ra = ref MemoryMarshal.GetReference(atol);
        if (count > MaxTerms)
        {
            // e = h Σ E_j K_j in the scratch vector (chunks of eight stages), then its norm.
            ref double rs = ref MemoryMarshal.GetReference(scratch);
            for (int j = 0; j < count; j += MaxTerms)
            {
                int m = Math.Min(MaxTerms, count - j);
                PassAny(ref rs, j > 0, ref Unsafe.Add(ref rk, j * n), n, h, e.Slice(j, m), m, ref rs);
            }
            return VectorOps.ErrorMeanSquare(scratch[..n], y[..n], yNew[..n], atol[..n], rtol);
        }
        double s = count switch
        {
            1 => NormPass<T1>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            2 => NormPass<T2>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            3 => NormPass<T3>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            4 => NormPass<T4>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            5 => NormPass<T5>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            6 => NormPass<T6>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            7 => NormPass<T7>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
            _ => NormPass<T8>(ref rk, n, h, e, ref ry, ref rn, ref ra, rtol),
        };
        return s * invN;
    }

    /// <summary>
    /// output_i = y_i + h Σ_{j &lt; count} a_j K[j·n + i] for 1 ≤ count ≤ <see cref="MaxTerms"/>, without the length checks of
    /// <see cref="Combine"/>: for a stepper's inner loop, whose buffers were sized once. The caller guarantees that y and output
    /// hold n values, k holds count·n, and a holds count; <paramref name="output"/> may be <paramref name="y"/>.
    /// </summary>
    internal static void CombineSized(ref double y, double h, ReadOnlySpan<double> a, int count, ref double k, int n, ref double output)
    {
        Debug.Assert(count is >= 1 and <= MaxTerms && a.Length >= count);
        PassAny(ref y, true, ref k, n, h, a, count, ref output);
    }

    /// <summary>Most stages one <see cref="CombineSized"/> pass takes.</summary>
    internal const int MaxSizedTerms = MaxTerms;

    /// <summary>A pass of <paramref name="m"/> ≤ 8 terms by its kernel.</summary>
    private static void PassAny(ref double from, bool load, ref double k0, int n, double h, ReadOnlySpan<double> c, int m, ref double o)
    {
        switch (m)
        {
            case 1: Pass<T1>(ref from, load, ref k0, n, h, c, ref o); break;
            case 2: Pass<T2>(ref from, load, ref k0, n, h, c, ref o); break;
            case 3: Pass<T3>(ref from, load, ref k0, n, h, c, ref o); break;
            case 4: Pass<T4>(ref from, load, ref k0, n, h, c, ref o); break;
            case 5: Pass<T5>(ref from, load, ref k0, n, h, c, ref o); break;
            case 6: Pass<T6>(ref from, load, ref k0, n, h, c, ref o); break;
            case 7: Pass<T7>(ref from, load, ref k0, n, h, c, ref o); break;
            default: Pass<T8>(ref from, load, ref k0, n, h, c, ref o); break;
        }
    }

    /// <summary>
    /// One pass: out_i = (from_i if <paramref name="load"/>, else 0) + Σ_{j &lt; TTerms.Count} (h c_j) K_j,i with K_j at k0 + j·n,
    /// the terms added in stage order. <paramref name="from"/> may be <paramref name="o"/>.
    /// </summary>
    /// <remarks>The JIT compiles one copy per term count, in which the tests on TTerms.Count are constants: the unused
    /// terms vanish, the used ones keep their broadcast coefficients in registers, and each stage's row is a reference fixed
    /// before the loop, so a term costs one load and two arithmetic instructions per vector.</remarks>
    private static void Pass<TTerms>(ref double from, bool load, ref double k0, int n, double h, ReadOnlySpan<double> c, ref double o)
        where TTerms : struct, ITermCount
    {
        int m = TTerms.Count;
        if (c.Length < m) ThrowShort();
        ref double k1 = ref Unsafe.Add(ref k0, m > 1 ? 1 * n : 0);
        ref double k2 = ref Unsafe.Add(ref k0, m > 2 ? 2 * n : 0);
        ref double k3 = ref Unsafe.Add(ref k0, m > 3 ? 3 * n : 0);
        ref double k4 = ref Unsafe.Add(ref k0, m > 4 ? 4 * n : 0);
        ref double k5 = ref Unsafe.Add(ref k0, m > 5 ? 5 * n : 0);
        ref double k6 = ref Unsafe.Add(ref k0, m > 6 ? 6 * n : 0);
        ref double k7 = ref Unsafe.Add(ref k0, m > 7 ? 7 * n : 0);
        nuint i = 0, count = (nuint)n;
        nuint w = (nuint)Vector<double>.Count;
        if (Vector.IsHardwareAccelerated && count >= w)
        {
            Vector<double> v0 = m > 0 ? new(h * c[0]) : default, v1 = m > 1 ? new(h * c[1]) : default, v2 = m > 2 ? new(h * c[2]) : default, v3 = m > 3 ? new(h * c[3]) : default, v4 = m > 4 ? new(h * c[4]) : default, v5 = m > 5 ? new(h * c[5]) : default, v6 = m > 6 ? new(h * c[6]) : default, v7 = m > 7 ? new(h * c[7]) : default;
            for (; i <= count - w; i += w)
            {
                var acc = load ? Vector.LoadUnsafe(ref from, i) : Vector<double>.Zero;
                if (m > 0) acc += v0 * Vector.LoadUnsafe(ref k0, i);
                if (m > 1) acc += v1 * Vector.LoadUnsafe(ref k1, i);
                if (m > 2) acc += v2 * Vector.LoadUnsafe(ref k2, i);
                if (m > 3) acc += v3 * Vector.LoadUnsafe(ref k3, i);
                if (m > 4) acc += v4 * Vector.LoadUnsafe(ref k4, i);
                if (m > 5) acc += v5 * Vector.LoadUnsafe(ref k5, i);
                if (m > 6) acc += v6 * Vector.LoadUnsafe(ref k6, i);
                if (m > 7) acc += v7 * Vector.LoadUnsafe(ref k7, i);
                acc.StoreUnsafe(ref o, i);
            }
        }
        for (; i < count; i++)
        {
            double acc = load ? Unsafe.Add(ref from, i) : 0.0;
            if (m > 0) acc += h * c[0] * Unsafe.Add(ref k0, i);
            if (m > 1) acc += h * c[1] * Unsafe.Add(ref k1, i);
            if (m > 2) acc += h * c[2] * Unsafe.Add(ref k2, i);
            if (m > 3) acc += h * c[3] * Unsafe.Add(ref k3, i);
            if (m > 4) acc += h * c[4] * Unsafe.Add(ref k4, i);
            if (m > 5) acc += h * c[5] * Unsafe.Add(ref k5, i);
            if (m > 6) acc += h * c[6] * Unsafe.Add(ref k6, i);
            if (m > 7) acc += h * c[7] * Unsafe.Add(ref k7, i);
            Unsafe.Add(ref o, i) = acc;
        }
    }

    /// <summary>
    /// One pass of the fused error norm: Σ_i (e_i / sc_i)² with e_i = Σ_{j &lt; TTerms.Count} (h c_j) K_j,i (stage order) and
    /// sc_i = atol_i + rtol·max(|y_i|, |ŷ_i|); returns the sum of squares, or NaN when some ŷ_i is not finite.
    /// </summary>
    /// <remarks>ŷ_i − ŷ_i is +0 for finite ŷ_i and NaN for ±∞ or NaN; adding it to each square leaves the sum's bits unchanged
    /// (q² + 0 = q²) and makes an overflowed ŷ, whose scale would otherwise be ∞ and its quotient 0, turn the norm into NaN.</remarks>
    private static double NormPass<TTerms>(ref double k0, int n, double h, ReadOnlySpan<double> c, ref double ry, ref double rn, ref double ra, double rtol)
        where TTerms : struct, ITermCount
    {
        int m = TTerms.Count;
        if (c.Length < m) ThrowShort();
        ref double k1 = ref Unsafe.Add(ref k0, m > 1 ? 1 * n : 0);
        ref double k2 = ref Unsafe.Add(ref k0, m > 2 ? 2 * n : 0);
        ref double k3 = ref Unsafe.Add(ref k0, m > 3 ? 3 * n : 0);
        ref double k4 = ref Unsafe.Add(ref k0, m > 4 ? 4 * n : 0);
        ref double k5 = ref Unsafe.Add(ref k0, m > 5 ? 5 * n : 0);
        ref double k6 = ref Unsafe.Add(ref k0, m > 6 ? 6 * n : 0);
        ref double k7 = ref Unsafe.Add(ref k0, m > 7 ? 7 * n : 0);
        nuint i = 0, count = (nuint)n;
        nuint w = (nuint)Vector<double>.Count;
        double s = 0.0;
        if (Vector.IsHardwareAccelerated && count >= w)
        {
            Vector<double> v0 = m > 0 ? new(h * c[0]) : default, v1 = m > 1 ? new(h * c[1]) : default, v2 = m > 2 ? new(h * c[2]) : default, v3 = m > 3 ? new(h * c[3]) : default, v4 = m > 4 ? new(h * c[4]) : default, v5 = m > 5 ? new(h * c[5]) : default, v6 = m > 6 ? new(h * c[6]) : default, v7 = m > 7 ? new(h * c[7]) : default;
            var vr = new Vector<double>(rtol);
            var sum = Vector<double>.Zero;
            for (; i <= count - w; i += w)
            {
                var acc = v0 * Vector.LoadUnsafe(ref k0, i); // m ≥ 1: a norm pass has at least one term
                if (m > 1) acc += v1 * Vector.LoadUnsafe(ref k1, i);
                if (m > 2) acc += v2 * Vector.LoadUnsafe(ref k2, i);
                if (m > 3) acc += v3 * Vector.LoadUnsafe(ref k3, i);
                if (m > 4) acc += v4 * Vector.LoadUnsafe(ref k4, i);
                if (m > 5) acc += v5 * Vector.LoadUnsafe(ref k5, i);
                if (m > 6) acc += v6 * Vector.LoadUnsafe(ref k6, i);
                if (m > 7) acc += v7 * Vector.LoadUnsafe(ref k7, i);
                var yn = Vector.LoadUnsafe(ref rn, i);
                // |y|, |ŷ| ≥ 0, so the native maximum (no signed-zero ordering) is exact; a NaN in ŷ reaches the sum through ŷ − ŷ.
                var sc = Vector.LoadUnsafe(ref ra, i) + vr * Vector.MaxNative(Vector.Abs(Vector.LoadUnsafe(ref ry, i)), Vector.Abs(yn));
                var q = acc / sc;
                sum += q * q + (yn - yn);
            }
            s = Vector.Sum(sum);
        }
        for (; i < count; i++)
        {
            double acc = h * c[0] * Unsafe.Add(ref k0, i);
            if (m > 1) acc += h * c[1] * Unsafe.Add(ref k1, i);
            if (m > 2) acc += h * c[2] * Unsafe.Add(ref k2, i);
            if (m > 3) acc += h * c[3] * Unsafe.Add(ref k3, i);
            if (m > 4) acc += h * c[4] * Unsafe.Add(ref k4, i);
            if (m > 5) acc += h * c[5] * Unsafe.Add(ref k5, i);
            if (m > 6) acc += h * c[6] * Unsafe.Add(ref k6, i);
            if (m > 7) acc += h * c[7] * Unsafe.Add(ref k7, i);
            double yn = Unsafe.Add(ref rn, i);
            double sc = Unsafe.Add(ref ra, i) + rtol * Math.Max(Math.Abs(Unsafe.Add(ref ry, i)), Math.Abs(yn));
            double q = acc / sc;
            s += q * q + (yn - yn);
        }
        return s;
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowShort() => throw new ArgumentException("Stage buffers are shorter than the system dimension.");
}
