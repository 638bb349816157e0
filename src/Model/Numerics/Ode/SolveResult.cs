namespace Thermostrat.Model.Numerics.Ode;

/// <summary>Work counters of a solve.</summary>
/// <param name="AcceptedSteps">Steps accepted.</param>
/// <param name="RejectedSteps">Steps rejected by error control, a non-finite trial or a singular iteration matrix.</param>
/// <param name="FunctionEvaluations">Evaluations of f on <see cref="double"/> (including the ∂f/∂t difference and the initial-step estimate).</param>
/// <param name="JacobianEvaluations">Jacobians formed (each costs n dual evaluations, or 2n + 1 evaluations by differences, not counted above).</param>
/// <param name="LuFactorizations">LU factorisations of the iteration matrix.</param>
/// <param name="LinearSolves">Forward/back substitutions with those factors.</param>
/// <param name="EventEvaluations">Evaluations of event functions.</param>
public readonly record struct OdeStatistics(
    long AcceptedSteps,
    long RejectedSteps,
    long FunctionEvaluations,
    long JacobianEvaluations,
    long LuFactorizations,
    long LinearSolves,
    long EventEvaluations);

/// <summary>How a solve ended.</summary>
public enum SolveStatus
{
    /// <summary>Reached tEnd.</summary>
    Completed,
    /// <summary>Stopped at a terminal event.</summary>
    TerminatedByEvent,
}

/// <summary>A change of method during an <see cref="OdeMethod.Auto"/> solve.</summary>
/// <param name="Time">When the switch happened.</param>
/// <param name="From">Method before.</param>
/// <param name="To">Method after.</param>
/// <param name="Reason">Why, in words (the stiffness estimate).</param>
public sealed record MethodSwitch(double Time, OdeMethod From, OdeMethod To, string Reason);

/// <summary>The outcome of <see cref="OdeSolver.Solve(IOdeSystem, double, ReadOnlySpan{double}, double, SolverOptions, IOutputSink?, IReadOnlyList{OdeEvent}?)"/>.</summary>
public sealed class SolveResult
{
    internal SolveResult(SolveStatus status, double finalTime, double[] finalState, OdeMethod requested, OdeMethod final,
        OdeStatistics statistics, IReadOnlyList<EventOccurrence> events, double? stiffnessDetectedAt, IReadOnlyList<MethodSwitch> switches, double lastStep)
    {
        Status = status;
        FinalTime = finalTime;
        FinalState = finalState;
        RequestedMethod = requested;
        FinalMethod = final;
        Statistics = statistics;
        Events = events;
        StiffnessDetectedAt = stiffnessDetectedAt;
        MethodSwitches = switches;
        LastStepSize = lastStep;
    }

    /// <summary>Completed or stopped by a terminal event.</summary>
    public SolveStatus Status { get; }

    /// <summary>tEnd, or the time of the terminal event.</summary>
    public double FinalTime { get; }

    /// <summary>The state at <see cref="FinalTime"/>.</summary>
    public IReadOnlyList<double> FinalState { get; }

    /// <summary>The method asked for.</summary>
    public OdeMethod RequestedMethod { get; }

    /// <summary>The method in use at the end (differs from <see cref="RequestedMethod"/> after an automatic switch).</summary>
    public OdeMethod FinalMethod { get; }

    /// <summary>Work counters.</summary>
    public OdeStatistics Statistics { get; }

    /// <summary>Located events, in time order (the terminal one last).</summary>
    public IReadOnlyList<EventOccurrence> Events { get; }

    /// <summary>
    /// For <see cref="OdeMethod.DormandPrince54"/> and <see cref="OdeMethod.Auto"/>: the first time the Hairer–Wanner test found the
    /// problem stiff (step size limited by stability, not accuracy), or null. With DormandPrince54 it is advice to switch to
    /// <see cref="OdeMethod.Rodas4"/>; with Auto the switch was made.
    /// </summary>
    public double? StiffnessDetectedAt { get; }

    /// <summary>Method changes made by <see cref="OdeMethod.Auto"/>.</summary>
    public IReadOnlyList<MethodSwitch> MethodSwitches { get; }

    /// <summary>The last accepted step size (time units).</summary>
    public double LastStepSize { get; }
}
