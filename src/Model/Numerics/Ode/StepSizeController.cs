namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// Step-size control from the error norm err of each attempt (err ≤ 1 accepts), with k = ErrorOrder + 1. The controller
/// receives err², the mean square the steppers compute, so that no square root stands between the last stage and the
/// next step size: powers of err are taken as powers of err² with halved exponents.
/// </summary>
/// <remarks>
/// <para>Explicit methods: the PI controller h_new = h · safety · err_n^(−α) · err_{n−1}^β with α = 1/k − 0.75β,
/// β = 0.2/k (Gustafsson 1991, ACM TOMS 17, 533; Hairer and Wanner II, Sect. IV.2 — β = 0.04 for DOPRI5 as in its code),
/// which damps the step-size oscillation of the plain controller when stability limits the step.</para>
/// <para>Rosenbrock: Gustafsson's predictive controller (Hairer and Wanner II, Sect. IV.8, eq. 8.21 and the RODAS code):
/// the smaller of the standard step safety · err^(−1/k) · h and the predictive step
/// safety · (h_n/h_{n−1}) · (err_{n−1}/err_n²)^(1/k) · h_n.</para>
/// <para>After a rejection the step is reduced by safety · err^(−1/k) (at least by <see cref="MinFactor"/>) and the following
/// accepted step may not grow.</para>
/// </remarks>
internal sealed class StepSizeController
{
    /// <summary>Aim below the error the formula predicts, so that the next step is likely accepted (common practice, 0.9).</summary>
    private const double Safety = 0.9;

    /// <summary>Never shrink by more than 5× per attempt: the error model is asymptotic and distrusts large extrapolation.</summary>
    private const double MinFactor = 0.2;

    /// <summary>Never grow by more than 10× (explicit, as DOPRI5 and SciPy) or 6× (Rosenbrock, as RODAS) per step.</summary>
    private const double MaxFactorExplicit = 10.0, MaxFactorRosenbrock = 6.0;

    /// <summary>Floor on the remembered error, so one nearly exact step does not trigger an overlong next step (DOPRI5: 1e-4; RODAS: 1e-2).</summary>
    private const double ErrorFloorExplicit = 1e-4, ErrorFloorRosenbrock = 1e-2;

    /// <summary>Floor on err itself before its logarithm or root is taken (err = 0 takes the largest factor).</summary>
    private const double TinyError = 1e-16;

    private readonly bool _predictive;
    private readonly double _k, _alpha, _beta, _maxFactor;
    private double _errOldSq, _logErrSqOld, _hOld;
    private bool _lastRejected, _hasHistory;

    public StepSizeController(int errorOrder, bool predictive)
    {
        _predictive = predictive;
        _k = errorOrder + 1;
        _beta = predictive ? 0.0 : 0.2 / _k;
        _alpha = 1.0 / _k - 0.75 * _beta;
        _maxFactor = predictive ? MaxFactorRosenbrock : MaxFactorExplicit;
        double floor = predictive ? ErrorFloorRosenbrock : ErrorFloorExplicit;
        _errOldSq = floor * floor;
        _logErrSqOld = Math.Log(_errOldSq);
    }

    /// <summary>err^(1/k) from x = err², i.e. x^(1/(2k)); the common k = 4 by three square roots (cheaper than <see cref="Math.Pow"/>).</summary>
    private double RootOfSquare(double x) => _k == 4 ? Math.Sqrt(Math.Sqrt(Math.Sqrt(x))) : Math.Pow(x, 0.5 / _k);

    /// <summary>Next step size after accepting a step of size h whose error norm is √<paramref name="errSquared"/>.</summary>
    public double Accepted(double h, double errSquared)
    {
        double factor;
        if (_predictive)
        {
            double eSq = Math.Max(errSquared, TinyError * TinyError);
            factor = Safety / RootOfSquare(eSq);
            if (_hasHistory)
            {
                // (err_old / err²)^(1/k) = (err_old² / err⁴)^(1/(2k)).
                double predictive = Safety * (h / _hOld) * RootOfSquare(_errOldSq / (eSq * eSq));
                factor = Math.Min(factor, predictive);
            }
            _errOldSq = Math.Max(ErrorFloorRosenbrock * ErrorFloorRosenbrock, errSquared);
        }
        else
        {
            // err^(−α)·err_old^β = exp(−(α/2) ln err² + (β/2) ln err_old²); the remembered logarithm is kept from the previous step.
            const double floorSq = ErrorFloorExplicit * ErrorFloorExplicit;
            double logErrSq = Math.Log(Math.Max(errSquared, TinyError * TinyError));
            factor = errSquared == 0.0 ? _maxFactor : Safety * Math.Exp(0.5 * (-_alpha * logErrSq + _beta * _logErrSqOld));
            _logErrSqOld = errSquared > floorSq ? logErrSq : Math.Log(floorSq);
        }
        factor = Math.Clamp(factor, MinFactor, _maxFactor);
        if (_lastRejected) factor = Math.Min(factor, 1.0);
        _lastRejected = false;
        _hOld = h;
        _hasHistory = true;
        return h * factor;
    }

    /// <summary>Step size to retry with after rejecting a step of size h whose error norm is √<paramref name="errSquared"/> &gt; 1.</summary>
    public double Rejected(double h, double errSquared)
    {
        _lastRejected = true;
        double factor = double.IsFinite(errSquared) ? Safety / RootOfSquare(errSquared) : MinFactor;
        return h * Math.Clamp(factor, MinFactor, 1.0);
    }
}
