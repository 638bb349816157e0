using Parquet;
using Parquet.Schema;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Forcing;

/// <summary>Forcing: insolation tables against the orbital module's formulas, schedules and time series against their definitions.</summary>
public class ForcingTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("thermostrat-forcing-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static readonly (double, double)[] Bands = [(-5, 5), (-3, 3), (35, 60), (-60, -35)];

    [Fact]
    public void SeasonalTableReproducesTheDailyInsolationOfEachBand()
    {
        // The interpolated table against the orbital module's band daily mean (Berger 1978 formula), at days
        // between the table days and at epochs between grid nodes: within 0.5 W/m² (73 days, 250-yr nodes).
        var orbit = new InterpolatedOrbit(Berger1978Orbit.Shared, -130000, -90000, 100);
        var f = new OrbitalInsolationForcing(orbit, -130000, -90000, 250, Bands, seasonal: true, daysPerYear: 73, Insolation.DefaultSolarConstantWm2, parallel: false);
        var q = new double[4];
        var rng = new Random(7);
        double worst = 0;
        for (int k = 0; k < 200; k++)
        {
            double t = -127000 + 30000 * rng.NextDouble();
            f.At(t, q);
            double day = (t - Math.Floor(t)) * SolarCalendar.YearLengthDays;
            var o = orbit.At(t);
            for (int b = 0; b < 4; b++)
                worst = Math.Max(worst, Math.Abs(q[b] - Insolation.BandDailyMeanOnDay(o, Bands[b].Item1, Bands[b].Item2, day)));
        }
        Assert.True(worst < 0.5, $"largest error {worst} W/m²");
        // Band means: the two hemispheres' seasonal cycles are out of phase (northern summer is southern winter).
        var june = new double[4];
        f.At(-100000 + 172.0 / SolarCalendar.YearLengthDays, june);
        Assert.True(june[2] > june[3] + 100, $"June: north {june[2]}, south {june[3]} W/m²");
    }

    [Fact]
    public void AnnualMeansMatchTheOrbitalModuleAndTheSeasonalMeanAveragesToThem()
    {
        var orbit = new InterpolatedOrbit(Berger1978Orbit.Shared, -300000, 0, 200);
        var annual = new OrbitalInsolationForcing(orbit, -300000, 0, 2000, Bands, seasonal: false, daysPerYear: 0, Insolation.DefaultSolarConstantWm2, parallel: false);
        var seasonal = new OrbitalInsolationForcing(orbit, -300000, 0, 1000, Bands, seasonal: true, daysPerYear: 73, Insolation.DefaultSolarConstantWm2, parallel: false);
        var qa = new double[4];
        var qs = new double[4];
        foreach (double t in new[] { -250321.0, -127000.0, -21000.5, -6000.0 })
        {
            annual.At(t, qa);
            var o = orbit.At(t);
            var mean = new double[4];
            const int n = 400;
            for (int j = 0; j < n; j++)
            {
                seasonal.At(Math.Floor(t) + (j + 0.5) / n, qs);
                for (int b = 0; b < 4; b++) mean[b] += qs[b] / n;
            }
            for (int b = 0; b < 4; b++)
            {
                double exact = Insolation.BandAnnualMean(o, Bands[b].Item1, Bands[b].Item2);
                Assert.Equal(exact, qa[b], 1e-3); // spline between 2-kyr nodes (the default spacing)
                // Time mean over the calendar year of the seasonal series (the calendar year's mean equals the orbit mean within 0.3 W/m²).
                Assert.Equal(exact, mean[b], 0.3);
            }
        }
    }

    [Theory]
    [InlineData(ScheduleShape.Constant)]
    [InlineData(ScheduleShape.Step)]
    [InlineData(ScheduleShape.Ramp)]
    [InlineData(ScheduleShape.Table)]
    public void SchedulesFollowTheirDefinitions(ScheduleShape shape)
    {
        var o = new FreshwaterScheduleOptions
        {
            Shape = shape, InitialRate_Sv = 0.1, Rate_Sv = 0.5, StartYear = 100, EndYear = 300,
            Points = [new() { Year = 0, Rate_Sv = 0 }, new() { Year = 200, Rate_Sv = 1 }, new() { Year = 400, Rate_Sv = 0.5 }],
        };
        var s = FreshwaterSchedule.Create(o, "test", 1000);
        double Sv(double t) => s.RateAt(t) / 1e6;
        switch (shape)
        {
            case ScheduleShape.Constant:
                Assert.Equal(0.5, Sv(-5), 12); Assert.Equal(0.5, Sv(777), 12); break;
            case ScheduleShape.Step:
                Assert.Equal(0.1, Sv(99.9), 12); Assert.Equal(0.5, Sv(100), 12); Assert.Equal(0.5, Sv(900), 12); break;
            case ScheduleShape.Ramp:
                Assert.Equal(0.1, Sv(50), 12); Assert.Equal(0.3, Sv(200), 12); Assert.Equal(0.5, Sv(300), 12); Assert.Equal(0.5, Sv(800), 12); break;
            case ScheduleShape.Table:
                Assert.Equal(0, Sv(-10), 12); Assert.Equal(0.25, Sv(50), 12); Assert.Equal(1, Sv(200), 12); Assert.Equal(0.75, Sv(300), 12); Assert.Equal(0.5, Sv(999), 12); break;
        }
    }

    [Fact]
    public void CsvAndParquetSeriesInterpolateLinearlyInModelTime()
    {
        // Ages in ka, increasing; the run starts at 10 ka, so model year 2500 is 7.5 ka.
        string csv = Path.Combine(_dir, "co2.csv");
        File.WriteAllText(csv, "# test series\nage_ka,co2_ppm\n0,280\n5,260\n10,240\n12,200\n");
        var s = TimeSeriesForcing.FromFile(csv, "co2_ppm", "k", 10, 10, 10000, "ppm");
        Assert.Equal(240, s.ValueAt(0), 12);
        Assert.Equal(250, s.ValueAt(2500), 12);
        Assert.Equal(280, s.ValueAt(10000), 12);

        string parquet = Path.Combine(_dir, "sl.parquet");
        WriteParquet(parquet, [0, 5, 10], [0, -60, -120]);
        var sl = TimeSeriesForcing.FromFile(parquet, "sea_level_m", "k", 10, 10, 10000, "m");
        Assert.Equal(-120, sl.ValueAt(0), 12);
        Assert.Equal(-90, sl.ValueAt(2500), 12);
    }

    [Fact]
    public void ParquetNullsAreGaps()
    {
        string parquet = Path.Combine(_dir, "gap.parquet");
        WriteParquet(parquet, [0, 5, 10], [0, null, -120]);
        var ex = Assert.Throws<ConfigurationException>(() => TimeSeriesForcing.FromFile(parquet, "sea_level_m", "Model:Forcing:SeaLevel:File", 10, 10, 10000, "m"));
        Assert.Contains("row 2", ex.Message);
        Assert.Contains("gap", ex.Message);
    }

    [Fact]
    public void GlacialSeaLevelRaisesTheEffectiveSalinityByMassBalance()
    {
        // Sea level −120 m with a 3700 m mean depth: S·D/(D + η) − S = 35·120/3580 ≈ 1.17 g/kg
        // (common practice: glacial mean salinity ≈ 1 g/kg higher; CHECK-VALUES.md).
        var o = new TropicalModelOptions();
        o.Forcing.SeaLevel.Constant_m = -120;
        var m = TropicalBoxModel.Create(o, new ForcingEnvironment { Orbit = new ConstantOrbit(new OrbitalElements(0.0167, 23.4, 102)), DurationYears = 0 });
        double factor = m.Diagnostic(TropicalDiagnostics.IceVolumeSalinityFactor, 0, m.InitialState());
        Assert.Equal(3700.0 / 3580.0, factor, 12);
        Assert.InRange(35 * (factor - 1), 1.0, 1.3);
    }

    private static void WriteParquet(string path, double[] ages, double?[] values) => WriteParquetAsync(path, ages, values).GetAwaiter().GetResult();

    private static async Task WriteParquetAsync(string path, double[] ages, double?[] values)
    {
        var age = new DataField<double>("age_ka");
        var value = new DataField<double?>("sea_level_m");
        var schema = new ParquetSchema(age, value);
        await using var stream = File.Create(path);
        await using var writer = await ParquetWriter.CreateAsync(schema, stream);
        using var group = writer.CreateRowGroup();
        await group.WriteAsync<double>(age, ages.AsMemory());
        await group.WriteAsync<double>(value, values.AsMemory());
    }
}
