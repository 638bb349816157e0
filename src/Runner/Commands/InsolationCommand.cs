using System.CommandLine;
using System.Globalization;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Model.Orbital;
using Thermostrat.Runner.Configuration;
using Thermostrat.Runner.Output;

namespace Thermostrat.Runner.Commands;

/// <summary>The quantities the insolation command tabulates.</summary>
public enum InsolationQuantity
{
    /// <summary>Annual-mean insolation.</summary>
    Annual,
    /// <summary>Daily mean at a true longitude or calendar day.</summary>
    Daily,
    /// <summary>Twelve monthly means (calendar or equal-longitude months).</summary>
    Monthly,
    /// <summary>Area-weighted mean over a latitude band (annual, or daily with --longitude/--day).</summary>
    Band,
    /// <summary>Mean insolation of Milankovitch's caloric summer half-year.</summary>
    CaloricSummer,
    /// <summary>Mean insolation of the caloric winter half-year.</summary>
    CaloricWinter,
    /// <summary>Energy of the days above a threshold (Huybers 2006).</summary>
    SummerEnergy,
}

/// <summary>What the insolation command was asked to compute (validated).</summary>
internal sealed record InsolationPlan(
    InsolationQuantity Quantity, double[] AgesKa, double[] Latitudes, double? Longitude, double? Day,
    MonthKind Months, (double South, double North)? Band, double Threshold, double SeasonKa);

/// <summary>
/// <c>thermostrat insolation</c>: orbital elements and top-of-atmosphere insolation over a range of
/// ages and latitudes, as Parquet tables, run.json and figures.
/// </summary>
public sealed class InsolationCommand : IRunnerCommand
{
    private readonly CommonOptions _common = new("out/insolation");
    private readonly Option<double> _start = new("--from-ka") { Description = "Youngest age, ka before 1950 (default 0).", DefaultValueFactory = _ => 0 };
    private readonly Option<double> _end = new("--to-ka") { Description = "Oldest age, ka before 1950 (default 1000).", DefaultValueFactory = _ => 1000 };
    private readonly Option<double> _step = new("--every-ka") { Description = "Age step, ka (default 1).", DefaultValueFactory = _ => 1 };
    private readonly Option<string> _lats = new("--lat") { Description = "Latitudes in degrees north: a list '-65,0,65' or a range 'from:to:step' (default -90:90:5).", DefaultValueFactory = _ => "-90:90:5" };
    private readonly Option<string> _quantity = new("--what")
    {
        Description = "Quantity: annual, daily, monthly, band, caloric-summer, caloric-winter, summer-energy (default annual).",
        DefaultValueFactory = _ => "annual",
    };
    private readonly Option<double?> _longitude = new("--sun-longitude") { Description = "Sun's true longitude in degrees (0 = March equinox, 90 = June solstice) for daily values." };
    private readonly Option<double?> _day = new("--day") { Description = "Calendar day of year (1 = 1 January; vernal equinox fixed on 21 March) for daily values." };
    private readonly Option<string> _months = new("--months") { Description = "Monthly means by 'calendar' months or 'longitude' (30° of true longitude) months (default calendar).", DefaultValueFactory = _ => "calendar" };
    private readonly Option<string?> _band = new("--band") { Description = "Latitude band 'south:north' in degrees for --what band, e.g. -5:5." };
    private readonly Option<double> _threshold = new("--threshold") { Description = "Threshold for summer energy, W/m² (default 275).", DefaultValueFactory = _ => 275 };
    private readonly Option<double?> _epoch = new("--season-ka") { Description = "Age (ka) of the latitude × day-of-year figure (default: the youngest age)." };
    private readonly Option<string?> _table = new("--orbit-table") { Description = "Use an imported orbital table (CSV or Parquet: age_ka, eccentricity, obliquity_deg, perihelion_deg); same as --set Orbit:Source=table --set Orbit:TablePath=FILE." };

