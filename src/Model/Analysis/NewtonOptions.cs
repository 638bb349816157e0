namespace Thermostrat.Model.Analysis;

/// <summary>Settings of the damped Newton iteration for steady states.</summary>
public sealed record NewtonOptions
{
    /// <summary>Defaults: residual 1e-10, 50 iterations, damping down to 2⁻¹⁰.</summary>
    public static NewtonOptions Default { get; } = new();

    /// <summary>Converged when max_i |f_i| is at most this (in the system's tendency units per time unit).</summary>
    public double ResidualTolerance { get; init; } = 1e-10;

    /// <summary>Iteration limit.</summary>
    public int MaxIterations { get; init; } = 50;

    /// <summary>Smallest step fraction the backtracking line search may take before it gives up.</summary>
    public double MinimumDamping { get; init; } = 1.0 / 1024;

    /// <summary>Time passed to the right-hand side (equilibria are of autonomous systems).</summary>
    public double Time { get; init; }

    /// <summary>Throws <see cref="ArgumentOutOfRangeException"/> naming the first bad setting.</summary>
    public void Validate()
    {
        if (!(ResidualTolerance > 0) || !double.IsFinite(ResidualTolerance))
            throw new ArgumentOutOfRangeException(nameof(ResidualTolerance), ResidualTolerance, "The residual tolerance must be a positive finite number.");
        if (MaxIterations < 1)
            throw new ArgumentOutOfRangeException(nameof(MaxIterations), MaxIterations, "At least one Newton iteration is needed.");
        if (!(MinimumDamping > 0 && MinimumDamping <= 1))
            throw new ArgumentOutOfRangeException(nameof(MinimumDamping), MinimumDamping, "The minimum damping must lie in (0, 1].");
        if (!double.IsFinite(Time))
            throw new ArgumentOutOfRangeException(nameof(Time), Time, "The time must be finite.");
    }
}
