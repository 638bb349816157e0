using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Orbital;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>Bad input fails fast with a ConfigurationException naming the key, the value and what is allowed.</summary>
public class BadInputTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("thermostrat-boxmodel-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static ConfigurationException Fails(Action<TropicalModelOptions> edit, double durationYears = 1000, double startAgeKa = 10, string baseDirectory = "") =>
        Assert.Throws<ConfigurationException>(() =>
        {
            var o = new TropicalModelOptions();
            edit(o);
            TropicalBoxModel.Create(o, new ForcingEnvironment { Orbit = new ConstantOrbit(Present), DurationYears = durationYears, StartAgeKa = startAgeKa, BaseDirectory = baseDirectory });
        });

    [Fact]
    public void UnknownProcessName()
    {
        var ex = Fails(o => o.Processes["Ventilatoin"] = new ProcessOptions());
        Assert.Contains("Model:Processes:Ventilatoin is not a known process", ex.Message);
        Assert.Contains("Ventilation", ex.Message);
    }

    [Fact]
    public void NegativeAreaOrThickness()
    {
        var ex = Fails(o => o.Boxes.ColdTongue.Area_m2 = -6e12);
        Assert.Contains("Model:Boxes:ColdTongue:Area_m2 = -6000000000000", ex.Message);
        Assert.Contains("> 0", ex.Message);
        ex = Fails(o => o.Boxes.Deep.Thickness_m = -10);
        Assert.Contains("Model:Boxes:Deep:Thickness_m = -10", ex.Message);
    }

    [Fact]
    public void LatitudeOutsideNinetyDegrees()
    {
        var ex = Fails(o => o.Boxes.North.NorthDeg = 95);
        Assert.Contains("Model:Boxes:North:NorthDeg = 95", ex.Message);
        Assert.Contains("<= 90", ex.Message);
        ex = Fails(o => { o.Boxes.South.SouthDeg = -30; o.Boxes.South.NorthDeg = -40; });
        Assert.Contains("Model:Boxes:South:NorthDeg = -40 is south of", ex.Message);
    }

    [Fact]
    public void UnknownEquationOfState()
    {
        var ex = Fails(o => o.EquationOfState = "teos11");
        Assert.Contains("Model:EquationOfState = 'teos11'", ex.Message);
        Assert.Contains("teos10", ex.Message);
    }

    private string Csv(string name, string text)
    {
        string path = Path.Combine(_dir, name);
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void ForcingFileWithAGap()
    {
        string path = Csv("gap.csv", "age_ka,co2_ppm\n10,250\n9,\n8,260\n0,280\n");
        var ex = Fails(o => o.Forcing.Co2.File = path);
        Assert.Contains("Model:Forcing:Co2:File", ex.Message);
        Assert.Contains("line 3", ex.Message);
        Assert.Contains("gap", ex.Message);
        // A spacing wider than MaxGap_kyr is a gap too.
        path = Csv("wide.csv", "age_ka,co2_ppm\n30,250\n5,260\n0,280\n");
        ex = Fails(o => o.Forcing.Co2.File = path);
        Assert.Contains("a gap of 25 kyr", ex.Message);
        Assert.Contains("at most 10 kyr", ex.Message);
    }

    [Fact]
    public void ForcingFileUnsortedOrNonFinite()
    {
        string path = Csv("unsorted.csv", "age_ka,sea_level_m\n10,-50\n8,-40\n9,-45\n0,0\n");
        var ex = Fails(o => o.Forcing.SeaLevel.File = path);
        Assert.Contains("Model:Forcing:SeaLevel:File", ex.Message);
        Assert.Contains("out of order", ex.Message);
        path = Csv("nan.csv", "age_ka,sea_level_m\n10,-50\n5,NaN\n0,0\n");
        ex = Fails(o => o.Forcing.SeaLevel.File = path);
        Assert.Contains("sea_level_m = NaN is not finite", ex.Message);
        path = Csv("repeat.csv", "age_ka,sea_level_m\n10,-50\n5,-3\n5,-2\n0,0\n");
        ex = Fails(o => o.Forcing.SeaLevel.File = path);
        Assert.Contains("a repeated time", ex.Message);
    }

    [Fact]
    public void ForcingFileThatDoesNotCoverTheRunOrIsMissing()
    {
        string path = Csv("short.csv", "age_ka,co2_ppm\n10,250\n5,280\n");
        var ex = Fails(o => o.Forcing.Co2.File = path, durationYears: 10000);
        Assert.Contains("covers ages 10 to 5 ka but the run needs ages 10 to 0 ka", ex.Message);
        ex = Fails(o => o.Forcing.Co2.File = Path.Combine(_dir, "absent.csv"));
        Assert.Contains("file not found", ex.Message);
    }

    [Fact]
    public void ScheduleThatStartsAfterTheRunEnds()
    {
        var ex = Fails(o => { o.Forcing.Freshwater.North.Shape = ScheduleShape.Step; o.Forcing.Freshwater.North.StartYear = 5000; o.Forcing.Freshwater.North.Rate_Sv = 0.1; });
        Assert.Contains("Model:Forcing:Freshwater:North:StartYear = 5000 is after the end of the run (year 1000)", ex.Message);
        ex = Fails(o => { o.Forcing.Freshwater.South.Shape = ScheduleShape.Table; o.Forcing.Freshwater.South.Points = [new() { Year = 2000, Rate_Sv = 0 }, new() { Year = 3000, Rate_Sv = 1 }]; });
        Assert.Contains("Model:Forcing:Freshwater:South:Points:0:Year = 2000 is after the end of the run", ex.Message);
        ex = Fails(o => { o.Forcing.Freshwater.South.Shape = ScheduleShape.Ramp; o.Forcing.Freshwater.South.StartYear = 500; o.Forcing.Freshwater.South.EndYear = 100; });
        Assert.Contains("EndYear = 100 is not after", ex.Message);
    }

    [Fact]
    public void NonFiniteOrOutOfRangeParameters()
    {
        var ex = Fails(o => o.Processes.Get<Physics.VentilationOptions>("Ventilation").ReferenceContrast_kgm3 = double.NaN);
        Assert.Contains("Model:Processes:Ventilation:ReferenceContrast_kgm3 = NaN is not a finite number", ex.Message);
        ex = Fails(o => o.Processes.Get<Physics.LowCloudOptions>("LowCloud").Extratropical.CloudAlbedo = 1.5);
        Assert.Contains("Model:Processes:LowCloud:Extratropical:CloudAlbedo = 1.5 is out of range", ex.Message);
    }

    [Fact]
    public void RunOptionsOutsideTheModelsForcingSpan()
    {
        var m = Build(durationYears: 100);
        var ex = Assert.Throws<ConfigurationException>(() => TropicalRun.Execute(m, new RunOptions { DurationYears = 1000, OutputIntervalYears = 10 }, new NullSink()));
        Assert.Contains("do not fit the model", ex.Message);
        ex = Assert.Throws<ConfigurationException>(() => TropicalRun.Execute(m, new RunOptions { DurationYears = 50, OutputIntervalYears = 100 }, new NullSink()));
        Assert.Contains("Run:OutputIntervalYears = 100 exceeds Run:DurationYears = 50", ex.Message);
    }

    private sealed class NullSink : IRowSink
    {
        public void Begin(IReadOnlyList<ColumnInfo> columns) { }
        public void Write(ReadOnlySpan<double> row) { }
        public void End(RunSummary summary) { }
    }
}
