using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Thermostrat.Model.Numerics;

/// <summary>
/// LU factorisation with partial (row) pivoting of a small dense matrix held row-major in a span,
/// and the matching forward/back substitution: PA = LU, the classical right-looking algorithm
/// (Golub and Van Loan, <i>Matrix Computations</i>, 4th ed., Alg. 3.4.1). Works in place and never
/// allocates; meant for the n ≲ 100 systems of implicit integrators and Newton iterations.
/// </summary>
/// <remarks>
/// Measured against MathNet.Numerics' <c>Matrix.LU().Solve</c> in bench/OdeBench.cs: faster at n = 3–50 and needs no heap
/// matrix. (The Rosenbrock integrator uses the column-major variant, whose substitutions vectorise.)
/// </remarks>
public static class DenseLu
{
    /// <summary>
    /// Factors the n×n row-major <paramref name="matrix"/> in place into L (unit lower, below the diagonal)
    /// and U (on and above it), recording the pivot row of each column in <paramref name="pivots"/>.
    /// </summary>
    /// <returns>False if a pivot is exactly zero or not finite (the matrix is singular to working precision); the factors are then unusable.</returns>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static bool Factor(Span<double> matrix, int n, Span<int> pivots)
    {
        if (n < 0 || matrix.Length < n * n || pivots.Length < n) ThrowBadSizes(n, matrix.Length, pivots.Length, nameof(matrix));
        ref double a = ref MemoryMarshal.GetReference(matrix);
        for (int k = 0; k < n; k++)
        {
            int p = k;
            double max = Math.Abs(Unsafe.Add(ref a, k * n + k));
            for (int i = k + 1; i < n; i++)
            {
                double v = Math.Abs(Unsafe.Add(ref a, i * n + k));
                if (v > max) { max = v; p = i; }
            }
            pivots[k] = p;
            if (max == 0.0 || !double.IsFinite(max)) return false;
            if (p != k)
            {
                ref double rk = ref Unsafe.Add(ref a, k * n), rp = ref Unsafe.Add(ref a, p * n);
                for (int j = 0; j < n; j++) (Unsafe.Add(ref rk, j), Unsafe.Add(ref rp, j)) = (Unsafe.Add(ref rp, j), Unsafe.Add(ref rk, j));
            }
            double inv = 1.0 / Unsafe.Add(ref a, k * n + k);
            int m = n - k - 1;
            ref double pivotRow = ref Unsafe.Add(ref a, k * n + k + 1);
            for (int i = k + 1; i < n; i++)
            {
                ref double row = ref Unsafe.Add(ref a, i * n + k);
                double l = row * inv;
                row = l;
                if (l == 0.0) continue;
                ref double target = ref Unsafe.Add(ref row, 1);
                int j = 0;
                if (Vector.IsHardwareAccelerated && m >= Vector<double>.Count)
                {
                    var vl = new Vector<double>(l);
                    for (; j <= m - Vector<double>.Count; j += Vector<double>.Count)
                        (Vector.LoadUnsafe(ref target, (nuint)j) - vl * Vector.LoadUnsafe(ref pivotRow, (nuint)j)).StoreUnsafe(ref target, (nuint)j);
                }
                for (; j < m; j++) Unsafe.Add(ref target, j) -= l * Unsafe.Add(ref pivotRow, j);
            }
        }
        return true;
    }

    /// <summary>Solves A x = b in place (<paramref name="rhs"/> becomes x) with the factors from <see cref="Factor(Span{double}, int, Span{int})"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Solve(ReadOnlySpan<double> factors, int n, ReadOnlySpan<int> pivots, Span<double> rhs)
    {
        if (n < 0 || factors.Length < n * n || pivots.Length < n) ThrowBadSizes(n, factors.Length, pivots.Length, nameof(factors));
        if (rhs.Length < n) ThrowBadRhs(n, rhs.Length);
        ref double lu = ref MemoryMarshal.GetReference(factors);
        ref double x = ref MemoryMarshal.GetReference(rhs);
        for (int k = 0; k < n; k++)
        {
            int p = pivots[k];
            if ((uint)p >= (uint)n) ThrowBadPivot(k, p, n);
            if (p != k) (Unsafe.Add(ref x, k), Unsafe.Add(ref x, p)) = (Unsafe.Add(ref x, p), Unsafe.Add(ref x, k));
        }
        for (int i = 1; i < n; i++)
        {
            ref double row = ref Unsafe.Add(ref lu, i * n);
            Unsafe.Add(ref x, i) -= Dot(ref row, ref x, i);
        }
        for (int i = n - 1; i >= 0; i--)
        {
            ref double row = ref Unsafe.Add(ref lu, i * n);
            double s = Unsafe.Add(ref x, i) - Dot(ref Unsafe.Add(ref row, i + 1), ref Unsafe.Add(ref x, i + 1), n - i - 1);
            Unsafe.Add(ref x, i) = s / Unsafe.Add(ref row, i);
        }
    }

    /// <summary>Σ_{j &lt; m} a_j b_j with independent partial sums (SIMD when long enough), so the substitutions are not one long dependency chain.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Dot(ref double a, ref double b, int m)
    {
        int j = 0;
        double s = 0.0;
        int w = Vector<double>.Count;
        if (Vector.IsHardwareAccelerated && m >= 2 * w)
        {
            var acc0 = Vector<double>.Zero;
            var acc1 = Vector<double>.Zero;
            for (; j <= m - 2 * w; j += 2 * w)
            {
                acc0 += Vector.LoadUnsafe(ref a, (nuint)j) * Vector.LoadUnsafe(ref b, (nuint)j);
                acc1 += Vector.LoadUnsafe(ref a, (nuint)(j + w)) * Vector.LoadUnsafe(ref b, (nuint)(j + w));
            }
            s = Vector.Sum(acc0 + acc1);
        }
        double s1 = 0.0;
        for (; j + 1 < m; j += 2)
        {
            s += Unsafe.Add(ref a, j) * Unsafe.Add(ref b, j);
            s1 += Unsafe.Add(ref a, j + 1) * Unsafe.Add(ref b, j + 1);
        }
        if (j < m) s += Unsafe.Add(ref a, j) * Unsafe.Add(ref b, j);
        return s + s1;
    }

    // Throws live in separate methods: an interpolated message inside the hot methods would make every call zero a large stack frame.
    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowBadSizes(int n, int matrixLength, int pivotLength, string matrixName)
    {
        if (n < 0) throw new ArgumentOutOfRangeException("n", n, "Matrix order must be non-negative.");
        if (matrixLength < n * n) throw new ArgumentException($"The matrix span has length {matrixLength}; order {n} needs {n * n}.", matrixName);
        throw new ArgumentException($"The pivot span has length {pivotLength}; order {n} needs {n}.", "pivots");
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowBadRhs(int n, int length) =>
        throw new ArgumentException($"The right-hand side has length {length}; order {n} needs {n}.", "rhs");

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowBadPivot(int k, int p, int n) =>
        throw new ArgumentException($"Pivot [{k}] = {p} is outside [0, {n - 1}].", "pivots");
}
