using Thermostrat.Model.Configuration;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// Forcing of the tropical model (section "Model:Forcing"): insolation from the orbit (annual mean or the
/// seasonal cycle), CO2 and sea level (constant or from a file), and freshwater schedules per surface box.
/// </summary>
public sealed class ForcingOptions
{
    /// <summary>Resolve the seasonal cycle with daily-mean insolation (false: annual-mean insolation).</summary>
    [Parameter("", "resolve the seasonal cycle with daily-mean insolation (false: annual means)")]
    public bool SeasonalCycle { get; set; }

    /// <summary>Spacing of the precomputed annual-mean insolation grid (interpolated by cubic splines between nodes).</summary>
    [Parameter("yr", "spacing of the precomputed annual-mean insolation grid", Source = "common practice (annual means depend on eccentricity and obliquity only, periods ≥ 29 kyr; 2 kyr gives ≥ 14 nodes per cycle, spline error < 1e-3 W m-2, checked in the tests)", Min = 1, Max = 10000)]
    public double AnnualGridSpacing_yr { get; set; } = 2000.0;

    /// <summary>Spacing of the precomputed seasonal-insolation grid (harmonic coefficients splined between nodes).</summary>
    [Parameter("yr", "spacing of the precomputed seasonal-insolation grid (linear between nodes)", Source = "common practice (19-kyr precession: 250 yr gives ≈ 76 nodes per cycle; linear interpolation error < 0.1 W m-2)", Min = 1, Max = 10000)]
    public double SeasonalGridSpacing_yr { get; set; } = 250.0;

    /// <summary>Days per year of the precomputed seasonal insolation table (periodic cubic interpolation between them).</summary>
    [Parameter("1", "days per year in the seasonal insolation table", Source = "common practice (every 5 days; band-mean daily insolation outside the polar caps is smooth: periodic cubic interpolation reproduces it to < 0.5 W m-2, checked in the tests)", Min = 8, Max = 366)]
    public int SeasonalTableDays { get; set; } = 73;

    /// <summary>Atmospheric CO2.</summary>
    public Co2ForcingOptions Co2 { get; set; } = new();

    /// <summary>Sea level (ice volume).</summary>
    public SeaLevelForcingOptions SeaLevel { get; set; } = new();

    /// <summary>Freshwater schedules (hosing), one per surface box.</summary>
    public FreshwaterSchedulesOptions Freshwater { get; set; } = new();
}

/// <summary>CO2 concentration: a constant, or a time series from a CSV or Parquet file ("Model:Forcing:Co2").</summary>
public sealed class Co2ForcingOptions
{
    /// <summary>Concentration used when <see cref="File"/> is empty.</summary>
    [Parameter("ppm", "CO2 concentration when no file is given", Source = "common practice (pre-industrial 280 ppm)", Min = 0, MinExclusive = true, Max = 100000)]
    public double Constant_ppm { get; set; } = 280.0;

    /// <summary>CSV or Parquet file with a time column (age_ka, or time_yr since the run start) and <see cref="Column"/>; empty: constant.</summary>
    [Parameter("", "CSV or Parquet time series (columns age_ka or time_yr, and the value column); empty: constant")]
    public string File { get; set; } = "";

    /// <summary>Name of the value column.</summary>
    [Parameter("", "name of the CO2 column in the file (ppm)")]
    public string Column { get; set; } = "co2_ppm";

    /// <summary>Largest allowed spacing between rows; a wider spacing is reported as a gap.</summary>
    [Parameter("kyr", "largest spacing between rows of the file; wider is a gap", Source = "common practice (ice-core CO2 is resolved at ≤ 2 kyr over the last 800 kyr)", Min = 0, MinExclusive = true, Max = 1e6)]
    public double MaxGap_kyr { get; set; } = 10.0;
}

/// <summary>Sea level relative to present (ice volume): a constant, or a time series ("Model:Forcing:SeaLevel").</summary>
public sealed class SeaLevelForcingOptions
{
    /// <summary>Sea level used when <see cref="File"/> is empty (m; negative with more land ice).</summary>
    [Parameter("m", "sea level relative to present when no file is given", Source = "common practice (present sea level)", Min = -300, Max = 100)]
    public double Constant_m { get; set; }

