namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// The step of a Rosenbrock–Wanner method (<see cref="RosenbrockTableau"/>): one Jacobian and ∂f/∂t per step (kept across
/// rejections), one LU factorisation of I/(hγ) − J per attempt (<see cref="ColumnMajorLu"/>), one substitution per stage.
/// </summary>
internal sealed class RosenbrockStepper : Stepper
{
    /// <summary>Relative size of the forward difference for ∂f/∂t, δ = √(u·max(1e-5, |t|)) as in Hairer and Wanner's RODAS code.</summary>
    private const double TimeDifferenceFloor = 1e-5;

    /// <summary>Machine epsilon 2^-52 of <see cref="double"/>.</summary>
    private const double MachineEpsilon = 2.220446049250313e-16;

    private readonly RosenbrockTableau _tab;
    private readonly RhsFunction<Dual>? _dualF;
    private readonly bool _autonomous;
    private readonly double[] _jac, _w, _invDiag, _u, _arg, _fx, _ft, _scratch, _dense;
    private readonly int[] _pivots;
    private readonly Dual[] _yd, _fd;
    private bool _jacobianCurrent;
    private bool _denseReady;
    private readonly int _s;

    public RosenbrockStepper(RosenbrockTableau tableau, int n, RhsFunction<double> f, RhsFunction<Dual>? dualF, bool autonomous, WorkCounters counters)
        : base(n, f, counters)
    {
        _tab = tableau;
        _s = tableau.Stages;
        _dualF = dualF;
        _autonomous = autonomous;
        _jac = new double[n * n];
        _w = new double[n * n];
        _pivots = new int[n];
        _u = new double[_s * n];
        _arg = new double[n];
        _invDiag = new double[n];
        _fx = new double[n];
        _ft = new double[n];
        _scratch = new double[3 * n];
        _dense = new double[2 * n];
        _yd = dualF is null ? [] : new Dual[n];
        _fd = dualF is null ? [] : new Dual[n];
    }

    public override OdeMethod Method => _tab.Method;
    public override int ErrorOrder => _tab.ErrorOrder;
    public override int Order => _tab.Order;
    public override ReadOnlySpan<double> CurrentDerivative => _fx;

    public override int Start(double t, ReadOnlySpan<double> y)
    {
        Evaluate(t, y, _fx);
        _jacobianCurrent = false;
        return VectorOps.FirstNonFinite(_fx);
    }

    /// <summary>J = ∂f/∂y, f and ∂f/∂t at (t, y).</summary>
    private void Linearise(double t, ReadOnlySpan<double> y)
    {
        int n = N;
        if (_dualF is { } df)
        {
            var yd = _yd.AsSpan();
            var fd = _fd.AsSpan();
            for (int k = 0; k < n; k++) yd[k] = new Dual(y[k], 0.0);
            for (int j = 0; j < n; j++)
            {
                yd[j] = new Dual(y[j], 1.0);
                df(t, yd, fd);
                yd[j] = new Dual(y[j], 0.0);
                for (int i = 0; i < n; i++) _jac[j * n + i] = fd[i].Derivative; // column-major: column j is ∂f/∂y_j
            }
            if (n > 0)
                for (int i = 0; i < n; i++) _fx[i] = fd[i].Value;
        }
        else
        {
            // Central differences, as FiniteDifferenceJacobian (Dennis and Schnabel, Sect. 5.6).
            Span<double> yp = _scratch.AsSpan(0, n), fp = _scratch.AsSpan(n, n), fm = _scratch.AsSpan(2 * n, n);
            y.CopyTo(yp);
            for (int j = 0; j < n; j++)
            {
                double yj = y[j];
                double h = 6.055454452393343e-06 * Math.Max(Math.Abs(yj), 1.0); // (2^-52)^(1/3)
                double up = yj + h, down = yj - h;
                yp[j] = up;
                Evaluate(t, yp, fp);
                yp[j] = down;
                Evaluate(t, yp, fm);
                yp[j] = yj;
                double span = up - down;
                for (int i = 0; i < n; i++) _jac[j * n + i] = (fp[i] - fm[i]) / span;
            }
        }
        Counters.JacobianEvaluations++;
        if (_autonomous)
        {
            Array.Clear(_ft);
        }
        else
        {
            double delta = Math.Sqrt(MachineEpsilon * Math.Max(TimeDifferenceFloor, Math.Abs(t)));
            Span<double> f1 = _scratch.AsSpan(0, n);
            Evaluate(t + delta, y, f1);
            for (int i = 0; i < n; i++) _ft[i] = (f1[i] - _fx[i]) / delta;
        }
        _jacobianCurrent = true;
    }

