using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// Integrates <paramref name="system"/> from <paramref name="startTime"/> to <paramref name="endTime"/>,
/// overwriting <paramref name="state"/> with the end state. Analysis code is written against this
/// delegate so that any of the library's ODE solvers (or a test's reference integrator) can drive it.
/// </summary>
/// <param name="system">The right-hand side (parameters already fixed or ramped by the caller).</param>
/// <param name="startTime">Start time, in the system's time unit.</param>
/// <param name="endTime">End time (after <paramref name="startTime"/>).</param>
/// <param name="state">Initial state in, end state out.</param>
public delegate void TransientIntegrator(IOdeSystem system, double startTime, double endTime, Span<double> state);

/// <summary>A scalar quantity computed from a state (for example a ventilation transport in Sv).</summary>
public delegate double StateDiagnostic(ReadOnlySpan<double> state);

/// <summary>A yes/no test of a state (for example "the overturning has collapsed").</summary>
public delegate bool StatePredicate(ReadOnlySpan<double> state);

/// <summary>
/// Checks whether a state lies where the model is valid (for example inside an equation of
/// state's range). Returns <see langword="null"/> when valid, otherwise a message saying what is out of range.
/// </summary>
public delegate string? StateValidator(ReadOnlySpan<double> state, ReadOnlySpan<double> parameters);

/// <summary>
/// An <see cref="IOdeSystem"/> view of a parametric system with its parameters fixed at given values,
/// optionally with one of them ramped linearly in time: p_k(t) = start + rate·(t − t0).
/// </summary>
/// <remarks>Keeps a parameter buffer for <see cref="double"/> and one for the last other number type; not thread-safe (one per run).</remarks>
public sealed class ParameterOverrideSystem : IOdeSystem
{
    private readonly IParametricSystem _inner;
    private readonly double[] _p;
    private readonly int _rampIndex;
    private readonly double _rampStart, _rampRate, _rampStartTime;
    private readonly double[] _doubles;
    private object? _other;

    /// <summary>A view with all parameters fixed at <paramref name="parameters"/>.</summary>
    public ParameterOverrideSystem(IParametricSystem inner, ReadOnlySpan<double> parameters)
        : this(inner, parameters, -1, 0, 0, 0) { }

    /// <summary>A view with parameter <paramref name="rampIndex"/> ramped: p(t) = <paramref name="rampStart"/> + <paramref name="rampRate"/>·(t − <paramref name="rampStartTime"/>).</summary>
    public ParameterOverrideSystem(IParametricSystem inner, ReadOnlySpan<double> parameters, int rampIndex, double rampStart, double rampRate, double rampStartTime)
    {
        ArgumentNullException.ThrowIfNull(inner);
        if (parameters.Length != inner.ParameterCount)
            throw new ArgumentException($"Got {parameters.Length} parameter values; the system has {inner.ParameterCount} parameters.", nameof(parameters));
        if (rampIndex >= inner.ParameterCount)
            throw new ArgumentOutOfRangeException(nameof(rampIndex), rampIndex, $"The system has {inner.ParameterCount} parameters.");
        _inner = inner;
        _p = parameters.ToArray();
        _doubles = parameters.ToArray();
        _rampIndex = rampIndex;
        _rampStart = rampStart;
        _rampRate = rampRate;
        _rampStartTime = rampStartTime;
    }

    /// <inheritdoc />
    public int Dimension => _inner.Dimension;

    /// <summary>The value of the ramped parameter at time <paramref name="t"/> (or NaN without a ramp).</summary>
    public double RampValue(double t) => _rampIndex < 0 ? double.NaN : _rampStart + _rampRate * (t - _rampStartTime);

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, System.Numerics.IFloatingPointIeee754<T>
    {
        // One buffer for double and one for the other number type in use (dual numbers for Jacobians), so that
        // solvers alternating between the two do not reallocate.
        T[] p;
        if (typeof(T) == typeof(double)) p = (T[])(object)_doubles;
        else if (_other is T[] cached) p = cached;
        else
        {
            p = new T[_p.Length];
            for (int i = 0; i < p.Length; i++) p[i] = T.CreateChecked(_p[i]);
            _other = p;
        }
        if (_rampIndex >= 0) p[_rampIndex] = T.CreateChecked(RampValue(t));
        _inner.Evaluate(t, y, (ReadOnlySpan<T>)p, dydt);
    }
}

/// <summary>Ready-made <see cref="TransientIntegrator"/>s.</summary>
public static class TransientIntegrators
{
    /// <summary>
    /// An integrator backed by the library's <see cref="Numerics.Ode.OdeSolver"/> with <paramref name="options"/>
    /// (its output schedule is replaced by final-state-only; events are not used).
    /// </summary>
    public static TransientIntegrator FromSolver(Numerics.Ode.SolverOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var final = options with { Output = Numerics.Ode.OutputTimes.FinalOnly };
        return (system, startTime, endTime, state) =>
        {
            if (!(endTime > startTime)) return;
            var result = Numerics.Ode.OdeSolver.Solve(system, startTime, state, endTime, final);
            for (int i = 0; i < state.Length; i++) state[i] = result.FinalState[i];
        };
    }

    /// <summary>The default: automatic non-stiff/stiff switching (Dormand–Prince 5(4) / RODAS4), relative tolerance 1e-8, absolute 1e-10.</summary>
    public static TransientIntegrator Default { get; } = FromSolver(new Numerics.Ode.SolverOptions
    {
        Method = Numerics.Ode.OdeMethod.Auto,
        RelativeTolerance = 1e-8,
        AbsoluteTolerance = 1e-10,
    });
}
