using System.Globalization;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Orbital;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// The assembled forcing of the tropical model: band insolation of the four surface boxes, CO2, sea level
/// and the freshwater schedules, all precomputed or validated when the model is built and evaluated in a
/// few hundred nanoseconds per call (<see cref="At"/>).
/// </summary>
public sealed class TropicalForcing
{
    /// <summary>Margin (years) by which precomputed tables extend beyond the run on each side.</summary>
    private const double MarginYears = 2000.0;

    /// <summary>Grid spacing (years) of the orbital-element interpolant used for insolation nodes and output.</summary>
    private const double OrbitSpacingYears = 200.0;

    private readonly OrbitalInsolationForcing _insolation;
    private readonly TimeSeriesForcing _co2, _seaLevel;
    private readonly FreshwaterSchedule[] _freshwater;
    private readonly double _t0;

    private TropicalForcing(ForcingEnvironment env, IOrbitSource orbit, OrbitalInsolationForcing insolation, TimeSeriesForcing co2,
        TimeSeriesForcing seaLevel, FreshwaterSchedule[] freshwater, IReadOnlyList<string> warnings)
    {
        Environment = env;
        Orbit = orbit;
        _insolation = insolation;
        _co2 = co2;
        _seaLevel = seaLevel;
        _freshwater = freshwater;
        _t0 = env.YearsSince1950(0.0);
        Warnings = warnings;
    }

    /// <summary>The environment the forcing was built for.</summary>
    public ForcingEnvironment Environment { get; }

    /// <summary>The (interpolated) orbit used.</summary>
    public IOrbitSource Orbit { get; }

    /// <summary>Whether insolation follows the seasonal cycle.</summary>
    public bool Seasonal => _insolation.Seasonal;

    /// <summary>Warnings (e.g. from the orbit source), as data.</summary>
    public IReadOnlyList<string> Warnings { get; }

    /// <summary>Builds and validates the forcing.</summary>
    /// <exception cref="ConfigurationException">A file is missing or malformed, a series does not cover the run, or a schedule starts after the run ends.</exception>
    public static TropicalForcing Create(TropicalModelOptions model, ForcingEnvironment env)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(env);
        ArgumentNullException.ThrowIfNull(env.Orbit);
        if (!(double.IsFinite(env.DurationYears) && env.DurationYears >= 0))
            throw new ConfigurationException($"run duration = {env.DurationYears} years is not allowed; it must be a finite number ≥ 0");
        if (!double.IsFinite(env.StartAgeKa))
            throw new ConfigurationException($"start age = {env.StartAgeKa} ka is not finite");
        var f = model.Forcing;
        double start = env.YearsSince1950(0.0) - MarginYears, end = env.YearsSince1950(env.DurationYears) + MarginYears;
        IReadOnlyList<string> warnings;
        IOrbitSource orbit;
        try
        {
            var interpolated = new InterpolatedOrbit(env.Orbit, start, end, OrbitSpacingYears);
            orbit = interpolated;
            warnings = interpolated.Warnings;
        }
        catch (ArgumentOutOfRangeException e)
        {
            throw new ConfigurationException($"the orbit ({env.Orbit.Description}) cannot serve the run from {env.StartAgeKa.ToString(CultureInfo.InvariantCulture)} ka for {env.DurationYears.ToString(CultureInfo.InvariantCulture)} years: {e.Message}", e);
        }
        var bands = Boxes.Surface.Select(b => (model.Boxes[b].SouthDeg, model.Boxes[b].NorthDeg)).ToArray();
        var insolation = new OrbitalInsolationForcing(orbit, start, end, f.SeasonalCycle ? f.SeasonalGridSpacing_yr : f.AnnualGridSpacing_yr, bands, f.SeasonalCycle, f.SeasonalTableDays, env.SolarConstant_Wm2, env.ParallelPrecompute);

        var co2 = string.IsNullOrWhiteSpace(f.Co2.File)
            ? TimeSeriesForcing.Constant(f.Co2.Constant_ppm, "ppm")
            : TimeSeriesForcing.FromFile(env.Resolve(f.Co2.File), f.Co2.Column, "Model:Forcing:Co2:File", f.Co2.MaxGap_kyr, env.StartAgeKa, env.DurationYears, "ppm");
        var seaLevel = string.IsNullOrWhiteSpace(f.SeaLevel.File)
            ? TimeSeriesForcing.Constant(f.SeaLevel.Constant_m, "m")
            : TimeSeriesForcing.FromFile(env.Resolve(f.SeaLevel.File), f.SeaLevel.Column, "Model:Forcing:SeaLevel:File", f.SeaLevel.MaxGap_kyr, env.StartAgeKa, env.DurationYears, "m");
        var schedules = new FreshwaterSchedule[Boxes.SurfaceCount];
        var so = f.Freshwater;
        FreshwaterScheduleOptions[] options = [so.WarmPool, so.ColdTongue, so.North, so.South];
        for (int i = 0; i < Boxes.SurfaceCount; i++)
            schedules[i] = FreshwaterSchedule.Create(options[i], $"Model:Forcing:Freshwater:{Boxes.ConfigName((Box)i)}", env.DurationYears);
        return new TropicalForcing(env, orbit, insolation, co2, seaLevel, schedules, warnings);
    }

    /// <summary>
    /// Writes the forcing at model time <paramref name="timeYears"/> (years since the run start) into
    /// <paramref name="destination"/> (length ≥ <see cref="ForcingChannel.Count"/>), indexed by <see cref="ForcingChannel"/>.
    /// Allocation-free.
    /// </summary>
    public void At(double timeYears, Span<double> destination)
    {
        _insolation.At(_t0 + timeYears, destination[..Boxes.SurfaceCount]);
        destination[ForcingChannel.Co2] = _co2.ValueAt(timeYears);
        destination[ForcingChannel.SeaLevel] = _seaLevel.ValueAt(timeYears);
        for (int i = 0; i < Boxes.SurfaceCount; i++) destination[6 + i] = _freshwater[i].RateAt(timeYears);
    }

    /// <summary>Orbital elements at model time <paramref name="timeYears"/> (for output).</summary>
    public OrbitalElements ElementsAt(double timeYears) =>
        Orbit.At(Math.Clamp(_t0 + timeYears, _insolation.StartYears, _insolation.EndYears));

    /// <summary>One line per forcing input.</summary>
    public IReadOnlyList<string> Describe() =>
    [
        $"orbit: {Environment.Orbit.Description}",
        (Seasonal ? "insolation: daily mean (seasonal cycle)" : "insolation: annual mean") + string.Create(CultureInfo.InvariantCulture, $", S0 = {Environment.SolarConstant_Wm2} W/m²"),
        $"CO2: {_co2.Description}",
        $"sea level: {_seaLevel.Description}",
        .. Boxes.Surface.Select(b => $"freshwater schedule {Boxes.Label(b)}: {_freshwater[(int)b].Describe()}"),
    ];
}
