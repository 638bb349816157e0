using System.Globalization;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Model.Analysis;

/// <summary>A water mass: salinity, temperature and sea pressure, checked on construction.</summary>
/// <remarks>
/// Salinity and temperature are the box model's variables: for TEOS-10 Absolute Salinity (g/kg)
/// and Conservative Temperature (°C); see each equation of state for its own mapping.
/// </remarks>
public sealed record WaterMass
{
    /// <summary>Creates a water mass.</summary>
    /// <param name="salinity">Salinity, g/kg, 0 to 42.</param>
    /// <param name="temperature">Temperature, °C, −2 to 40.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar, 0 to 8000 (0 at the surface).</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is NaN or out of range; the message names the value and the range.</exception>
    public WaterMass(double salinity, double temperature, double pressure_dbar = 0.0)
    {
        Salinity = SeawaterRange.CheckSalinity(salinity, nameof(salinity));
        Temperature = SeawaterRange.CheckTemperature(temperature, nameof(temperature));
        Pressure_dbar = SeawaterRange.CheckPressure(pressure_dbar, nameof(pressure_dbar));
    }

    /// <summary>A water mass at a depth, its pressure from <see cref="SeawaterDepth.PressureFromDepth"/> (Saunders 1981).</summary>
    /// <param name="salinity">Salinity, g/kg, 0 to 42.</param>
    /// <param name="temperature">Temperature, °C, −2 to 40.</param>
    /// <param name="depth_m">Depth, m, positive down, 0 to 8000 (and at most the depth of 8000 dbar).</param>
    /// <param name="latitude_deg">Latitude, degrees; the tropics' 0 by default.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is NaN or out of range.</exception>
    public static WaterMass AtDepth(double salinity, double temperature, double depth_m, double latitude_deg = 0.0)
    {
        double p = SeawaterDepth.PressureFromDepth(depth_m, latitude_deg);
        if (p > SeawaterRange.MaxPressure_dbar)
        {
            throw new ArgumentOutOfRangeException(nameof(depth_m), depth_m, string.Create(CultureInfo.InvariantCulture,
                $"depth_m = {depth_m} m lies at {p:F0} dbar, beyond the allowed {SeawaterRange.MinPressure_dbar} to {SeawaterRange.MaxPressure_dbar} dbar."));
        }
        return new WaterMass(salinity, temperature, p);
    }

    /// <summary>Salinity, g/kg.</summary>
    public double Salinity { get; }

    /// <summary>Temperature, °C.</summary>
    public double Temperature { get; }

    /// <summary>Sea pressure, dbar.</summary>
    public double Pressure_dbar { get; }
}

/// <summary>Settings of <see cref="DensityThreshold.Solve"/>.</summary>
public sealed record DensityThresholdOptions
{
    /// <summary>
    /// Pressure (dbar) at which both water masses are compared. <c>null</c> (the default): each
    /// at its own pressure (in-situ densities). A value compares potential densities referred to
    /// it — exactly so for TEOS-10, whose temperature variable Θ does not change with pressure.
    /// </summary>
    public double? ReferencePressure_dbar { get; init; }

    /// <summary>The Newton iteration stops when the density mismatch is below this, kg/m³.</summary>
    public double DensityTolerance_kgm3 { get; init; } = 1e-10;

    /// <summary>Largest number of iterations per root.</summary>
    public int MaxIterations { get; init; } = 100;

    /// <summary>Throws if a setting is out of range; the message names it.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A setting is invalid.</exception>
    public void Validate()
    {
        if (ReferencePressure_dbar is double p) SeawaterRange.CheckPressure(p, nameof(ReferencePressure_dbar));
        if (!(DensityTolerance_kgm3 > 0) || !double.IsFinite(DensityTolerance_kgm3))
            throw new ArgumentOutOfRangeException(nameof(DensityTolerance_kgm3), DensityTolerance_kgm3,
                string.Create(CultureInfo.InvariantCulture, $"DensityTolerance_kgm3 = {DensityTolerance_kgm3} kg/m³ must be a finite number greater than 0."));
        if (MaxIterations < 1)
            throw new ArgumentOutOfRangeException(nameof(MaxIterations), MaxIterations,
                $"MaxIterations = {MaxIterations} must be at least 1.");
    }
}

