using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Thermostrat.Model.Numerics;

/// <summary>
/// LU with partial pivoting of a matrix stored column by column (A[i, j] at j·n + i), the layout in which every inner loop
/// of the elimination and of both substitutions runs down a contiguous column (an axpy), so all of them vectorise. The
/// Rosenbrock integrator assembles its iteration matrix in this layout (a Jacobian column is one dual-number evaluation)
/// and solves six times per factorisation. Algorithm: Golub and Van Loan, <i>Matrix Computations</i>, 4th ed., Alg. 3.4.1
/// (the column-oriented "kji" form, Sect. 3.2.9).
/// </summary>
internal static class ColumnMajorLu
{
    /// <summary>Factors in place; the reciprocal pivots go to <paramref name="inverseDiagonal"/>. False if a pivot is zero or not finite.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static bool Factor(Span<double> matrix, int n, Span<int> pivots, Span<double> inverseDiagonal)
    {
        if (n < 0 || matrix.Length < n * n || pivots.Length < n || inverseDiagonal.Length < n) ThrowShort();
        ref double a = ref MemoryMarshal.GetReference(matrix);
        for (int k = 0; k < n; k++)
        {
            ref double colK = ref Unsafe.Add(ref a, k * n);
            int p = k;
            double max = Math.Abs(Unsafe.Add(ref colK, k));
            for (int i = k + 1; i < n; i++)
            {
                double v = Math.Abs(Unsafe.Add(ref colK, i));
                if (v > max) { max = v; p = i; }
            }
            pivots[k] = p;
            if (max == 0.0 || !double.IsFinite(max)) return false;
            if (p != k)
                for (int j = 0; j < n; j++)
                {
                    ref double c = ref Unsafe.Add(ref a, j * n);
                    (Unsafe.Add(ref c, k), Unsafe.Add(ref c, p)) = (Unsafe.Add(ref c, p), Unsafe.Add(ref c, k));
                }
            double inv = 1.0 / Unsafe.Add(ref colK, k);
            inverseDiagonal[k] = inv;
            int m = n - k - 1;
            ref double l = ref Unsafe.Add(ref colK, k + 1);
            Scale(ref l, inv, m);
            for (int j = k + 1; j < n; j++)
            {
                ref double colJ = ref Unsafe.Add(ref a, j * n);
                double akj = Unsafe.Add(ref colJ, k);
                if (akj != 0.0) Axpy(-akj, ref l, ref Unsafe.Add(ref colJ, k + 1), m);
            }
        }
        return true;
    }

    /// <summary>Solves A x = b in place with the factors and reciprocal pivots from <see cref="Factor"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Solve(ReadOnlySpan<double> factors, int n, ReadOnlySpan<int> pivots, ReadOnlySpan<double> inverseDiagonal, Span<double> rhs)
    {
        if (n < 0 || factors.Length < n * n || pivots.Length < n || inverseDiagonal.Length < n || rhs.Length < n) ThrowShort();
        ref double lu = ref MemoryMarshal.GetReference(factors);
        ref double x = ref MemoryMarshal.GetReference(rhs);
        for (int k = 0; k < n; k++)
        {
            int p = pivots[k];
            if ((uint)p >= (uint)n) ThrowShort();
            if (p != k) (Unsafe.Add(ref x, k), Unsafe.Add(ref x, p)) = (Unsafe.Add(ref x, p), Unsafe.Add(ref x, k));
        }
        // L y = Pb, column by column.
        for (int j = 0; j < n - 1; j++)
        {
            double xj = Unsafe.Add(ref x, j);
            if (xj != 0.0) Axpy(-xj, ref Unsafe.Add(ref lu, j * n + j + 1), ref Unsafe.Add(ref x, j + 1), n - j - 1);
        }
        // U x = y, column by column from the last.
        for (int j = n - 1; j >= 0; j--)
        {
            double xj = Unsafe.Add(ref x, j) * inverseDiagonal[j];
            Unsafe.Add(ref x, j) = xj;
            if (xj != 0.0 && j > 0) Axpy(-xj, ref Unsafe.Add(ref lu, j * n), ref x, j);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Axpy(double alpha, ref double x, ref double y, int m)
    {
        int i = 0;
        int w = Vector<double>.Count;
        if (Vector.IsHardwareAccelerated && m >= w)
        {
            var va = new Vector<double>(alpha);
            for (; i <= m - w; i += w)
                (Vector.LoadUnsafe(ref y, (nuint)i) + va * Vector.LoadUnsafe(ref x, (nuint)i)).StoreUnsafe(ref y, (nuint)i);
        }
        for (; i < m; i++) Unsafe.Add(ref y, i) += alpha * Unsafe.Add(ref x, i);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Scale(ref double x, double alpha, int m)
    {
        for (int i = 0; i < m; i++) Unsafe.Add(ref x, i) *= alpha;
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowShort() => throw new ArgumentException("LU buffers are shorter than the matrix order needs, or a pivot index is out of range.");
}
