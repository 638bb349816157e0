namespace Thermostrat.Model.Analysis;

/// <summary>Which way to trace from the starting point.</summary>
public enum ContinuationDirection
{
    /// <summary>Start in the direction of increasing parameter.</summary>
    Increasing,
    /// <summary>Start in the direction of decreasing parameter.</summary>
    Decreasing,
    /// <summary>Trace both ways from the start.</summary>
    Both,
}

/// <summary>
/// Step control shared by one-parameter branches and two-parameter curves. Steps are measured in a
/// scaled norm: component i of the unknown vector is divided by its scale (1 by default), so
/// choose scales that make the variables comparable (for example 1 K, 0.1 g/kg, 1 Sv).
/// </summary>
public record ArclengthSettings
{
    /// <summary>First step (scaled arclength).</summary>
    public double InitialStep { get; init; } = 0.01;

    /// <summary>Smallest step before the tracer gives up.</summary>
    public double MinStep { get; init; } = 1e-9;

    /// <summary>Largest step.</summary>
    public double MaxStep { get; init; } = 0.1;

    /// <summary>Maximum number of points per direction (including the start).</summary>
    public int MaxPoints { get; init; } = 2000;

    /// <summary>The corrector has converged when the max-norm of the defining equations is at most this.</summary>
    public double CorrectorTolerance { get; init; } = 1e-10;

    /// <summary>Newton iterations allowed per corrector step.</summary>
    public int MaxCorrectorIterations { get; init; } = 10;

    /// <summary>Largest angle (radians, in the scaled norm) between consecutive tangents; a sharper turn halves the step.</summary>
    public double MaxTurningAngle { get; init; } = 0.3;

    /// <summary>Factor by which the step grows after an easy corrector (at most two iterations).</summary>
    public double StepGrowth { get; init; } = 1.5;

    /// <summary>Detect and locate special points.</summary>
    public bool DetectSpecialPoints { get; init; } = true;

    /// <summary>Time passed to the right-hand side.</summary>
    public double Time { get; init; }

    /// <summary>Scales of the state variables (length Dimension), or null for all 1.</summary>
    public IReadOnlyList<double>? StateScale { get; init; }

    /// <summary>Smallest allowed value of each state variable (length Dimension; use −∞ for none), or null.</summary>
    public IReadOnlyList<double>? StateMin { get; init; }

    /// <summary>Largest allowed value of each state variable (length Dimension; use +∞ for none), or null.</summary>
    public IReadOnlyList<double>? StateMax { get; init; }

    /// <summary>Optional check that a state is inside the model's range of validity (see <see cref="StateValidator"/>).</summary>
    public StateValidator? Validity { get; init; }

    /// <summary>Newton settings for polishing the starting point.</summary>
    public NewtonOptions StartNewton { get; init; } = NewtonOptions.Default;

    internal void ValidateSteps(int dimension)
    {
        Positive(InitialStep, nameof(InitialStep));
        Positive(MinStep, nameof(MinStep));
        Positive(MaxStep, nameof(MaxStep));
        Positive(CorrectorTolerance, nameof(CorrectorTolerance));
        if (MinStep > InitialStep || InitialStep > MaxStep)
            throw new ArgumentException($"Steps must satisfy MinStep ≤ InitialStep ≤ MaxStep; got MinStep = {MinStep:G4}, InitialStep = {InitialStep:G4}, MaxStep = {MaxStep:G4}.", nameof(InitialStep));
        if (MaxPoints < 2) throw new ArgumentOutOfRangeException(nameof(MaxPoints), MaxPoints, "At least two points per direction are needed.");
        if (MaxCorrectorIterations < 1) throw new ArgumentOutOfRangeException(nameof(MaxCorrectorIterations), MaxCorrectorIterations, "At least one corrector iteration is needed.");
        if (!(MaxTurningAngle > 0 && MaxTurningAngle < Math.PI / 2))
            throw new ArgumentOutOfRangeException(nameof(MaxTurningAngle), MaxTurningAngle, "The largest turning angle must lie in (0, π/2) radians.");
        if (!(StepGrowth >= 1 && StepGrowth <= 4)) throw new ArgumentOutOfRangeException(nameof(StepGrowth), StepGrowth, "The step growth factor must lie in [1, 4].");
        CheckVector(StateScale, dimension, nameof(StateScale), positive: true);
        CheckVector(StateMin, dimension, nameof(StateMin), positive: false);
        CheckVector(StateMax, dimension, nameof(StateMax), positive: false);
        if (StateMin is not null && StateMax is not null)
            for (int i = 0; i < dimension; i++)
                if (!(StateMin[i] < StateMax[i]))
                    throw new ArgumentException($"State bounds of variable {i} are empty or inverted: StateMin = {StateMin[i]:G6}, StateMax = {StateMax[i]:G6}; StateMin must be below StateMax.", nameof(StateMin));
        StartNewton.Validate();
    }

    internal static void Positive(double value, string name)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentOutOfRangeException(name, value, $"{name} must be a positive finite number.");
    }

    private static void CheckVector(IReadOnlyList<double>? v, int dimension, string name, bool positive)
    {
        if (v is null) return;
        if (v.Count != dimension) throw new ArgumentException($"{name} has {v.Count} entries; the system has {dimension} state variables.", name);
        for (int i = 0; i < v.Count; i++)
        {
            if (double.IsNaN(v[i]) || (positive && !(v[i] > 0 && double.IsFinite(v[i]))))
                throw new ArgumentOutOfRangeException(name, v[i], $"{name}[{i}] = {v[i]} is not allowed; {(positive ? "scales must be positive and finite" : "bounds must not be NaN")}.");
        }
    }
}

/// <summary>Settings of one-parameter continuation of equilibria.</summary>
public sealed record ContinuationOptions : ArclengthSettings
{
    /// <summary>Lower end of the parameter range (the branch stops there).</summary>
    public required double ParameterMin { get; init; }

    /// <summary>Upper end of the parameter range.</summary>
    public required double ParameterMax { get; init; }

    /// <summary>Which way to go from the start.</summary>
    public ContinuationDirection Direction { get; init; } = ContinuationDirection.Both;

    /// <summary>Scale of the parameter in the arclength norm.</summary>
    public double ParameterScale { get; init; } = 1;

    /// <summary>Compute eigenvalues (stability) at every point; needed to detect Hopf points.</summary>
    public bool ComputeEigenvalues { get; init; } = true;

    internal void Validate(int dimension, double startParameter, string parameterName)
    {
        if (!double.IsFinite(ParameterMin) || !double.IsFinite(ParameterMax) || !(ParameterMin < ParameterMax))
            throw new ArgumentException(
                $"The range of parameter '{parameterName}' is empty or inverted: ParameterMin = {ParameterMin:G6}, ParameterMax = {ParameterMax:G6}; ParameterMin must be finite and below ParameterMax.",
                nameof(ParameterMin));
        if (startParameter < ParameterMin || startParameter > ParameterMax)
            throw new ArgumentOutOfRangeException(nameof(startParameter), startParameter,
                $"The starting value {startParameter:G6} of parameter '{parameterName}' lies outside its range [{ParameterMin:G6}, {ParameterMax:G6}].");
        Positive(ParameterScale, nameof(ParameterScale));
        ValidateSteps(dimension);
    }
}
