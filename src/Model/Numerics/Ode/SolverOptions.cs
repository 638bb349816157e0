namespace Thermostrat.Model.Numerics.Ode;

/// <summary>How the stiff method obtains ∂f/∂y.</summary>
public enum JacobianSource
{
    /// <summary>Exactly, by forward-mode dual numbers (<see cref="AutoJacobian"/>): n dual evaluations per Jacobian.</summary>
    Automatic,
    /// <summary>By central differences (<see cref="FiniteDifferenceJacobian"/>): 2n + 1 evaluations, ≈ 1e-10 relative accuracy.
    /// Only for right-hand sides that drop derivatives (e.g. convert to <see cref="double"/> inside).</summary>
    FiniteDifference,
}

/// <summary>Settings of one <see cref="OdeSolver"/> run. Immutable; use <c>with</c> to vary.</summary>
/// <remarks>
/// Error control (adaptive methods): a step is accepted when the weighted RMS norm of the local error estimate,
/// √(1/n Σ (e_i / (atol_i + rtol·max(|y_i|, |ŷ_i|)))²), is at most 1 (Hairer, Nørsett and Wanner, Solving ODEs I, Sect. II.4).
/// </remarks>
public sealed record SolverOptions
{
    /// <summary>Integration method (default <see cref="OdeMethod.Auto"/>).</summary>
    public OdeMethod Method { get; init; } = OdeMethod.Auto;

    /// <summary>Relative tolerance rtol, in (0, 1) (default 1e-6).</summary>
    public double RelativeTolerance { get; init; } = 1e-6;

    /// <summary>Absolute tolerance atol for every component, in state units, &gt; 0 (default 1e-9). Overridden by <see cref="AbsoluteTolerances"/>.</summary>
    public double AbsoluteTolerance { get; init; } = 1e-9;

    /// <summary>Per-component absolute tolerances (length n, each &gt; 0), or null to use <see cref="AbsoluteTolerance"/> for all.</summary>
    public IReadOnlyList<double>? AbsoluteTolerances { get; init; }

    /// <summary>First step size (time units, &gt; 0), or null to choose it automatically (Hairer, Nørsett and Wanner I, Sect. II.4).</summary>
    public double? InitialStep { get; init; }

    /// <summary>
    /// Largest step size (time units, &gt; 0; default unbounded). Bound it to keep short-lived events from being stepped over, and,
    /// with <see cref="OdeMethod.Rodas4"/> on stiff problems, to keep interpolated output between steps as accurate as the step ends.
    /// </summary>
    public double MaxStep { get; init; } = double.PositiveInfinity;

    /// <summary>Most step attempts (accepted and rejected) before the solve fails with <see cref="OdeFailureKind.TooManySteps"/> (default 10 000 000).</summary>
    public long MaxSteps { get; init; } = 10_000_000;

    /// <summary>
    /// Constant step size (time units, &gt; 0). Required by <see cref="OdeMethod.RungeKutta4"/> and <see cref="OdeMethod.EulerMaruyama"/>;
    /// with an adaptive method it switches error control off (for convergence studies). The last step is shortened to end at tEnd.
    /// </summary>
    public double? FixedStep { get; init; }

    /// <summary>Output schedule (default every accepted step).</summary>
    public OutputTimes Output { get; init; } = OutputTimes.EveryStep;

    /// <summary>Absolute tolerance on located event times (time units, &gt; 0; default 1e-12; never finer than 4 ulp of t).</summary>
    public double EventTimeTolerance { get; init; } = 1e-12;

    /// <summary>
    /// Declares that f does not depend on t explicitly, so the stiff method skips its ∂f/∂t estimate (one function evaluation per step).
    /// Default false: ∂f/∂t is estimated by a forward difference, as in Hairer and Wanner's RODAS code.
    /// </summary>
    public bool IsAutonomous { get; init; }

    /// <summary>How the stiff method gets the Jacobian (default exact, by dual numbers).</summary>
    public JacobianSource Jacobian { get; init; } = JacobianSource.Automatic;

    /// <summary>Noise for <see cref="OdeMethod.EulerMaruyama"/> (required there, ignored otherwise).</summary>
    public IStochasticForcing? Noise { get; init; }

    /// <summary>Seed of the Wiener increments of <see cref="OdeMethod.EulerMaruyama"/>: equal seeds give identical paths on every platform.</summary>
    public ulong Seed { get; init; }

