using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// First derivatives of a parametric system from <see cref="AutoJacobian"/> (exact, forward-mode
/// dual numbers), and the second derivatives that the extended systems of special points need,
/// as central differences of those exact first derivatives along one direction.
/// </summary>
/// <remarks>
/// The defining equations of folds, Hopf points and branch points involve only first
/// derivatives, which are exact, so located points are as accurate as the Newton tolerance. The
/// second derivatives enter only the Newton matrices of those extended systems (and the cusp
/// test function), where an O(h²) error of about 1e-10 relative costs at most an extra
/// iteration. The step h = ∛ε·(1 + ‖x‖∞)/‖v‖∞ balances the O(h²) truncation against the
/// O(ε/h) rounding of a central difference (Nocedal and Wright, Numerical Optimization, 2nd
/// ed., §8.1). Buffers are allocated once; not thread-safe.
/// </remarks>
internal sealed class SystemDerivatives
{
    /// <summary>Relative central-difference step, ∛(machine epsilon) (see remarks).</summary>
    private const double RelativeStep = 6.0555e-6;

    private readonly double[] _xPlus, _xMinus, _jPlus, _jMinus, _fScratch, _gPlus, _gMinus;

    public SystemDerivatives(IParametricSystem system, double time, ReadOnlySpan<double> parameters)
    {
        System = system;
        N = system.Dimension;
        if (N < 1) throw new ArgumentException($"The system has dimension {N}; at least one state variable is needed.", nameof(system));
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"Expected {system.ParameterCount} parameter values, got {parameters.Length}.", nameof(parameters));
        Time = time;
        P = parameters.ToArray();
        _xPlus = new double[N];
        _xMinus = new double[N];
        _jPlus = new double[N * N];
        _jMinus = new double[N * N];
        _fScratch = new double[N];
        _gPlus = new double[N];
        _gMinus = new double[N];
    }

    public IParametricSystem System { get; }

    /// <summary>State dimension.</summary>
    public int N { get; }

    /// <summary>Time passed to the right-hand side (equilibria are of autonomous systems; 0 by default).</summary>
    public double Time { get; }

    /// <summary>Working parameter vector; callers set the continuation parameters in it.</summary>
    public double[] P { get; }

    /// <summary>f(x; P).</summary>
    public void Residual(ReadOnlySpan<double> x, Span<double> f) => System.Evaluate(Time, x, (ReadOnlySpan<double>)P, f);

    /// <summary>Exact Jacobian ∂f/∂x (row-major n × n) and f.</summary>
    public void Jacobian(ReadOnlySpan<double> x, Span<double> jacobian, Span<double> f) =>
        AutoJacobian.OfState(System, Time, x, P, jacobian, f);

    /// <summary>Exact ∂f/∂p_k.</summary>
    public void ParameterDerivative(ReadOnlySpan<double> x, int k, Span<double> dfdp) =>
        AutoJacobian.OfParameter(System, Time, x, P, k, dfdp);

    private double StateStep(ReadOnlySpan<double> x, ReadOnlySpan<double> v)
    {
        double vMax = Vec.NormInf(v);
        if (vMax == 0) return 0;
        return RelativeStep * (1 + Vec.NormInf(x)) / vMax;
    }

    /// <summary>d/dε J(x + εv) at ε = 0, i.e. the matrix ∂(J v')/∂x contracted with v (row-major n × n).</summary>
    public void JacobianAlong(ReadOnlySpan<double> x, ReadOnlySpan<double> v, Span<double> result)
    {
        double h = StateStep(x, v);
        if (h == 0) { result[..(N * N)].Clear(); return; }
        for (int i = 0; i < N; i++) { _xPlus[i] = x[i] + h * v[i]; _xMinus[i] = x[i] - h * v[i]; }
        Jacobian(_xPlus, _jPlus, _fScratch);
        Jacobian(_xMinus, _jMinus, _fScratch);
        double inv = 0.5 / h;
        for (int i = 0; i < N * N; i++) result[i] = (_jPlus[i] - _jMinus[i]) * inv;
    }

    /// <summary>d/dε ∂f/∂p_k (x + εv) at ε = 0, i.e. (∂²f/∂p_k∂x) v.</summary>
    public void ParameterDerivativeAlong(ReadOnlySpan<double> x, int k, ReadOnlySpan<double> v, Span<double> result)
    {
        double h = StateStep(x, v);
        if (h == 0) { result[..N].Clear(); return; }
        for (int i = 0; i < N; i++) { _xPlus[i] = x[i] + h * v[i]; _xMinus[i] = x[i] - h * v[i]; }
        ParameterDerivative(_xPlus, k, _gPlus);
        ParameterDerivative(_xMinus, k, _gMinus);
        double inv = 0.5 / h;
        for (int i = 0; i < N; i++) result[i] = (_gPlus[i] - _gMinus[i]) * inv;
    }

    /// <summary>∂J/∂p_k (row-major n × n).</summary>
    public void JacobianParameterDerivative(ReadOnlySpan<double> x, int k, Span<double> result)
    {
        double pk = P[k];
        double h = RelativeStep * (1 + Math.Abs(pk));
        P[k] = pk + h; Jacobian(x, _jPlus, _fScratch);
        P[k] = pk - h; Jacobian(x, _jMinus, _fScratch);
        P[k] = pk;
        double inv = 0.5 / h;
        for (int i = 0; i < N * N; i++) result[i] = (_jPlus[i] - _jMinus[i]) * inv;
    }

    /// <summary>∂²f/∂p_k².</summary>
    public void SecondParameterDerivative(ReadOnlySpan<double> x, int k, Span<double> result)
    {
        double pk = P[k];
        double h = RelativeStep * (1 + Math.Abs(pk));
        P[k] = pk + h; ParameterDerivative(x, k, _gPlus);
        P[k] = pk - h; ParameterDerivative(x, k, _gMinus);
        P[k] = pk;
        double inv = 0.5 / h;
        for (int i = 0; i < N; i++) result[i] = (_gPlus[i] - _gMinus[i]) * inv;
    }

    /// <summary>
    /// The Hessian of φᵀf with respect to x: H_jk = Σ_i φ_i ∂²f_i/∂x_j∂x_k (row-major n × n, symmetric
    /// up to rounding), one column per central difference of Jᵀφ.
    /// </summary>
    public void HessianOfContraction(ReadOnlySpan<double> x, ReadOnlySpan<double> phi, Span<double> result)
    {
        for (int k = 0; k < N; k++)
        {
            double h = RelativeStep * (1 + Math.Abs(x[k]));
            x.CopyTo(_xPlus); x.CopyTo(_xMinus);
            _xPlus[k] += h; _xMinus[k] -= h;
            Jacobian(_xPlus, _jPlus, _fScratch);
            Jacobian(_xMinus, _jMinus, _fScratch);
            double inv = 0.5 / h;
            for (int j = 0; j < N; j++)
            {
                double s = 0;
                for (int i = 0; i < N; i++) s += phi[i] * (_jPlus[i * N + j] - _jMinus[i * N + j]);
                result[j * N + k] = s * inv;
            }
        }
        // Symmetrise: the exact Hessian is symmetric; averaging halves the difference error.
        for (int j = 0; j < N; j++)
            for (int k = j + 1; k < N; k++)
            {
                double m = 0.5 * (result[j * N + k] + result[k * N + j]);
                result[j * N + k] = m; result[k * N + j] = m;
            }
    }

    /// <summary>Copies the working parameter vector.</summary>
    public double[] CopyParameters() => (double[])P.Clone();
}

