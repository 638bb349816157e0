using System.Globalization;
using Thermostrat.Model.Configuration;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// A validated freshwater schedule, evaluated cheaply during integration: rate (m³/s) as a function of
/// model time (years since the start of the run).
/// </summary>
public sealed class FreshwaterSchedule
{
    private readonly ScheduleShape _shape;
    private readonly double _rate, _initial, _start, _end;
    private readonly double[] _times, _rates;

    private FreshwaterSchedule(ScheduleShape shape, double rate, double initial, double start, double end, double[] times, double[] rates)
    {
        _shape = shape;
        _rate = rate;
        _initial = initial;
        _start = start;
        _end = end;
        _times = times;
        _rates = rates;
    }

    /// <summary>A schedule that adds nothing.</summary>
    public static FreshwaterSchedule None { get; } = new(ScheduleShape.None, 0, 0, 0, 0, [], []);

    /// <summary>The shape.</summary>
    public ScheduleShape Shape => _shape;

    /// <summary>
    /// Validates <paramref name="o"/> against a run of <paramref name="durationYears"/> and builds the schedule.
    /// </summary>
    /// <param name="o">The options.</param>
    /// <param name="key">Its configuration path, for messages.</param>
    /// <param name="durationYears">Length of the run in years (schedules that start after it ends are errors).</param>
    /// <exception cref="ConfigurationException">The schedule is malformed or starts after the run ends.</exception>
    public static FreshwaterSchedule Create(FreshwaterScheduleOptions o, string key, double durationYears)
    {
        ArgumentNullException.ThrowIfNull(o);
        string Show(double v) => v.ToString("R", CultureInfo.InvariantCulture);
        string end = Show(durationYears);
        const double sv = 1e6;
        switch (o.Shape)
        {
            case ScheduleShape.None:
                return None;
            case ScheduleShape.Constant:
                return new(ScheduleShape.Constant, o.Rate_Sv * sv, 0, 0, 0, [], []);
            case ScheduleShape.Step:
                if (o.StartYear > durationYears)
                    throw new ConfigurationException($"{key}:StartYear = {Show(o.StartYear)} is after the end of the run (year {end}); allowed: a step at or before year {end} (years since the run start)");
                return new(ScheduleShape.Step, o.Rate_Sv * sv, o.InitialRate_Sv * sv, o.StartYear, 0, [], []);
            case ScheduleShape.Ramp:
                if (o.StartYear > durationYears)
                    throw new ConfigurationException($"{key}:StartYear = {Show(o.StartYear)} is after the end of the run (year {end}); allowed: a ramp that starts at or before year {end} (years since the run start)");
                if (!(o.EndYear > o.StartYear))
                    throw new ConfigurationException($"{key}:EndYear = {Show(o.EndYear)} is not after {key}:StartYear = {Show(o.StartYear)}; a ramp needs EndYear > StartYear");
                return new(ScheduleShape.Ramp, o.Rate_Sv * sv, o.InitialRate_Sv * sv, o.StartYear, o.EndYear, [], []);
            case ScheduleShape.Table:
                var pts = o.Points ?? [];
                if (pts.Count < 2)
                    throw new ConfigurationException($"{key}:Points has {pts.Count} point(s); a Table schedule needs at least 2 points (Year, Rate_Sv) in increasing Year");
                for (int i = 0; i < pts.Count; i++)
                {
                    if (!double.IsFinite(pts[i].Year) || !double.IsFinite(pts[i].Rate_Sv))
                        throw new ConfigurationException($"{key}:Points:{i} = ({Show(pts[i].Year)}, {Show(pts[i].Rate_Sv)}) is not finite; allowed: finite Year and Rate_Sv");
                    if (i > 0 && !(pts[i].Year > pts[i - 1].Year))
                        throw new ConfigurationException($"{key}:Points:{i}:Year = {Show(pts[i].Year)} does not follow {key}:Points:{i - 1}:Year = {Show(pts[i - 1].Year)}; the points must be in strictly increasing Year");
                }
                if (pts[0].Year > durationYears)
                    throw new ConfigurationException($"{key}:Points:0:Year = {Show(pts[0].Year)} is after the end of the run (year {end}); allowed: a table that starts at or before year {end} (years since the run start)");
                return new(ScheduleShape.Table, 0, 0, 0, 0, pts.Select(p => p.Year).ToArray(), pts.Select(p => p.Rate_Sv * sv).ToArray());
            default:
                throw new ConfigurationException($"{key}:Shape = '{o.Shape}' is not known; allowed: {string.Join(", ", Enum.GetNames<ScheduleShape>())}");
        }
    }

    /// <summary>Freshwater input (m³/s) at model time <paramref name="timeYears"/> (years since the run start).</summary>
    public double RateAt(double timeYears)
    {
        switch (_shape)
        {
            case ScheduleShape.None: return 0.0;
            case ScheduleShape.Constant: return _rate;
            case ScheduleShape.Step: return timeYears < _start ? _initial : _rate;
            case ScheduleShape.Ramp:
                if (timeYears <= _start) return _initial;
                if (timeYears >= _end) return _rate;
                return _initial + (_rate - _initial) * (timeYears - _start) / (_end - _start);
            default:
                if (timeYears <= _times[0]) return _rates[0];
                if (timeYears >= _times[^1]) return _rates[^1];
                int hi = Array.BinarySearch(_times, timeYears);
                if (hi >= 0) return _rates[hi];
                hi = ~hi;
                int lo = hi - 1;
                return _rates[lo] + (_rates[hi] - _rates[lo]) * (timeYears - _times[lo]) / (_times[hi] - _times[lo]);
        }
    }

    /// <summary>One line describing the schedule.</summary>
    public string Describe() => _shape switch
    {
        ScheduleShape.None => "none",
        ScheduleShape.Constant => string.Create(CultureInfo.InvariantCulture, $"constant {_rate / 1e6} Sv"),
        ScheduleShape.Step => string.Create(CultureInfo.InvariantCulture, $"step {_initial / 1e6} → {_rate / 1e6} Sv at year {_start}"),
        ScheduleShape.Ramp => string.Create(CultureInfo.InvariantCulture, $"ramp {_initial / 1e6} Sv at year {_start} → {_rate / 1e6} Sv at year {_end}"),
        _ => string.Create(CultureInfo.InvariantCulture, $"table of {_times.Length} points, years {_times[0]}–{_times[^1]}"),
    };
}