    public override TrialOutcome Attempt(double t, double h, ReadOnlySpan<double> y, Span<double> yNew, bool estimateError,
        ReadOnlySpan<double> atol, double rtol, out double errorSquared, out int badIndex)
    {
        int n = N;
        errorSquared = double.NaN;
        badIndex = -1;
        _denseReady = false;
        if (!_jacobianCurrent)
        {
            Linearise(t, y);
            int bad = VectorOps.FirstNonFinite(_jac);
            if (bad >= 0) { badIndex = bad % n; return TrialOutcome.NonFinite; } // row i of column-major J[i + j·n]
            bad = VectorOps.FirstNonFinite(_ft);
            if (bad >= 0) { badIndex = bad; return TrialOutcome.NonFinite; }
        }

        // W = I/(hγ) − J (column-major, like J), factored.
        double diag = 1.0 / (h * _tab.Gamma);
        var w = _w.AsSpan();
        for (int i = 0; i < n * n; i++) w[i] = -_jac[i];
        for (int i = 0; i < n; i++) w[i * n + i] += diag;
        Counters.LuFactorizations++;
        if (!ColumnMajorLu.Factor(w, n, _pivots, _invDiag)) return TrialOutcome.Singular;

        var tab = _tab;
        var u = _u.AsSpan();
        double invH = 1.0 / h;
        for (int s = 0; s < _s; s++)
        {
            // U_s ← f(t + α_s h, y + Σ a_sj U_j) + (1/h) Σ c_sj U_j + h γ_s ∂f/∂t, then solved in place.
            var us = u.Slice(s * n, n);
            if (s == 0)
            {
                _fx.CopyTo(us);
            }
            else
            {
                StageOps.Combine(y, 1.0, tab.A[s], s, u, n, _arg);
                Evaluate(t + tab.Alpha[s] * h, _arg, us);
                // Name the component of f that failed, before the linear solve spreads the NaN over every component.
                badIndex = VectorOps.FirstNonFinite(us);
                if (badIndex >= 0) return TrialOutcome.NonFinite;
                StageOps.Combine(us, invH, tab.C[s], s, u, n, us);
            }
            double g = h * tab.GammaSum[s];
            if (g != 0.0 && !_autonomous) VectorOps.Axpy(g, _ft, us);
            ColumnMajorLu.Solve(w, n, _pivots, _invDiag, us);
            Counters.LinearSolves++;
        }
        StageOps.Combine(y, 1.0, tab.M, _s, u, n, yNew);
        badIndex = VectorOps.FirstNonFinite(yNew);
        if (badIndex >= 0) return TrialOutcome.NonFinite;
        if (estimateError)
        {
            errorSquared = StageOps.ErrorMeanSquare(1.0, tab.E, _s, u, n, y, yNew, atol, rtol, _scratch);
            if (double.IsNaN(errorSquared))
            {
                for (int s = 0; s < _s && badIndex < 0; s++) badIndex = VectorOps.FirstNonFinite(u.Slice(s * n, n));
                return TrialOutcome.NonFinite;
            }
        }
        return TrialOutcome.Computed;
    }

    public override void Interpolate(double theta, double h, ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, Span<double> output)
    {
        int n = N;
        if (!_denseReady)
        {
            Span<double> zero = _scratch.AsSpan(0, n);
            zero.Clear();
            StageOps.Combine(zero, 1.0, _tab.H[0], _s, _u, n, _dense.AsSpan(0, n));
            StageOps.Combine(zero, 1.0, _tab.H[1], _s, _u, n, _dense.AsSpan(n, n));
            _denseReady = true;
        }
        ReadOnlySpan<double> k0 = _dense.AsSpan(0, n), k1 = _dense.AsSpan(n, n);
        double s1 = 1.0 - theta;
        for (int i = 0; i < n; i++)
            output[i] = s1 * y[i] + theta * (yNew[i] + s1 * (k0[i] + theta * k1[i]));
    }

    public override void Accept(double tNew, ReadOnlySpan<double> yNew)
    {
        // The next attempt linearises at the new point (its f comes with the Jacobian when it is exact).
        _jacobianCurrent = false;
        if (_dualF is null) Evaluate(tNew, yNew, _fx);
    }
}