    /// <summary>CSV or Parquet file with a time column (age_ka or time_yr) and <see cref="Column"/>; empty: constant.</summary>
    [Parameter("", "CSV or Parquet time series (columns age_ka or time_yr, and the value column); empty: constant")]
    public string File { get; set; } = "";

    /// <summary>Name of the value column.</summary>
    [Parameter("", "name of the sea-level column in the file (m)")]
    public string Column { get; set; } = "sea_level_m";

    /// <summary>Largest allowed spacing between rows; a wider spacing is reported as a gap.</summary>
    [Parameter("kyr", "largest spacing between rows of the file; wider is a gap", Source = "common practice (sea-level stacks are resolved at 1–3 kyr)", Min = 0, MinExclusive = true, Max = 1e6)]
    public double MaxGap_kyr { get; set; } = 10.0;
}

/// <summary>One freshwater schedule per surface box ("Model:Forcing:Freshwater:&lt;Box&gt;").</summary>
public sealed class FreshwaterSchedulesOptions
{
    /// <summary>Into the warm pool.</summary>
    public FreshwaterScheduleOptions WarmPool { get; set; } = new();
    /// <summary>Into the cold tongue.</summary>
    public FreshwaterScheduleOptions ColdTongue { get; set; } = new();
    /// <summary>Into the northern ventilation box.</summary>
    public FreshwaterScheduleOptions North { get; set; } = new();
    /// <summary>Into the southern ventilation box.</summary>
    public FreshwaterScheduleOptions South { get; set; } = new();
}

/// <summary>Shape of a freshwater schedule.</summary>
public enum ScheduleShape
{
    /// <summary>No added freshwater.</summary>
    None,
    /// <summary><see cref="FreshwaterScheduleOptions.Rate_Sv"/> at all times.</summary>
    Constant,
    /// <summary><see cref="FreshwaterScheduleOptions.InitialRate_Sv"/> before StartYear, Rate_Sv from then on.</summary>
    Step,
    /// <summary>InitialRate_Sv until StartYear, linear to Rate_Sv at EndYear, Rate_Sv after.</summary>
    Ramp,
    /// <summary>Piecewise linear through <see cref="FreshwaterScheduleOptions.Points"/>, held at the end values outside them.</summary>
    Table,
}

/// <summary>
/// A freshwater input schedule in Sv, in years since the start of the run (time_yr). It adds to the
/// constant hosing of the surface-freshwater process and is balanced as that process's Compensation says.
/// </summary>
public sealed class FreshwaterScheduleOptions
{
    /// <summary>Shape of the schedule.</summary>
    [Parameter("", "shape: None | Constant | Step | Ramp | Table")]
    public ScheduleShape Shape { get; set; } = ScheduleShape.None;

    /// <summary>Rate after the step or at the end of the ramp (or the constant rate).</summary>
    [Parameter("Sv", "freshwater input after the step / at the end of the ramp / constant", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double Rate_Sv { get; set; }

    /// <summary>Rate before the step or at the start of the ramp.</summary>
    [Parameter("Sv", "freshwater input before the step / at the start of the ramp", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double InitialRate_Sv { get; set; }

    /// <summary>Time of the step or start of the ramp (years since the start of the run).</summary>
    [Parameter("yr", "time of the step / start of the ramp, years since the run start", Source = "common practice", Min = -1e9, Max = 1e9)]
    public double StartYear { get; set; }

    /// <summary>End of the ramp (years since the start of the run), after <see cref="StartYear"/>.</summary>
    [Parameter("yr", "end of the ramp, years since the run start", Source = "common practice", Min = -1e9, Max = 1e9)]
    public double EndYear { get; set; }

    /// <summary>Points of a Table schedule, in increasing time.</summary>
    public List<SchedulePoint> Points { get; set; } = [];
}

/// <summary>One point of a piecewise-linear freshwater schedule.</summary>
public sealed class SchedulePoint
{
    /// <summary>Time, years since the start of the run.</summary>
    [Parameter("yr", "time of the point, years since the run start", Min = -1e9, Max = 1e9)]
    public double Year { get; set; }

    /// <summary>Freshwater input at that time.</summary>
    [Parameter("Sv", "freshwater input at this point", Min = -10, Max = 10)]
    public double Rate_Sv { get; set; }
}
