using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Thermostrat.Model.Numerics.Ode;

/// <summary>The shared step of every explicit Runge–Kutta tableau (<see cref="ExplicitTableau"/>), in FSAL form.</summary>
internal sealed class ExplicitRungeKuttaStepper : Stepper
{
    private readonly ExplicitTableau _tab;
    private readonly double[] _k;      // stages, flat: stage s at [s·n, s·n + n)
    private readonly double[] _stage;  // argument of the current stage; after a step, that of the second-to-last stage
    private readonly double[] _weights;
    private readonly double[] _error;  // the error estimate's vector, formed by the norm
    private readonly int _s;

    public ExplicitRungeKuttaStepper(ExplicitTableau tableau, int n, RhsFunction<double> f, WorkCounters counters) : base(n, f, counters)
    {
        _tab = tableau;
        _s = tableau.Stages;
        if (tableau.StiffnessStages is { } st && (st.First != _s - 2 || st.Second != _s - 1))
            throw new ArgumentException("The stiffness test expects the last two stages (whose arguments the stepper keeps).", nameof(tableau));
        _k = new double[_s * n];
        _stage = new double[n];
        _weights = new double[_s];
        _error = new double[n];
    }

    public override OdeMethod Method => _tab.Method;
    public override int ErrorOrder => _tab.ErrorOrder;
    public override int Order => _tab.Order;
    public override ReadOnlySpan<double> CurrentDerivative => _k.AsSpan(0, N);
    public override double StabilityBoundary => _tab.StiffnessStages is null ? double.NaN : _tab.StabilityBoundary;

    public override int Start(double t, ReadOnlySpan<double> y)
    {
        Span<double> k0 = _k.AsSpan(0, N);
        Evaluate(t, y, k0);
        return VectorOps.FirstNonFinite(k0);
    }

    // Kept out of the solver's loop: inlined there (through guarded devirtualisation) it shares one register allocation with
    // the whole loop and spills more; measured about 3 ns per step faster apart (bench/OdeBench.cs).
    [MethodImpl(MethodImplOptions.NoInlining)]
    public override TrialOutcome Attempt(double t, double h, ReadOnlySpan<double> y, Span<double> yNew, bool estimateError,
        ReadOnlySpan<double> atol, double rtol, out double errorSquared, out int badIndex)
    {
        int n = N;
        if (y.Length < n || yNew.Length < n) throw new ArgumentException("The state buffers are shorter than the system dimension.");
        // Everything the stage loop reads is held in locals: fields would be reloaded after every call of f.
        var k = _k.AsSpan();
        var tab = _tab;
        double[][] a = tab.A;
        double[] c = tab.C;
        Span<double> stage = _stage;
        RhsFunction<double> f = F;
        int last = _s - 1;
        ref double ry = ref MemoryMarshal.GetReference(y);
        ref double rk = ref MemoryMarshal.GetArrayDataReference(_k);
        for (int s = 1; s <= last; s++)
        {
            Span<double> arg = s == last ? yNew : stage;
            // The stage buffers were sized in the constructor and y, yNew checked above, so rows of up to eight terms (all the
            // tableaux here) take the unchecked pass; longer rows the checked one.
            if (s <= StageOps.MaxSizedTerms) StageOps.CombineSized(ref ry, h, a[s], s, ref rk, n, ref MemoryMarshal.GetReference(arg));
            else StageOps.Combine(y, h, a[s], s, k, n, arg);
            f(t + c[s] * h, arg, MemoryMarshal.CreateSpan(ref Unsafe.Add(ref rk, s * n), n));
        }
        Counters.FunctionEvaluations += last;
        errorSquared = estimateError && tab.E is not null
            ? StageOps.ErrorMeanSquare(h, tab.E, _s, k, n, y, yNew, atol, rtol, _error)
            : double.NaN;
        if (estimateError && tab.E is not null && double.IsFinite(errorSquared))
        {
            // A finite error norm implies every stage is finite (each enters the sum, zero weights included, and 0·∞ is NaN)
            // and so is yNew (the norm pass adds ŷ − ŷ, NaN for an overflowed component).
            badIndex = -1;
            return TrialOutcome.Computed;
        }
        badIndex = VectorOps.FirstNonFinite(yNew);
        if (badIndex < 0) badIndex = VectorOps.FirstNonFinite(k.Slice((_s - 1) * n, n));
        if (badIndex < 0 && estimateError && tab.E is not null)
        {
            // Stages non-finite but yNew and f(yNew) finite (a stage blew up): report the first bad stage component.
            for (int s = 1; s < _s - 1 && badIndex < 0; s++) badIndex = VectorOps.FirstNonFinite(k.Slice(s * n, n));
            if (badIndex < 0) return TrialOutcome.Computed; // the norm overflowed on finite data: a huge error, rejected by the loop
        }
        return badIndex < 0 ? TrialOutcome.Computed : TrialOutcome.NonFinite;
    }

    public override void Interpolate(double theta, double h, ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, Span<double> output)
    {
        var p = _tab.P;
        for (int s = 0; s < _s; s++)
        {
            double w = 0.0, pow = theta;
            var ps = p[s];
            for (int m = 0; m < ps.Length; m++) { w += ps[m] * pow; pow *= theta; }
            _weights[s] = w;
        }
        StageOps.Combine(y, h, _weights, _s, _k, N, output);
    }

    public override double StiffnessEstimate(double h, ReadOnlySpan<double> yNew)
    {
        if (_tab.StiffnessStages is not { } st) return double.NaN;
        // Hairer and Wanner II, Sect. IV.2 (eq. 2.26): with two stages at the same node, ‖f(y₂) − f(y₁)‖ / ‖y₂ − y₁‖ estimates
        // the dominant eigenvalue |λ|; here y₁ is the argument of stage First (kept in _stage) and y₂ = yNew (stage Second).
        int n = N;
        ReadOnlySpan<double> k1 = _k.AsSpan(st.First * n, n), k2 = _k.AsSpan(st.Second * n, n);
        ReadOnlySpan<double> y1 = _stage.AsSpan(0, n), y2 = yNew[..n];
        double num = 0.0, den = 0.0;
        int i = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count)
        {
            var vk1 = MemoryMarshal.Cast<double, Vector<double>>(k1);
            var vk2 = MemoryMarshal.Cast<double, Vector<double>>(k2);
            var vy1 = MemoryMarshal.Cast<double, Vector<double>>(y1);
            var vy2 = MemoryMarshal.Cast<double, Vector<double>>(y2);
            Vector<double> sf = Vector<double>.Zero, sy = Vector<double>.Zero;
            for (int v = 0; v < vk1.Length; v++)
            {
                var df = vk2[v] - vk1[v];
                var dy = vy2[v] - vy1[v];
                sf += df * df;
                sy += dy * dy;
            }
            num = Vector.Sum(sf);
            den = Vector.Sum(sy);
            i = vk1.Length * Vector<double>.Count;
        }
        for (; i < n; i++)
        {
            double df = k2[i] - k1[i], dy = y2[i] - y1[i];
            num += df * df;
            den += dy * dy;
        }
        return den > 0.0 ? h * Math.Sqrt(num / den) : 0.0;
    }

    public override void Accept(double tNew, ReadOnlySpan<double> yNew)
    {
        // FSAL: the last stage f(t + h, y_{n+1}) is the next step's first.
        _k.AsSpan((_s - 1) * N, N).CopyTo(_k.AsSpan(0, N));
    }
}