    /// <inheritdoc />
    public Command Build(TextWriter stdout, TextWriter stderr)
    {
        var cmd = new Command("insolation",
            "Orbital elements and top-of-atmosphere insolation (Berger 1978 series, an imported table, or an idealized orbit) " +
            "over ages and latitudes. Writes insolation.parquet, orbit.parquet, season.parquet, run.json and figures.\n\n" +
            "Examples:\n" +
            "  thermostrat insolation                                   annual mean, 0–1000 ka, every 5°\n" +
            "  thermostrat insolation --what daily --sun-longitude 90 --lat 65      65°N at the June solstice\n" +
            "  thermostrat insolation --what summer-energy --lat 65 --threshold 275\n" +
            "  thermostrat insolation --what band --band -5:5 --day 80              equatorial band on 21 March\n" +
            "  thermostrat insolation --set Orbit:FixedObliquityDeg=23.5            fixed-tilt world\n" +
            "  thermostrat insolation --set Orbit:FixedEccentricity=0               circular orbit");
        foreach (var o in new Option[] { _start, _end, _step, _lats, _quantity, _longitude, _day, _months, _band, _threshold, _epoch, _table }) cmd.Options.Add(o);
        _common.AddTo(cmd);
        cmd.SetAction(pr => Cli.Guard(stderr, () => Execute(pr, stdout, stderr)));
        return cmd;
    }

    private int Execute(ParseResult pr, TextWriter stdout, TextWriter stderr)
    {
        var sets = (pr.GetValue(_common.Set) ?? []).ToList();
        if (pr.GetValue(_table) is { } table)
        {
            sets.Insert(0, "Orbit:TablePath=" + table);
            sets.Insert(0, "Orbit:Source=table");
        }
        var settings = ConfigLoader.Load<Settings>(new ConfigRequest { ConfigFiles = pr.GetValue(_common.Config) ?? [], Sets = sets });
        var plan = MakePlan(pr);
        var orbit = OrbitFactory.Create(settings.Orbit);
        double s0 = settings.Insolation.SolarConstant;
        double tOld = IOrbitSource.YearsFromAgeKa(plan.AgesKa.Max()), tYoung = IOrbitSource.YearsFromAgeKa(Math.Min(plan.AgesKa.Min(), plan.SeasonKa));
        IReadOnlyList<string> warnings;
        try
        {
            warnings = orbit.CheckRange(Math.Min(tOld, IOrbitSource.YearsFromAgeKa(plan.SeasonKa)), tYoung);
        }
        catch (ArgumentOutOfRangeException e)
        {
            throw new ConfigurationException($"ages {plan.AgesKa.Min()}–{plan.AgesKa.Max()} ka: {e.Message}");
        }
        bool quiet = pr.GetValue(_common.Quiet);
        foreach (var w in warnings) stderr.WriteLine("warning: " + w);

        using var output = OutputFolder.Begin(pr.GetValue(_common.Out)!, pr.GetValue(_common.Replace));
        var meta = ResolvedConfig.Metadata(settings, "insolation", new Dictionary<string, string>
        {
            ["thermostrat.orbit"] = orbit.Description,
            ["thermostrat.calendar"] = "365.2422-day year; vernal equinox fixed at noon on 21 March (day 80 of a common year)",
            ["thermostrat.solar_constant_wm2"] = s0.ToString("R", CultureInfo.InvariantCulture),
            ["thermostrat.quantity"] = QuantityName(plan.Quantity),
        });

        var elements = plan.AgesKa.Select(a => orbit.At(IOrbitSource.YearsFromAgeKa(a))).ToArray();
        WriteOrbit(output.File_("orbit.parquet"), plan.AgesKa, elements, meta);
        var (columnName, values, months) = Compute(plan, elements, s0);
        WriteInsolation(output.File_("insolation.parquet"), plan, columnName, values, months, meta);
        var season = orbit.At(IOrbitSource.YearsFromAgeKa(plan.SeasonKa));
        var seasonGrid = WriteSeason(output.File_("season.parquet"), season, plan.SeasonKa, s0, meta);

        InsolationFigures.AgeLatitudeMap(output.File_("insolation_age_latitude.png"), plan, columnName, values, months);
        InsolationFigures.SeasonMap(output.File_("insolation_season.png"), seasonGrid.Lats, seasonGrid.Days, seasonGrid.Values, plan.SeasonKa);
        InsolationFigures.Elements(output.File_("orbital_elements.png"), plan.AgesKa, elements);
        output.WriteRunRecord("insolation", Environment.GetCommandLineArgs().Skip(1).ToList(), settings, new Dictionary<string, object?>
        {
            ["orbit"] = orbit.Description,
            ["warnings"] = warnings,
        });
        output.Commit();

        if (!quiet) PrintSummary(stdout, plan, columnName, values, months, elements);
        stdout.WriteLine($"wrote {output.FinalPath}: insolation.parquet ({values.Length} rows), orbit.parquet, season.parquet, run.json, 3 figures");
        return Cli.Ok;
    }

