namespace Thermostrat.Model.Analysis;

/// <summary>
/// LU factorisation with partial (row) pivoting of a small dense square matrix stored row-major,
/// P A = L U (Golub and Van Loan, Matrix Computations, 4th ed., algorithm 3.4.1), in buffers
/// allocated once and reused: the linear solver of Newton's method, of the continuation
/// corrector and of the extended systems that locate special points.
/// </summary>
/// <remarks>Not thread-safe; one instance per solver.</remarks>
internal sealed class LuFactorization
{
    private readonly double[] _lu;
    private readonly int[] _pivot;
    private int _pivotSign;

    public LuFactorization(int capacity)
    {
        if (capacity < 1) throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "The matrix size must be at least 1.");
        Capacity = capacity;
        _lu = new double[capacity * capacity];
        _pivot = new int[capacity];
    }

    /// <summary>Largest order this instance can factor.</summary>
    public int Capacity { get; }

    /// <summary>Order of the matrix last factored.</summary>
    public int Order { get; private set; }

    /// <summary>True when a zero (or non-finite) pivot was met: the matrix is singular to working precision.</summary>
    public bool IsSingular { get; private set; }

    /// <summary>Smallest |U_ii| / largest |U_ii|: a cheap indicator of near-singularity (0 when singular).</summary>
    public double PivotRatio { get; private set; }

    /// <summary>Sign of the determinant of the last matrix factored (0 when singular).</summary>
    public int DeterminantSign { get; private set; }

    /// <summary>Factors the <paramref name="order"/> × <paramref name="order"/> row-major matrix <paramref name="a"/> (copied).</summary>
    /// <returns>False if the matrix is singular to working precision.</returns>
    public bool Factor(ReadOnlySpan<double> a, int order)
    {
        if (order < 1 || order > Capacity)
            throw new ArgumentOutOfRangeException(nameof(order), order, $"The order must be between 1 and {Capacity}.");
        if (a.Length < order * order)
            throw new ArgumentException($"The matrix needs {order * order} entries, got {a.Length}.", nameof(a));
        Order = order;
        int n = order;
        var lu = _lu.AsSpan(0, n * n);
        a[..(n * n)].CopyTo(lu);
        _pivotSign = 1;
        IsSingular = false;
        double maxPivot = 0, minPivot = double.PositiveInfinity;
        for (int k = 0; k < n; k++)
        {
            int p = k;
            double big = Math.Abs(lu[k * n + k]);
            for (int i = k + 1; i < n; i++)
            {
                double v = Math.Abs(lu[i * n + k]);
                if (v > big) { big = v; p = i; }
            }
            _pivot[k] = p;
            if (p != k)
            {
                for (int j = 0; j < n; j++) (lu[p * n + j], lu[k * n + j]) = (lu[k * n + j], lu[p * n + j]);
                _pivotSign = -_pivotSign;
            }
            double pivot = lu[k * n + k];
            if (pivot == 0 || !double.IsFinite(pivot))
            {
                IsSingular = true;
                PivotRatio = 0;
                DeterminantSign = 0;
                return false;
            }
            maxPivot = Math.Max(maxPivot, Math.Abs(pivot));
            minPivot = Math.Min(minPivot, Math.Abs(pivot));
            if (pivot < 0) _pivotSign = -_pivotSign;
            double inv = 1.0 / pivot;
            var rowK = lu.Slice(k * n, n);
            for (int i = k + 1; i < n; i++)
            {
                var rowI = lu.Slice(i * n, n);
                double m = rowI[k] * inv;
                rowI[k] = m;
                if (m == 0) continue;
                for (int j = k + 1; j < n; j++) rowI[j] -= m * rowK[j];
            }
        }
        PivotRatio = minPivot / maxPivot;
        DeterminantSign = _pivotSign;
        return true;
    }

    /// <summary>Solves A x = b in place (b is overwritten by x).</summary>
    public void Solve(Span<double> b)
    {
        if (IsSingular) throw new InvalidOperationException("The matrix is singular; cannot solve.");
        int n = Order;
        var lu = _lu.AsSpan(0, n * n);
        for (int k = 0; k < n; k++)
        {
            int p = _pivot[k];
            if (p != k) (b[k], b[p]) = (b[p], b[k]);
        }
        for (int i = 1; i < n; i++)
        {
            var row = lu.Slice(i * n, i);
            double s = b[i];
            for (int j = 0; j < i; j++) s -= row[j] * b[j];
            b[i] = s;
        }
        for (int i = n - 1; i >= 0; i--)
        {
            var row = lu.Slice(i * n, n);
            double s = b[i];
            for (int j = i + 1; j < n; j++) s -= row[j] * b[j];
            b[i] = s / row[i];
        }
    }

    /// <summary>Solves Aᵀ x = b in place (b is overwritten by x).</summary>
    public void SolveTransposed(Span<double> b)
    {
        if (IsSingular) throw new InvalidOperationException("The matrix is singular; cannot solve.");
        int n = Order;
        var lu = _lu.AsSpan(0, n * n);
        // Aᵀ = Uᵀ Lᵀ P, so solve Uᵀ y = b, then Lᵀ z = y, then x = Pᵀ z.
        for (int i = 0; i < n; i++)
        {
            double s = b[i];
            for (int j = 0; j < i; j++) s -= lu[j * n + i] * b[j];
            b[i] = s / lu[i * n + i];
        }
        for (int i = n - 1; i >= 0; i--)
        {
            double s = b[i];
            for (int j = i + 1; j < n; j++) s -= lu[j * n + i] * b[j];
            b[i] = s;
        }
        for (int k = n - 1; k >= 0; k--)
        {
            int p = _pivot[k];
            if (p != k) (b[k], b[p]) = (b[p], b[k]);
        }
    }
}
