namespace Thermostrat.Model.Numerics;

/// <summary>
/// LU factorisation with partial (row) pivoting of a small dense matrix held row-major in a span,
/// and the matching forward/back substitution: PA = LU, the classical right-looking algorithm
/// (Golub and Van Loan, <i>Matrix Computations</i>, 4th ed., Alg. 3.4.1). Works in place and never
/// allocates; meant for the n ≲ 100 systems of implicit integrators and Newton iterations.
/// </summary>
/// <remarks>
/// Measured against MathNet.Numerics' <c>Matrix.LU().Solve</c> in bench/OdeBench.cs: this routine is
/// faster for the integrator's sizes and needs no heap matrix, so the stiff integrator uses it.
/// </remarks>
public static class DenseLu
{
    /// <summary>
    /// Factors the n×n row-major <paramref name="matrix"/> in place into L (unit lower, below the diagonal)
    /// and U (on and above it), recording the pivot row of each column in <paramref name="pivots"/>.
    /// </summary>
    /// <returns>False if a pivot is exactly zero (the matrix is singular to working precision); the factors are then unusable.</returns>
    public static bool Factor(Span<double> matrix, int n, Span<int> pivots)
    {
        if (n < 0) throw new ArgumentOutOfRangeException(nameof(n), n, "Matrix order must be non-negative.");
        if (matrix.Length < n * n) throw new ArgumentException($"The matrix span has length {matrix.Length}; order {n} needs {n * n}.", nameof(matrix));
        if (pivots.Length < n) throw new ArgumentException($"The pivot span has length {pivots.Length}; order {n} needs {n}.", nameof(pivots));
        for (int k = 0; k < n; k++)
        {
            int p = k;
            double max = Math.Abs(matrix[k * n + k]);
            for (int i = k + 1; i < n; i++)
            {
                double v = Math.Abs(matrix[i * n + k]);
                if (v > max) { max = v; p = i; }
            }
            pivots[k] = p;
            if (max == 0.0 || !double.IsFinite(max)) return false;
            if (p != k)
            {
                Span<double> a = matrix.Slice(k * n, n), b = matrix.Slice(p * n, n);
                for (int j = 0; j < n; j++) (a[j], b[j]) = (b[j], a[j]);
            }
            double inv = 1.0 / matrix[k * n + k];
            ReadOnlySpan<double> rowK = matrix.Slice(k * n + k + 1, n - k - 1);
            for (int i = k + 1; i < n; i++)
            {
                double l = matrix[i * n + k] * inv;
                matrix[i * n + k] = l;
                if (l != 0.0) VectorOps.Axpy(-l, rowK, matrix.Slice(i * n + k + 1, n - k - 1));
            }
        }
        return true;
    }

    /// <summary>Solves A x = b in place (<paramref name="rhs"/> becomes x) with the factors from <see cref="Factor"/>.</summary>
    public static void Solve(ReadOnlySpan<double> factors, int n, ReadOnlySpan<int> pivots, Span<double> rhs)
    {
        if (factors.Length < n * n) throw new ArgumentException($"The factor span has length {factors.Length}; order {n} needs {n * n}.", nameof(factors));
        if (rhs.Length < n) throw new ArgumentException($"The right-hand side has length {rhs.Length}; order {n} needs {n}.", nameof(rhs));
        for (int k = 0; k < n; k++)
        {
            int p = pivots[k];
            if (p != k) (rhs[k], rhs[p]) = (rhs[p], rhs[k]);
        }
        for (int i = 1; i < n; i++)
            rhs[i] -= VectorOps.Dot(factors.Slice(i * n, i), rhs[..i]);
        for (int i = n - 1; i >= 0; i--)
        {
            double s = rhs[i] - VectorOps.Dot(factors.Slice(i * n + i + 1, n - i - 1), rhs.Slice(i + 1, n - i - 1));
            rhs[i] = s / factors[i * n + i];
        }
    }
}
