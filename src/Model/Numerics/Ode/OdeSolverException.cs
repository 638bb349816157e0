namespace Thermostrat.Model.Numerics.Ode;

/// <summary>Why an integration failed.</summary>
public enum OdeFailureKind
{
    /// <summary>The state or its derivative became NaN or infinite and shrinking the step did not help (or the start was already non-finite).</summary>
    NonFiniteState,
    /// <summary>The step size fell below a few ulp of t: a singularity, a discontinuity too sharp for the tolerance, or an unattainable tolerance.</summary>
    StepSizeUnderflow,
    /// <summary><see cref="SolverOptions.MaxSteps"/> step attempts were used before tEnd.</summary>
    TooManySteps,
    /// <summary>The stiff method's iteration matrix I/(hγ) − J stayed singular after repeated step reductions.</summary>
    SingularMatrix,
}

/// <summary>An integration that could not be completed, with its diagnosis: what failed, where and when, and the last good state.</summary>
public sealed class OdeSolverException : Exception
{
    internal OdeSolverException(OdeFailureKind kind, string message, double time, double stepSize, int variableIndex, double lastGoodTime, double[] lastGoodState, OdeStatistics statistics)
        : base(message)
    {
        Kind = kind;
        Time = time;
        StepSize = stepSize;
        VariableIndex = variableIndex;
        LastGoodTime = lastGoodTime;
        LastGoodState = lastGoodState;
        Statistics = statistics;
    }

    /// <summary>What failed.</summary>
    public OdeFailureKind Kind { get; }

    /// <summary>The time at which the failure was detected (the start of the failing step, or the time of the non-finite trial).</summary>
    public double Time { get; }

    /// <summary>The step size of the failing attempt.</summary>
    public double StepSize { get; }

    /// <summary>For <see cref="OdeFailureKind.NonFiniteState"/>: the first non-finite component; otherwise −1.</summary>
    public int VariableIndex { get; }

    /// <summary>The last accepted time.</summary>
    public double LastGoodTime { get; }

    /// <summary>The last accepted state.</summary>
    public IReadOnlyList<double> LastGoodState { get; }

    /// <summary>Work done up to the failure.</summary>
    public OdeStatistics Statistics { get; }
}