/// <summary>Small vector helpers on spans.</summary>
internal static class Vec
{
    public static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }

    public static double Norm2(ReadOnlySpan<double> a) => Math.Sqrt(Dot(a, a));

    public static double NormInf(ReadOnlySpan<double> a)
    {
        double m = 0;
        for (int i = 0; i < a.Length; i++)
        {
            double v = Math.Abs(a[i]);
            if (v > m || double.IsNaN(v)) m = v;
            if (double.IsNaN(m)) return double.NaN;
        }
        return m;
    }

    public static bool AllFinite(ReadOnlySpan<double> a)
    {
        for (int i = 0; i < a.Length; i++) if (!double.IsFinite(a[i])) return false;
        return true;
    }

    public static void Scale(Span<double> a, double s)
    {
        for (int i = 0; i < a.Length; i++) a[i] *= s;
    }

    /// <summary>row-major y = A x (A is rows × cols).</summary>
    public static void MatVec(ReadOnlySpan<double> a, int rows, int cols, ReadOnlySpan<double> x, Span<double> y)
    {
        for (int i = 0; i < rows; i++)
        {
            double s = 0;
            var row = a.Slice(i * cols, cols);
            for (int j = 0; j < cols; j++) s += row[j] * x[j];
            y[i] = s;
        }
    }

    /// <summary>row-major y = Aᵀ x (A is rows × cols, y has cols entries).</summary>
    public static void MatTVec(ReadOnlySpan<double> a, int rows, int cols, ReadOnlySpan<double> x, Span<double> y)
    {
        y[..cols].Clear();
        for (int i = 0; i < rows; i++)
        {
            double xi = x[i];
            if (xi == 0) continue;
            var row = a.Slice(i * cols, cols);
            for (int j = 0; j < cols; j++) y[j] += row[j] * xi;
        }
    }
}
