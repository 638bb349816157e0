namespace Thermostrat.Model.Orbital;

/// <summary>
/// Piecewise-cubic interpolation of several channels sampled at the same strictly increasing
/// abscissae, with the not-a-knot end condition (de Boor, A Practical Guide to Splines, 1978, ch. IV):
/// the third derivative is continuous at the second and the next-to-last knots. The interpolant is
/// twice continuously differentiable and reproduces cubic polynomials exactly.
/// </summary>
/// <remarks>
/// The knot slopes solve a tridiagonal system (one row per knot, the two end rows expressing
/// not-a-knot) by Gaussian elimination with partial pivoting (the LAPACK dgtsv algorithm).
/// On a uniform grid the interval is found by one multiplication, otherwise by binary search.
/// </remarks>
internal sealed class CubicSpline
{
    private readonly double[] _x;
    private readonly double[] _coefficients; // [interval][channel][c0..c3], powers of (x − x_i)
    private readonly bool _uniform;
    private readonly double _x0, _inverseSpacing;

    /// <summary>Number of channels interpolated together.</summary>
    public int Channels { get; }

    /// <summary>First knot.</summary>
    public double Start => _x[0];

    /// <summary>Last knot.</summary>
    public double End => _x[^1];

    /// <param name="x">Knots, strictly increasing, at least 4.</param>
    /// <param name="channels">Each channel's values at the knots (same length as <paramref name="x"/>).</param>
    public CubicSpline(double[] x, IReadOnlyList<double[]> channels)
    {
        int n = x.Length;
        if (n < 4) throw new ArgumentException($"A not-a-knot cubic spline needs at least 4 knots; {n} given.", nameof(x));
        for (int i = 1; i < n; i++)
            if (!(x[i] > x[i - 1])) throw new ArgumentException($"Knots must be strictly increasing; x[{i - 1}] = {x[i - 1]:R}, x[{i}] = {x[i]:R}.", nameof(x));
        Channels = channels.Count;
        _x = (double[])x.Clone();
        _coefficients = new double[(n - 1) * Channels * 4];

        double h = (x[n - 1] - x[0]) / (n - 1);
        _uniform = true;
        for (int i = 0; i < n; i++)
            if (Math.Abs(x[i] - (x[0] + i * h)) > 1e-12 * Math.Max(Math.Abs(x[0]), Math.Abs(x[n - 1]) + h)) { _uniform = false; break; }
        _x0 = x[0];
        _inverseSpacing = 1.0 / h;

        var dx = new double[n - 1];
        for (int i = 0; i < n - 1; i++) dx[i] = x[i + 1] - x[i];
        var slope = new double[n];
        var m = new double[n - 1];
        for (int c = 0; c < Channels; c++)
        {
            double[] y = channels[c];
            if (y.Length != n) throw new ArgumentException($"Channel {c} has {y.Length} values for {n} knots.", nameof(channels));
            for (int i = 0; i < n - 1; i++) m[i] = (y[i + 1] - y[i]) / dx[i];
            SolveSlopes(dx, m, slope);
            for (int i = 0; i < n - 1; i++)
            {
                int k = (i * Channels + c) * 4;
                double hi = dx[i];
                _coefficients[k] = y[i];
                _coefficients[k + 1] = slope[i];
                _coefficients[k + 2] = (3.0 * m[i] - 2.0 * slope[i] - slope[i + 1]) / hi;
                _coefficients[k + 3] = (slope[i] + slope[i + 1] - 2.0 * m[i]) / (hi * hi);
            }
        }
    }

    /// <summary>Index of the interval containing <paramref name="t"/> (clamped to the end intervals).</summary>
    private int Interval(double t)
    {
        int last = _x.Length - 2;
        int i;
        if (_uniform)
        {
            i = (int)((t - _x0) * _inverseSpacing);
            if (i < 0) i = 0; else if (i > last) i = last;
        }
        else
        {
            i = Array.BinarySearch(_x, t);
            if (i < 0) i = ~i - 1;
            if (i < 0) i = 0; else if (i > last) i = last;
        }
        return i;
    }

    /// <summary>Values of all channels at <paramref name="t"/> (extrapolates the end cubics outside the knots; callers check the range).</summary>
    public void Evaluate(double t, Span<double> values)
    {
        int i = Interval(t);
        double u = t - _x[i];
        ReadOnlySpan<double> k = _coefficients.AsSpan((i * Channels) * 4, Channels * 4);
        for (int c = 0; c < Channels; c++)
        {
            int j = 4 * c;
            values[c] = k[j] + u * (k[j + 1] + u * (k[j + 2] + u * k[j + 3]));
        }
    }