    /// <summary>Name of a quantity as typed on the command line.</summary>
    public static string QuantityName(InsolationQuantity q) => q switch
    {
        InsolationQuantity.CaloricSummer => "caloric-summer",
        InsolationQuantity.CaloricWinter => "caloric-winter",
        InsolationQuantity.SummerEnergy => "summer-energy",
        _ => q.ToString().ToLowerInvariant(),
    };

    private InsolationPlan MakePlan(ParseResult pr)
    {
        var qText = pr.GetValue(_quantity) ?? "annual";
        var all = Enum.GetValues<InsolationQuantity>();
        var q = all.Cast<InsolationQuantity?>().FirstOrDefault(x => QuantityName(x!.Value) == qText.Trim().ToLowerInvariant())
            ?? throw new ConfigurationException($"--what '{qText}' is not a known quantity; allowed: {string.Join(", ", all.Select(QuantityName))}");
        double from = pr.GetValue(_start), to = pr.GetValue(_end), step = pr.GetValue(_step);
        RequireFinite("--from-ka", from); RequireFinite("--to-ka", to); RequireFinite("--every-ka", step);
        if (step <= 0) throw new ConfigurationException($"--every-ka = {Fmt(step)}: the age step must be > 0 ka");
        if (to < from) throw new ConfigurationException($"--to-ka = {Fmt(to)} is younger than --from-ka = {Fmt(from)}; the oldest age must be >= the youngest");
        long n = (long)Math.Floor((to - from) / step + 1e-9) + 1;
        if (n > 2_000_000) throw new ConfigurationException($"--from-ka/--to-ka/--every-ka give {n} ages; at most 2,000,000 are allowed");
        var ages = Enumerable.Range(0, (int)n).Select(i => from + i * step).ToArray();
        var lats = ParseList("--lat", pr.GetValue(_lats) ?? "-90:90:5");
        foreach (var l in lats)
            if (l < -90 || l > 90) throw new ConfigurationException($"--lat: latitude {Fmt(l)} is outside the allowed range -90 to 90 degrees");
        double? lon = pr.GetValue(_longitude), day = pr.GetValue(_day);
        if (lon is { } lo && !double.IsFinite(lo)) throw new ConfigurationException($"--sun-longitude = {Fmt(lo)}: must be a finite angle in degrees");
        if (day is { } d && (!double.IsFinite(d) || d < 1 || d > 366)) throw new ConfigurationException($"--day = {Fmt(d)}: allowed 1 to 366 (1 = 1 January)");
        if (lon is not null && day is not null) throw new ConfigurationException("--sun-longitude and --day both given; choose one");
        if (q == InsolationQuantity.Daily && lon is null && day is null)
            throw new ConfigurationException("--what daily needs --sun-longitude DEG or --day N");
        var months = (pr.GetValue(_months) ?? "calendar").ToLowerInvariant() switch
        {
            "calendar" => MonthKind.Calendar,
            "longitude" => MonthKind.EqualLongitude,
            var m => throw new ConfigurationException($"--months '{m}' is not known; allowed: calendar, longitude"),
        };
        (double, double)? band = null;
        if (pr.GetValue(_band) is { } b)
        {
            var parts = b.Split(':');
            if (parts.Length != 2 || !TryNum(parts[0], out var s) || !TryNum(parts[1], out var nn))
                throw new ConfigurationException($"--band '{b}' is not of the form south:north (degrees), e.g. -5:5");
            if (s < -90 || nn > 90 || s >= nn) throw new ConfigurationException($"--band '{b}': need -90 <= south < north <= 90 degrees");
            band = (s, nn);
        }
        if (q == InsolationQuantity.Band && band is null) throw new ConfigurationException("--what band needs --band south:north, e.g. --band -5:5");
        double threshold = pr.GetValue(_threshold);
        if (!double.IsFinite(threshold) || threshold < 0 || threshold > 1000)
            throw new ConfigurationException($"--threshold = {Fmt(threshold)}: allowed 0 to 1000 W/m²");
        double season = pr.GetValue(_epoch) ?? from;
        RequireFinite("--season-ka", season);
        return new InsolationPlan(q, ages, lats, lon, day, months, band, threshold, season);
    }