    internal static bool IsAdaptive(OdeMethod m) => m is OdeMethod.Auto or OdeMethod.DormandPrince54 or OdeMethod.BogackiShampine32 or OdeMethod.Rodas4;

    /// <summary>Checks the options against a system of dimension <paramref name="dimension"/> and the interval [t0, tEnd]; throws naming the bad setting.</summary>
    internal void Validate(int dimension, double t0, double tEnd)
    {
        if (!Enum.IsDefined(Method))
            throw new ArgumentOutOfRangeException(nameof(Method), Method, $"Unknown method; allowed: {string.Join(", ", Enum.GetNames<OdeMethod>())}.");
        if (!(RelativeTolerance > 0 && RelativeTolerance < 1))
            throw new ArgumentOutOfRangeException(nameof(RelativeTolerance), RelativeTolerance, "RelativeTolerance must be in (0, 1).");
        if (RelativeTolerance < 1e-14)
            throw new ArgumentOutOfRangeException(nameof(RelativeTolerance), RelativeTolerance, "RelativeTolerance below 1e-14 is beneath double-precision rounding; use at least 1e-14.");
        if (AbsoluteTolerances is null)
        {
            if (!(AbsoluteTolerance > 0) || !double.IsFinite(AbsoluteTolerance))
                throw new ArgumentOutOfRangeException(nameof(AbsoluteTolerance), AbsoluteTolerance, "AbsoluteTolerance must be positive and finite (state units).");
        }
        else
        {
            if (AbsoluteTolerances.Count != dimension)
                throw new ArgumentException($"AbsoluteTolerances has {AbsoluteTolerances.Count} entries; the system has {dimension} components.", nameof(AbsoluteTolerances));
            for (int i = 0; i < dimension; i++)
                if (!(AbsoluteTolerances[i] > 0) || !double.IsFinite(AbsoluteTolerances[i]))
                    throw new ArgumentOutOfRangeException(nameof(AbsoluteTolerances), AbsoluteTolerances[i], $"AbsoluteTolerances[{i}] must be positive and finite.");
        }
        if (InitialStep is { } h0 && (!(h0 > 0) || !double.IsFinite(h0)))
            throw new ArgumentOutOfRangeException(nameof(InitialStep), h0, "InitialStep must be a positive finite time, or null for automatic.");
        if (!(MaxStep > 0))
            throw new ArgumentOutOfRangeException(nameof(MaxStep), MaxStep, "MaxStep must be positive (or +∞).");
        if (MaxSteps < 1)
            throw new ArgumentOutOfRangeException(nameof(MaxSteps), MaxSteps, "MaxSteps must be at least 1.");
        if (FixedStep is { } hf && (!(hf > 0) || !double.IsFinite(hf)))
            throw new ArgumentOutOfRangeException(nameof(FixedStep), hf, "FixedStep must be a positive finite time, or null for adaptive stepping.");
        if (FixedStep is null && Method is OdeMethod.RungeKutta4 or OdeMethod.EulerMaruyama)
            throw new ArgumentException($"Method {Method} is fixed-step: set FixedStep to a positive step size.", nameof(FixedStep));
        if (FixedStep is not null && Method is OdeMethod.Auto)
            throw new ArgumentException("Method Auto needs adaptive stepping to detect stiffness; with FixedStep choose DormandPrince54, BogackiShampine32, Rodas4, RungeKutta4 or EulerMaruyama.", nameof(FixedStep));
        if (Method is OdeMethod.EulerMaruyama && Noise is null)
            throw new ArgumentException("Method EulerMaruyama needs Noise (an IStochasticForcing giving σ(t, y)).", nameof(Noise));
        if (!(EventTimeTolerance > 0) || !double.IsFinite(EventTimeTolerance))
            throw new ArgumentOutOfRangeException(nameof(EventTimeTolerance), EventTimeTolerance, "EventTimeTolerance must be a positive finite time.");
        if (!Enum.IsDefined(Jacobian))
            throw new ArgumentOutOfRangeException(nameof(Jacobian), Jacobian, "Unknown Jacobian source; allowed: Automatic, FiniteDifference.");
        ArgumentNullException.ThrowIfNull(Output, nameof(Output));
        if (Output.Mode == OutputMode.List)
        {
            var times = Output.ListedTimes;
            if (times.Length > 0 && (times[0] < t0 || times[^1] > tEnd))
                throw new ArgumentException($"Output times must lie in [t0, tEnd] = [{t0:R}, {tEnd:R}]; got [{times[0]:R}, {times[^1]:R}].", nameof(Output));
        }
    }
}
