using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>Argument checking and agreement between the scalar, evaluator and grid paths.</summary>
public class InsolationApiTests
{
    private static readonly OrbitalElements Present = Berger1978Orbit.Shared.At(0);

    [Fact]
    public void Grid_fill_equals_pointwise_evaluation()
    {
        var grid = DailyInsolationGrid.Standard();
        Assert.Equal(181, grid.LatitudesDeg.Count);
        Assert.Equal(365, grid.DaysOfYear.Count);
        var values = new double[grid.Count];
        OrbitalElements lig = Berger1978Orbit.Shared.At(-127_000);
        grid.Fill(lig, values);
        var ev = new InsolationEvaluator(lig);
        for (int i = 0; i < 181; i += 9)
            for (int j = 0; j < 365; j += 11)
                Assert.Equal(ev.DailyMeanOnDay(grid.LatitudesDeg[i], grid.DaysOfYear[j]), values[i * 365 + j], 1e-10);
        Assert.Throws<ArgumentException>(() => grid.Fill(lig, new double[10]));
    }

    [Fact]
    public void Evaluator_and_static_functions_agree()
    {
        var ev = new InsolationEvaluator(Present, 1365);
        Assert.Equal(Insolation.DailyMean(Present, 37, 123, 1365), ev.DailyMean(37, 123));
        Assert.Equal(Insolation.DailyMeanOnDay(Present, -12, 300.5, 1365), ev.DailyMeanOnDay(-12, 300.5));
        Assert.Equal(Insolation.DailyMean(Present, 37, ev.TrueLongitudeOfDayDeg(55), 1365), ev.DailyMeanOnDay(37, 55), 1e-9);
        Assert.Equal(Insolation.BandDailyMean(Present, 37, 37, 123, 1365), ev.DailyMean(37, 123), 1e-12);
        Assert.Equal(Insolation.BandDailyMeanOnDay(Present, -30, 10, 55, 1365), Insolation.BandDailyMean(Present, -30, 10, ev.TrueLongitudeOfDayDeg(55), 1365), 1e-9);
    }

    [Theory]
    [InlineData(90.5)]
    [InlineData(-91.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Latitudes_outside_the_sphere_are_rejected(double lat)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.DailyMean(Present, lat, 90));
        Assert.Equal("latitudeDeg", ex.ParamName);
        Assert.Contains("[-90, 90]", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.AnnualMean(Present, lat));
        Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.CaloricHalfYears(Present, lat));
        Assert.Throws<ArgumentOutOfRangeException>(() => new DailyInsolationGrid([0.0, lat], [1.0]));
    }

    [Fact]
    public void Other_bad_arguments_name_themselves()
    {
        Assert.Equal("trueLongitudeDeg", Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.DailyMean(Present, 10, double.NaN)).ParamName);
        Assert.Equal("solarConstantWm2", Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.DailyMean(Present, 10, 10, 0)).ParamName);
        Assert.Equal("solarConstantWm2", Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.DailyMean(Present, 10, 10, double.NaN)).ParamName);
        Assert.Equal("thresholdWm2", Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.IntegratedSummerEnergy(Present, 65, -1)).ParamName);
        Assert.Equal("northDeg", Assert.Throws<ArgumentException>(() => Insolation.BandAnnualMean(Present, 10, -10)).ParamName);
        Assert.Equal("dayOfYear", Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.DailyMeanOnDay(Present, 10, 400)).ParamName);
        Assert.Equal("kind", Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.MonthlyMeans(Present, 10, (MonthKind)7)).ParamName);
        Assert.Equal("destination", Assert.Throws<ArgumentException>(() => Insolation.MonthlyMeans(Present, 10, MonthKind.Calendar, new double[11])).ParamName);

        var e = Assert.Throws<ArgumentOutOfRangeException>(() => Insolation.DailyMean(new OrbitalElements(1.0, 23, 0), 10, 10));
        Assert.Contains("Eccentricity = 1", e.Message);
        var o = Assert.Throws<ArgumentOutOfRangeException>(() => new InsolationEvaluator(new OrbitalElements(0.01, -1, 0)));
        Assert.Contains("ObliquityDeg = -1", o.Message);
    }

    [Fact]
    public void Longitudes_wrap_and_energy_arcs_are_taken_forward()
    {
        Assert.Equal(Insolation.DailyMean(Present, 50, 100), Insolation.DailyMean(Present, 50, 460), 1e-9);
        double summer = Insolation.EnergyBetweenLongitudes(Present, 50, 0, 180);
        double winter = Insolation.EnergyBetweenLongitudes(Present, 50, 180, 0);
        double annualGJ = Insolation.AnnualMean(Present, 50) * SolarCalendar.SecondsPerYear / 1e9;
        Assert.Equal(annualGJ, summer + winter, 1e-8);
        Assert.Equal(0.0, Insolation.EnergyBetweenLongitudes(Present, 50, 30, 30));
        Assert.Equal(summer, Insolation.EnergyBetweenLongitudes(Present, 50, 360, 540), 1e-9);
    }

    [Fact]
    public void Elements_components_round_trip()
    {
        var o = new OrbitalElements(0.03, 23.0, 250.0);
        OrbitalElements back = OrbitalElements.FromComponents(o.ClimaticPrecession, o.EccentricityCosPerihelion, o.ObliquityDeg);
        Assert.Equal(o.Eccentricity, back.Eccentricity, 1e-15);
        Assert.Equal(o.PerihelionDeg, back.PerihelionDeg, 1e-10);
        Assert.Equal(70.0, o.SunLongitudeAtPerihelionDeg, 1e-12);
    }
}
