namespace Thermostrat.Model.Configuration;

/// <summary>Where the orbital elements come from (configuration section "Orbit").</summary>
public sealed class OrbitOptions
{
    /// <summary>"berger1978" (built-in series) or "table" (a user file, see <see cref="TablePath"/>).</summary>
    [Parameter("", "orbital solution: berger1978 | table", Source = "Berger (1978), J. Atmos. Sci. 35, 2362")]
    public string Source { get; set; } = "berger1978";

    /// <summary>CSV or Parquet with columns age_ka, eccentricity, obliquity_deg, perihelion_deg (Source = "table").</summary>
    [Parameter("", "path of an imported orbital table (CSV or Parquet)")]
    public string TablePath { get; set; } = "";

    /// <summary>Permit the Berger series beyond ±5 Myr, where it is not meant to be used.</summary>
    [Parameter("", "allow the Berger (1978) series beyond ±5 Myr")]
    public bool AllowBeyondFiveMyr { get; set; }

    /// <summary>Hold eccentricity fixed (NaN = vary). 0 gives a circular orbit.</summary>
    [Parameter("1", "fixed eccentricity (NaN or absent: follow the solution)", Min = 0, Max = 0.1)]
    public double? FixedEccentricity { get; set; }

    /// <summary>Hold obliquity fixed, in degrees (absent: follow the solution).</summary>
    [Parameter("deg", "fixed obliquity (absent: follow the solution)", Min = 0, Max = 90)]
    public double? FixedObliquityDeg { get; set; }

    /// <summary>Hold the longitude of perihelion fixed (Berger's ϖ from the moving vernal equinox), in degrees.</summary>
    [Parameter("deg", "fixed longitude of perihelion (absent: follow the solution)", Min = 0, Max = 360)]
    public double? FixedPerihelionDeg { get; set; }

    /// <summary>Hold every element that is not otherwise fixed at its value at this age (ka); absent: no freezing.</summary>
    [Parameter("ka", "freeze all elements at their values at this age (absent: no freezing)", Min = -5000, Max = 5000)]
    public double? FreezeAtAgeKa { get; set; }
}

/// <summary>Top-of-atmosphere insolation settings (configuration section "Insolation").</summary>
public sealed class InsolationOptions
{
    /// <summary>Total solar irradiance S0.</summary>
    [Parameter("W m-2", "solar constant (total solar irradiance)", Source = "IAU 2015 Resolution B3 nominal value", Min = 1000, Max = 2000)]
    public double SolarConstant { get; set; } = 1361.0;
}