    private static (string Column, double[] Values, int[]? Months) Compute(InsolationPlan plan, OrbitalElements[] elements, double s0)
    {
        int nA = plan.AgesKa.Length;
        switch (plan.Quantity)
        {
            case InsolationQuantity.Band:
            {
                var v = new double[nA];
                var (south, north) = plan.Band!.Value;
                Parallel.For(0, nA, i =>
                {
                    var e = elements[i];
                    v[i] = plan.Longitude is { } lon ? Insolation.BandDailyMean(e, south, north, lon, s0)
                        : plan.Day is { } d ? Insolation.BandDailyMeanOnDay(e, south, north, d - 0.5, s0)
                        : Insolation.BandAnnualMean(e, south, north, s0);
                });
                return ("insolation_wm2", v, null);
            }
            case InsolationQuantity.Monthly:
            {
                int nL = plan.Latitudes.Length;
                var v = new double[nA * nL * 12];
                Parallel.For(0, nA, i =>
                {
                    for (int j = 0; j < nL; j++)
                        Insolation.MonthlyMeans(elements[i], plan.Latitudes[j], plan.Months, v.AsSpan((i * nL + j) * 12, 12), s0);
                });
                var months = Enumerable.Range(0, nA * nL * 12).Select(k => k % 12 + 1).ToArray();
                return ("insolation_wm2", v, months);
            }
            default:
            {
                int nL = plan.Latitudes.Length;
                var v = new double[nA * nL];
                Parallel.For(0, nA, i =>
                {
                    var e = elements[i];
                    var ev = new InsolationEvaluator(e, s0);
                    for (int j = 0; j < nL; j++)
                    {
                        double lat = plan.Latitudes[j];
                        v[i * nL + j] = plan.Quantity switch
                        {
                            InsolationQuantity.Annual => Insolation.AnnualMean(e, lat, s0),
                            InsolationQuantity.Daily => plan.Longitude is { } lon ? ev.DailyMean(lat, lon) : ev.DailyMeanOnDay(lat, plan.Day!.Value - 0.5),
                            InsolationQuantity.CaloricSummer => Insolation.CaloricHalfYears(e, lat, s0).SummerMeanWm2,
                            InsolationQuantity.CaloricWinter => Insolation.CaloricHalfYears(e, lat, s0).WinterMeanWm2,
                            _ => Insolation.IntegratedSummerEnergy(e, lat, plan.Threshold, s0),
                        };
                    }
                });
                return (plan.Quantity == InsolationQuantity.SummerEnergy ? "summer_energy_gjm2" : "insolation_wm2", v, null);
            }
        }
    }

    private static void WriteOrbit(string path, double[] ages, OrbitalElements[] el, Dictionary<string, string> meta)
    {
        using var w = ParquetTableWriter.Create(path,
        [
            new ColumnSpec("age_ka", "ka", "age, thousands of years before 1950"),
            new ColumnSpec("time_yr", "yr", "time relative to 1950 (negative = past)"),
            new ColumnSpec("eccentricity", "1", "orbital eccentricity e"),
            new ColumnSpec("obliquity_deg", "deg", "obliquity ε"),
            new ColumnSpec("perihelion_deg", "deg", "longitude of perihelion ϖ from the moving vernal equinox (Berger 1978 convention)"),
            new ColumnSpec("climatic_precession", "1", "climatic precession index e·sin ϖ"),
        ], meta);
        for (int i = 0; i < ages.Length; i++)
            w.AppendRow([ages[i], IOrbitSource.YearsFromAgeKa(ages[i]), el[i].Eccentricity, el[i].ObliquityDeg, ((el[i].PerihelionDeg % 360.0) + 360.0) % 360.0, el[i].ClimaticPrecession]);
        w.Complete();
    }

