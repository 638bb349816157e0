using Thermostrat.Model.Configuration;
using Thermostrat.Model.Numerics.Ode;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>Integration method of a run.</summary>
public enum RunMethod
{
    /// <summary>Dormand–Prince 5(4), switching to RODAS4 when the problem turns out stiff (the default).</summary>
    Auto,
    /// <summary>Dormand–Prince 5(4) throughout (non-stiff: seasonal cycle, interannual oscillations).</summary>
    DormandPrince54,
    /// <summary>Bogacki–Shampine 3(2) (cheap at loose tolerances).</summary>
    BogackiShampine32,
    /// <summary>RODAS4 Rosenbrock method with exact Jacobians (stiff: long runs with annual-mean forcing).</summary>
    Rodas4,
}

/// <summary>How a run is integrated and recorded (configuration section "Run").</summary>
public sealed class RunOptions : ISelfValidating
{
    /// <summary>Length of the run.</summary>
    [Parameter("yr", "length of the run", Source = "common practice", Min = 0, MinExclusive = true, Max = 1e8)]
    public double DurationYears { get; set; } = 10000.0;

    /// <summary>Age at the start of the run (ka before 1950, positive into the past; negative = future).</summary>
    [Parameter("ka", "age at the start of the run (thousands of years before 1950)", Source = "common practice (present day)", Min = -5000, Max = 1e5)]
    public double StartAgeKa { get; set; }

    /// <summary>Spacing of the output rows.</summary>
    [Parameter("yr", "spacing of the output rows", Source = "common practice", Min = 0, MinExclusive = true, Max = 1e7)]
    public double OutputIntervalYears { get; set; } = 10.0;

    /// <summary>
    /// Samples averaged into each output row (1: the instantaneous state at the output time; n &gt; 1: the mean of n
    /// equally spaced samples over the interval ending at the output time, e.g. annual means of a seasonal run).
    /// </summary>
    [Parameter("1", "samples averaged into each output row (1: instantaneous)", Source = "common practice", Min = 1, Max = 10000)]
    public int SamplesPerOutput { get; set; } = 1;

    /// <summary>Integration method.</summary>
    [Parameter("", "integration method: Auto | DormandPrince54 | BogackiShampine32 | Rodas4")]
    public RunMethod Method { get; set; } = RunMethod.Auto;

    /// <summary>Relative tolerance of the error control.</summary>
    [Parameter("1", "relative tolerance of the step-size control", Source = "common practice", Min = 1e-12, Max = 0.1)]
    public double RelativeTolerance { get; set; } = 1e-6;

    /// <summary>Absolute tolerance (state units: K, g/kg, m).</summary>
    [Parameter("state units", "absolute tolerance of the step-size control", Source = "common practice", Min = 0, MinExclusive = true, Max = 1)]
    public double AbsoluteTolerance { get; set; } = 1e-8;

    /// <summary>Largest step (absent: unbounded).</summary>
    [Parameter("yr", "largest integration step (absent: unbounded)", Source = "common practice", Min = 0, MinExclusive = true, Max = 1e7)]
    public double? MaxStepYears { get; set; }

    /// <inheritdoc/>
    public IEnumerable<string> Validate(string path)
    {
        if (OutputIntervalYears > DurationYears)
            yield return $"{path}:OutputIntervalYears = {OutputIntervalYears} exceeds {path}:DurationYears = {DurationYears}; allowed: an interval no longer than the run";
    }

    /// <summary>The ODE solver options for this run.</summary>
    public SolverOptions ToSolverOptions() => new()
    {
        Method = Method switch
        {
            RunMethod.DormandPrince54 => OdeMethod.DormandPrince54,
            RunMethod.BogackiShampine32 => OdeMethod.BogackiShampine32,
            RunMethod.Rodas4 => OdeMethod.Rodas4,
            _ => OdeMethod.Auto,
        },
        RelativeTolerance = RelativeTolerance,
        AbsoluteTolerance = AbsoluteTolerance,
        MaxStep = MaxStepYears ?? double.PositiveInfinity,
        Output = OutputTimes.Uniform(OutputIntervalYears / SamplesPerOutput),
    };
}
