namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// Euler–Maruyama, y_{n+1} = y_n + h f(t_n, y_n) + σ(t_n, y_n) ∘ ΔW_n with ΔW_n ~ N(0, h I) (Kloeden and Platen,
/// Numerical Solution of Stochastic Differential Equations, Springer 1992, Sect. 9.1). Fixed step; dense output is the
/// straight line between steps (the path between steps is not resolved).
/// </summary>
internal sealed class EulerMaruyamaStepper : Stepper
{
    private readonly IStochasticForcing _noise;
    private readonly double[] _f, _sigma;
    private GaussianSource _gauss;

    public EulerMaruyamaStepper(int n, RhsFunction<double> f, IStochasticForcing noise, ulong seed, WorkCounters counters) : base(n, f, counters)
    {
        _noise = noise;
        _f = new double[n];
        _sigma = new double[n];
        _gauss = new GaussianSource(seed);
    }

    public override OdeMethod Method => OdeMethod.EulerMaruyama;
    public override int ErrorOrder => 0;
    public override int Order => 1;
    public override ReadOnlySpan<double> CurrentDerivative => _f;

    public override int Start(double t, ReadOnlySpan<double> y)
    {
        Evaluate(t, y, _f);
        return VectorOps.FirstNonFinite(_f);
    }

    public override TrialOutcome Attempt(double t, double h, ReadOnlySpan<double> y, Span<double> yNew, bool estimateError,
        ReadOnlySpan<double> atol, double rtol, out double errorSquared, out int badIndex)
    {
        errorSquared = double.NaN;
        _noise.Diffusion(t, y, _sigma);
        double sqrtH = Math.Sqrt(h);
        for (int i = 0; i < N; i++)
            yNew[i] = y[i] + h * _f[i] + _sigma[i] * sqrtH * _gauss.NextGaussian();
        badIndex = VectorOps.FirstNonFinite(yNew);
        return badIndex < 0 ? TrialOutcome.Computed : TrialOutcome.NonFinite;
    }

    public override void Interpolate(double theta, double h, ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, Span<double> output)
    {
        for (int i = 0; i < N; i++) output[i] = y[i] + theta * (yNew[i] - y[i]);
    }

    public override void Accept(double tNew, ReadOnlySpan<double> yNew) => Evaluate(tNew, yNew, _f);
}