    private static void WriteInsolation(string path, InsolationPlan plan, string column, double[] values, int[]? months, Dictionary<string, string> meta)
    {
        bool band = plan.Quantity == InsolationQuantity.Band;
        var cols = new List<ColumnSpec>
        {
            new("age_ka", "ka", "age, thousands of years before 1950"),
            new("time_yr", "yr", "time relative to 1950 (negative = past)"),
        };
        if (band)
        {
            cols.Add(new("band_south_deg", "deg", "southern edge of the latitude band"));
            cols.Add(new("band_north_deg", "deg", "northern edge of the latitude band"));
        }
        else cols.Add(new("latitude_deg", "deg", "latitude, degrees north"));
        if (months is not null) cols.Add(new("month", "1", plan.Months == MonthKind.Calendar ? "calendar month (1 = January)" : "30° true-longitude month (1 starts at 280°, ~1 January)", ColumnKind.Int64));
        cols.Add(new(column, column.EndsWith("gjm2") ? "GJ m-2" : "W m-2", Describe(plan)));
        using var w = ParquetTableWriter.Create(path, cols, meta);
        int nL = band ? 1 : plan.Latitudes.Length, per = months is null ? 1 : 12;
        for (int k = 0; k < values.Length; k++)
        {
            int i = k / (nL * per), j = k / per % nL, c = 0;
            w.Set(c++, plan.AgesKa[i]);
            w.Set(c++, IOrbitSource.YearsFromAgeKa(plan.AgesKa[i]));
            if (band) { w.Set(c++, plan.Band!.Value.South); w.Set(c++, plan.Band!.Value.North); }
            else w.Set(c++, plan.Latitudes[j]);
            if (months is not null) w.Set(c++, (long)months[k]);
            w.Set(c, values[k]);
            w.EndRow();
        }
        w.Complete();
    }

    private static string Describe(InsolationPlan p) => p.Quantity switch
    {
        InsolationQuantity.Annual => "annual-mean top-of-atmosphere insolation",
        InsolationQuantity.Daily => p.Longitude is { } l ? $"daily-mean insolation at true solar longitude {Fmt(l)}°" : $"daily-mean insolation on calendar day {Fmt(p.Day!.Value)}",
        InsolationQuantity.Monthly => "monthly-mean insolation",
        InsolationQuantity.Band => "area-weighted band-mean insolation" + (p.Longitude is { } l2 ? $" at true longitude {Fmt(l2)}°" : p.Day is { } d ? $" on day {Fmt(d)}" : ", annual mean"),
        InsolationQuantity.CaloricSummer => "mean insolation of the caloric summer half-year (Milankovitch)",
        InsolationQuantity.CaloricWinter => "mean insolation of the caloric winter half-year (Milankovitch)",
        _ => $"energy of days with daily-mean insolation above {Fmt(p.Threshold)} W/m² (Huybers 2006)",
    };

