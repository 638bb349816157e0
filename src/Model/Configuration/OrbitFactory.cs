using Thermostrat.Model.Orbital;

namespace Thermostrat.Model.Configuration;

/// <summary>Turns the "Orbit" configuration section into an orbit source.</summary>
public static class OrbitFactory
{
    /// <summary>Allowed values of <see cref="OrbitOptions.Source"/>.</summary>
    public static readonly IReadOnlyList<string> Sources = ["berger1978", "table"];

    /// <summary>The orbit the options describe: a solution, then any elements held fixed or frozen at an age.</summary>
    /// <exception cref="ConfigurationException">Unknown source, or a table that cannot be read.</exception>
    public static IOrbitSource Create(OrbitOptions options)
    {
        IOrbitSource orbit = options.Source.ToLowerInvariant() switch
        {
            "berger1978" => Berger1978Orbit.Load(options.AllowBeyondFiveMyr),
            "table" => LoadTable(options.TablePath),
            _ => throw new ConfigurationException(
                $"Orbit:Source = '{options.Source}' is not known; allowed: {string.Join(", ", Sources)}"),
        };
        if (options.FreezeAtAgeKa is { } age)
            orbit = new ConstantOrbit(orbit.At(IOrbitSource.YearsFromAgeKa(age)));
        if (options.FixedEccentricity is not null || options.FixedObliquityDeg is not null || options.FixedPerihelionDeg is not null)
            orbit = new IdealizedOrbit(orbit, options.FixedEccentricity, options.FixedObliquityDeg, options.FixedPerihelionDeg);
        return orbit;
    }

    private static IOrbitSource LoadTable(string path)
    {
        if (string.IsNullOrWhiteSpace(path))
            throw new ConfigurationException("Orbit:Source = 'table' needs Orbit:TablePath, the CSV or Parquet file of age_ka, eccentricity, obliquity_deg, perihelion_deg");
        if (!File.Exists(path))
            throw new ConfigurationException($"Orbit:TablePath = '{path}': file not found");
        try
        {
            return path.EndsWith(".parquet", StringComparison.OrdinalIgnoreCase) ? TabulatedOrbit.FromParquet(path) : TabulatedOrbit.FromCsv(path);
        }
        catch (Exception e) when (e is InvalidDataException or ArgumentException or FormatException)
        {
            throw new ConfigurationException($"Orbit:TablePath = '{path}': {e.Message}", e);
        }
    }
}