    /// <summary>Values of the first three channels at <paramref name="t"/> (the orbital fast path).</summary>
    public void Evaluate3(double t, out double v0, out double v1, out double v2)
    {
        int i = Interval(t);
        double u = t - _x[i];
        ReadOnlySpan<double> k = _coefficients.AsSpan((i * Channels) * 4, 12);
        v0 = k[0] + u * (k[1] + u * (k[2] + u * k[3]));
        v1 = k[4] + u * (k[5] + u * (k[6] + u * k[7]));
        v2 = k[8] + u * (k[9] + u * (k[10] + u * k[11]));
    }

    /// <summary>Value of one channel at <paramref name="t"/>.</summary>
    public double Evaluate(double t, int channel)
    {
        int i = Interval(t);
        double u = t - _x[i];
        int j = (i * Channels + channel) * 4;
        double[] k = _coefficients;
        return k[j] + u * (k[j + 1] + u * (k[j + 2] + u * k[j + 3]));
    }

    /// <summary>
    /// Knot slopes s of the C² cubic interpolant: for interior knots
    /// dx[i]·s[i−1] + 2(dx[i−1] + dx[i])·s[i] + dx[i−1]·s[i+1] = 3(dx[i]·m[i−1] + dx[i−1]·m[i]),
    /// with the not-a-knot rows at both ends.
    /// </summary>
    private static void SolveSlopes(double[] dx, double[] m, double[] s)
    {
        int n = s.Length;
        var lower = new double[n - 1];
        var diag = new double[n];
        var upper = new double[n - 1];
        var rhs = s; // solved in place

        double d0 = dx[0] + dx[1];
        diag[0] = dx[1];
        upper[0] = d0;
        rhs[0] = ((dx[0] + 2.0 * d0) * dx[1] * m[0] + dx[0] * dx[0] * m[1]) / d0;
        for (int i = 1; i < n - 1; i++)
        {
            lower[i - 1] = dx[i];
            diag[i] = 2.0 * (dx[i - 1] + dx[i]);
            upper[i] = dx[i - 1];
            rhs[i] = 3.0 * (dx[i] * m[i - 1] + dx[i - 1] * m[i]);
        }
        double dn = dx[n - 2] + dx[n - 3];
        lower[n - 2] = dn;
        diag[n - 1] = dx[n - 3];
        rhs[n - 1] = (dx[n - 2] * dx[n - 2] * m[n - 3] + (2.0 * dn + dx[n - 2]) * dx[n - 3] * m[n - 2]) / dn;

        SolveTridiagonal(lower, diag, upper, rhs);
    }

    /// <summary>
    /// Solves a tridiagonal system in place by Gaussian elimination with partial pivoting
    /// (the algorithm of LAPACK dgtsv; Anderson et al., LAPACK Users' Guide). <paramref name="b"/> becomes the solution.
    /// </summary>
    internal static void SolveTridiagonal(double[] lower, double[] diag, double[] upper, double[] b)
    {
        int n = diag.Length;
        var upper2 = new double[Math.Max(n - 2, 0)];
        for (int i = 0; i < n - 1; i++)
        {
            if (Math.Abs(diag[i]) >= Math.Abs(lower[i]))
            {
                if (diag[i] == 0.0) throw new InvalidOperationException("Singular tridiagonal system in spline construction.");
                double fact = lower[i] / diag[i];
                diag[i + 1] -= fact * upper[i];
                b[i + 1] -= fact * b[i];
                if (i < n - 2) upper2[i] = 0.0;
            }
            else
            {
                double fact = diag[i] / lower[i];
                diag[i] = lower[i];
                double temp = diag[i + 1];
                diag[i + 1] = upper[i] - fact * temp;
                if (i < n - 2)
                {
                    upper2[i] = upper[i + 1];
                    upper[i + 1] = -fact * upper2[i];
                }
                upper[i] = temp;
                temp = b[i];
                b[i] = b[i + 1];
                b[i + 1] = temp - fact * b[i + 1];
            }
        }
        if (diag[n - 1] == 0.0) throw new InvalidOperationException("Singular tridiagonal system in spline construction.");
        b[n - 1] /= diag[n - 1];
        if (n > 1) b[n - 2] = (b[n - 2] - upper[n - 2] * b[n - 1]) / diag[n - 2];
        for (int i = n - 3; i >= 0; i--)
            b[i] = (b[i] - upper[i] * b[i + 1] - upper2[i] * b[i + 2]) / diag[i];
    }
}