    private static (double[] Lats, double[] Days, double[,] Values) WriteSeason(string path, OrbitalElements e, double ageKa, double s0, Dictionary<string, string> meta)
    {
        var lats = Enumerable.Range(0, 181).Select(i => -90.0 + i).ToArray();
        var days = Enumerable.Range(1, 365).Select(d => (double)d).ToArray();
        var v = new double[lats.Length, days.Length];
        var ev = new InsolationEvaluator(e, s0);
        using var w = ParquetTableWriter.Create(path,
        [
            new ColumnSpec("age_ka", "ka", "age of the epoch"),
            new ColumnSpec("latitude_deg", "deg", "latitude, degrees north"),
            new ColumnSpec("day_of_year", "day", "calendar day (1 = 1 January; vernal equinox on 21 March)"),
            new ColumnSpec("insolation_wm2", "W m-2", "daily-mean top-of-atmosphere insolation"),
        ], meta);
        for (int i = 0; i < lats.Length; i++)
            for (int j = 0; j < days.Length; j++)
            {
                // Mid-day of calendar day d: d − 0.5 days since 00:00 on 1 January.
                v[i, j] = ev.DailyMeanOnDay(lats[i], days[j] - 0.5);
                w.AppendRow([ageKa, lats[i], days[j], v[i, j]]);
            }
        w.Complete();
        return (lats, days, v);
    }

    private static void PrintSummary(TextWriter o, InsolationPlan plan, string column, double[] values, int[]? months, OrbitalElements[] el)
    {
        o.WriteLine($"{Describe(plan)} ({column}), {plan.AgesKa.Length} ages from {Fmt(plan.AgesKa[0])} to {Fmt(plan.AgesKa[^1])} ka");
        o.WriteLine($"  eccentricity {el.Min(x => x.Eccentricity):F5}–{el.Max(x => x.Eccentricity):F5}, obliquity {el.Min(x => x.ObliquityDeg):F3}–{el.Max(x => x.ObliquityDeg):F3}°");
        bool band = plan.Quantity == InsolationQuantity.Band;
        int nL = band ? 1 : plan.Latitudes.Length, per = months is null ? 1 : 12;
        var rows = new List<string[]> { new[] { band ? "band" : "latitude", "at " + Fmt(plan.AgesKa[0]) + " ka", "minimum", "mean", "maximum" } };
        var show = Enumerable.Range(0, nL).ToList();
        if (show.Count > 9) show = [.. Enumerable.Range(0, 9).Select(k => k * (nL - 1) / 8).Distinct()];
        foreach (int j in show)
        {
            var series = Enumerable.Range(0, plan.AgesKa.Length).SelectMany(i => Enumerable.Range(0, per).Select(m => values[(i * nL + j) * per + m])).ToArray();
            string label = band ? $"{Fmt(plan.Band!.Value.South)}…{Fmt(plan.Band.Value.North)}°" : $"{Fmt(plan.Latitudes[j])}°";
            rows.Add([label, series[0].ToString("F2", CultureInfo.InvariantCulture), series.Min().ToString("F2", CultureInfo.InvariantCulture),
                series.Average().ToString("F2", CultureInfo.InvariantCulture), series.Max().ToString("F2", CultureInfo.InvariantCulture)]);
        }
        TextTable.Write(o, rows);
    }

    private static double[] ParseList(string option, string text)
    {
        text = text.Trim();
        if (text.Contains(':'))
        {
            var p = text.Split(':');
            if (p.Length != 3 || !TryNum(p[0], out var a) || !TryNum(p[1], out var b) || !TryNum(p[2], out var s))
                throw new ConfigurationException($"{option} '{text}' is not a range from:to:step");
            if (s <= 0) throw new ConfigurationException($"{option} '{text}': the step must be > 0");
            if (b < a) throw new ConfigurationException($"{option} '{text}': 'to' must be >= 'from'");
            int n = (int)Math.Floor((b - a) / s + 1e-9) + 1;
            if (n > 100_000) throw new ConfigurationException($"{option} '{text}' gives {n} values; at most 100,000 are allowed");
            return Enumerable.Range(0, n).Select(i => a + i * s).ToArray();
        }
        var items = text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
        if (items.Length == 0) throw new ConfigurationException($"{option}: no values given");
        return items.Select(x => TryNum(x, out var v) ? v : throw new ConfigurationException($"{option}: '{x}' is not a number")).ToArray();
    }

    private static bool TryNum(string s, out double v) =>
        double.TryParse(s.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out v) && double.IsFinite(v);

    private static void RequireFinite(string option, double v)
    {
        if (!double.IsFinite(v)) throw new ConfigurationException($"{option} = {Fmt(v)}: must be a finite number");
    }

    internal static string Fmt(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
