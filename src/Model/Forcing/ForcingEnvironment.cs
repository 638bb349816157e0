using Thermostrat.Model.Orbital;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// What the forcing needs from outside the model options: the orbit, the solar constant, the span of
/// the run (forcing is precomputed over it) and where relative file names are resolved.
/// </summary>
public sealed class ForcingEnvironment
{
    /// <summary>Source of the orbital elements (Berger 1978, an imported table, an idealized orbit, ...).</summary>
    public required IOrbitSource Orbit { get; init; }

    /// <summary>Solar constant S0 (W/m²).</summary>
    public double SolarConstant_Wm2 { get; init; } = Insolation.DefaultSolarConstantWm2;

    /// <summary>Age at model time 0 (ka before 1950, positive into the past).</summary>
    public double StartAgeKa { get; init; }

    /// <summary>Length of the run in years (forcing is precomputed over [0, DurationYears] plus a margin); 0 for analysis at one instant.</summary>
    public double DurationYears { get; init; }

    /// <summary>Directory against which relative forcing file paths are resolved ("" = the current directory).</summary>
    public string BaseDirectory { get; init; } = "";

    /// <summary>Evaluate orbital grid nodes in parallel while precomputing.</summary>
    public bool ParallelPrecompute { get; init; } = true;

    /// <summary>Years relative to 1950 at model time <paramref name="timeYears"/>.</summary>
    public double YearsSince1950(double timeYears) => IOrbitSource.YearsFromAgeKa(StartAgeKa) + timeYears;

    /// <summary>Resolves a forcing file path against <see cref="BaseDirectory"/>.</summary>
    public string Resolve(string path) =>
        Path.IsPathRooted(path) || string.IsNullOrEmpty(BaseDirectory) ? path : Path.Combine(BaseDirectory, path);
}
