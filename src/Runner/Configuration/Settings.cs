using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Runner.Configuration;

/// <summary>
/// The whole configuration tree. Each section is bound from the layered configuration
/// (built-in defaults → config files → scenario file → --set → THERMOSTRAT_ environment variables)
/// and validated before any command does work.
/// </summary>
public sealed class Settings
{
    /// <summary>Free text describing a scenario (what it tests).</summary>
    [Parameter("", "what this scenario or configuration is for")]
    public string Description { get; set; } = "";

    /// <summary>A scenario may name a configuration file (relative to the scenario) to layer beneath it.</summary>
    [Parameter("", "configuration file layered beneath a scenario (relative to the scenario file)")]
    public string Config { get; set; } = "";

    /// <summary>Orbital solution.</summary>
    public OrbitOptions Orbit { get; set; } = new();

    /// <summary>Top-of-atmosphere insolation.</summary>
    public InsolationOptions Insolation { get; set; } = new();

    /// <summary>The tropical ocean–cloud box model: constants, boxes, processes, forcing.</summary>
    public TropicalModelOptions Model { get; set; } = new();

    /// <summary>A forced run: duration, start age, output interval, integrator.</summary>
    public RunOptions Run { get; set; } = new();
}