/// <summary>A change that makes the densities equal, or the reason there is none.</summary>
public sealed record ThresholdChange
{
    /// <summary>Whether a solution exists in the allowed range.</summary>
    public bool Found { get; init; }

    /// <summary>The change (units in the property that holds it); NaN when <see cref="Found"/> is false.</summary>
    public double Value { get; init; } = double.NaN;

    /// <summary>Why there is no solution; <c>null</c> when one was found.</summary>
    public string? NoSolutionReason { get; init; }

    /// <summary>Newton (or bisection) iterations spent on the root; 0 when none was needed.</summary>
    public int Iterations { get; init; }

    /// <summary>A found change.</summary>
    public static ThresholdChange Solved(double value, int iterations) => new() { Found = true, Value = value, Iterations = iterations };

    /// <summary>No solution, with its reason.</summary>
    public static ThresholdChange None(string reason) => new() { Found = false, NoSolutionReason = reason };

    /// <inheritdoc />
    public override string ToString() =>
        Found ? Value.ToString("G8", CultureInfo.InvariantCulture) : $"no solution: {NoSolutionReason}";
}

/// <summary>What <see cref="DensityThreshold.Solve"/> found for two water masses under one equation of state.</summary>
public sealed record DensityThresholdResult
{
    /// <summary>Name of the equation of state (<see cref="IEquationOfState.Name"/>).</summary>
    public required string EquationOfState { get; init; }

    /// <summary>The first water mass (the one whose salinity or temperature is changed).</summary>
    public required WaterMass First { get; init; }

    /// <summary>The second water mass (the target density).</summary>
    public required WaterMass Second { get; init; }

    /// <summary>Thickness of the first water mass's layer, m (for the freshwater equivalent).</summary>
    public required double LayerThickness_m { get; init; }

    /// <summary>Pressure at which the first's density is evaluated, dbar.</summary>
    public required double PressureFirst_dbar { get; init; }

    /// <summary>Pressure at which the second's density is evaluated, dbar.</summary>
    public required double PressureSecond_dbar { get; init; }

    /// <summary>Density of the first, kg/m³.</summary>
    public required double DensityFirst_kgm3 { get; init; }

    /// <summary>Density of the second, kg/m³.</summary>
    public required double DensitySecond_kgm3 { get; init; }

    /// <summary>Δρ = ρ(first) − ρ(second), kg/m³.</summary>
    public required double DensityDifference_kgm3 { get; init; }

    /// <summary>α at the mid-point of the two water masses (mean S, T and pressure), 1/K.</summary>
    public required double ThermalExpansion_perK { get; init; }

    /// <summary>β at the mid-point of the two water masses, kg/g.</summary>
    public required double HalineContraction_perGkg { get; init; }

    /// <summary>
    /// Density ratio R = α ΔT / (β ΔS), ΔT = T(first) − T(second), ΔS = S(first) − S(second), with α
    /// and β at the mid-point. ±∞ when ΔS = 0 and ΔT ≠ 0; NaN when both are zero.
    /// </summary>
    public required double DensityRatio { get; init; }

    /// <summary>ΔS (g/kg) of the first, at its own temperature and pressure, that makes its density equal the second's.</summary>
    public required ThresholdChange SalinityChange_gkg { get; init; }

    /// <summary>
    /// Metres of fresh water h_f that, mixed into the first's layer of thickness H, give the same
    /// salinity change: S' = S H/(H + h_f), so h_f = H (S/S' − 1). Negative: fresh water removed
    /// (net evaporation) when the first must become saltier.
    /// </summary>
    public required ThresholdChange FreshwaterInput_m { get; init; }

    /// <summary>
    /// ΔT (K) of the first, at its own salinity and pressure, that makes its density equal the
    /// second's. Where density is not monotonic in temperature (fresh water near 4 °C) two may
    /// exist; this is the one of smallest magnitude.
    /// </summary>
    public required ThresholdChange TemperatureChange_K { get; init; }
}
