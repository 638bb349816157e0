using Thermostrat.Model.Analysis;
using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>The density-threshold calculator.</summary>
public sealed class DensityThresholdTests
{
    // Fixtures/Seawater/gsw_threshold_cases.csv: the same questions answered directly with gsw.rho and
    // scipy.optimize.brentq (python3-gsw 3.6.16, python3-scipy 1.10.1) by generate_threshold_cases.py.
    private static readonly SeawaterFixture Cases = SeawaterFixture.Load("gsw_threshold_cases.csv");

    public static TheoryData<string> CaseNames() => new(Cases.Rows.Select(r => r[0]));

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Teos10AnswersMatchADirectComputationWithGsw(string name)
    {
        string[] r = Cases.Rows.Single(row => row[0] == name);
        var first = new WaterMass(Cases.Value(r, "SA1"), Cases.Value(r, "CT1"), Cases.Value(r, "p1"));
        var second = new WaterMass(Cases.Value(r, "SA2"), Cases.Value(r, "CT2"), Cases.Value(r, "p2"));
        var options = new DensityThresholdOptions { ReferencePressure_dbar = Cases.OptionalValue(r, "p_ref") };
        var result = DensityThreshold.Solve(new Teos10EquationOfState(), first, second, Cases.Value(r, "H"), options);

        Assert.Equal(Cases.Value(r, "rho1"), result.DensityFirst_kgm3, 1e-9);
        Assert.Equal(Cases.Value(r, "rho2"), result.DensitySecond_kgm3, 1e-9);
        Assert.Equal(Cases.Value(r, "rho1") - Cases.Value(r, "rho2"), result.DensityDifference_kgm3, 1e-9);
        AssertChange(Cases.OptionalValue(r, "dS"), result.SalinityChange_gkg, 1e-8);
        AssertChange(Cases.OptionalValue(r, "h_f"), result.FreshwaterInput_m, 1e-6);
        AssertChange(Cases.OptionalValue(r, "dT"), result.TemperatureChange_K, 1e-7);
    }

    private static void AssertChange(double? expected, ThresholdChange actual, double tolerance)
    {
        if (expected is double e)
        {
            Assert.True(actual.Found, $"expected {e}, got: {actual}");
            Assert.Equal(e, actual.Value, tolerance);
            Assert.Null(actual.NoSolutionReason);
        }
        else
        {
            Assert.False(actual.Found, $"expected no solution, got {actual.Value}");
            Assert.True(double.IsNaN(actual.Value));
            Assert.False(string.IsNullOrWhiteSpace(actual.NoSolutionReason));
        }
    }

    [Fact]
    public void LinearAnswersAreTheClosedForm()
    {
        // Linear EOS: ρ0 β ΔS = ρ2 − ρ1 and −ρ0 α ΔT = ρ2 − ρ1 exactly; R = α ΔT / (β ΔS) with the configured α/β;
        // h_f = H (S/S' − 1).
        var p = new LinearEosParameters();
        var eos = new LinearEquationOfState(p);
        var first = new WaterMass(36.0, 24.0);
        var second = new WaterMass(34.8, 18.0, 300.0);
        var result = DensityThreshold.Solve(eos, first, second, 40.0);

        double rho1 = p.ReferenceDensity_kgm3 * (1 - p.ThermalExpansion_perK * (24 - 10) + p.HalineContraction_perGkg * (36 - 35));
        double rho2 = p.ReferenceDensity_kgm3 * (1 - p.ThermalExpansion_perK * (18 - 10) + p.HalineContraction_perGkg * (34.8 - 35));
        double dS = (rho2 - rho1) / (p.ReferenceDensity_kgm3 * p.HalineContraction_perGkg);
        double dT = -(rho2 - rho1) / (p.ReferenceDensity_kgm3 * p.ThermalExpansion_perK);
        Assert.Equal(rho1, result.DensityFirst_kgm3, 1e-10);
        Assert.Equal(rho2, result.DensitySecond_kgm3, 1e-10);
        Assert.Equal(dS, result.SalinityChange_gkg.Value, 1e-9);
        Assert.Equal(dT, result.TemperatureChange_K.Value, 1e-9);
        Assert.Equal(40.0 * (36.0 / (36.0 + dS) - 1.0), result.FreshwaterInput_m.Value, 1e-9);
        Assert.Equal(p.ThermalExpansion_perK * 6.0 / (p.HalineContraction_perGkg * 1.2), result.DensityRatio, 1e-12);
    }

    [Fact]
    public void FresheningAnswerRestoresEqualDensityUnderEveryEquationOfState()
    {
        // Side by side: each equation of state's own answer makes its own densities equal (exact property),
        // and the answers differ between equations of state by their physics, not by much.
        var first = new WaterMass(35.3, 3.0, 0.0);
        var second = new WaterMass(34.9, 4.0, 0.0);
        var results = DensityThreshold.SolveAll(first, second, 100.0);
        Assert.Equal(EquationsOfState.Names, results.Select(r => r.EquationOfState));
        foreach (var r in results)
        {
            IEquationOfState eos = EquationsOfState.Create(r.EquationOfState);
            Assert.True(r.SalinityChange_gkg.Found, r.EquationOfState);
            Assert.True(r.SalinityChange_gkg.Value < 0, "the denser first water mass must freshen");
            Assert.True(r.FreshwaterInput_m.Value > 0);
            Assert.Equal(r.DensitySecond_kgm3, eos.Density(35.3 + r.SalinityChange_gkg.Value, 3.0, 0.0), 1e-9);
            Assert.Equal(r.DensitySecond_kgm3, eos.Density(35.3, 3.0 + r.TemperatureChange_K.Value, 0.0), 1e-9);
        }
        var teos = DensityThreshold.Solve(new Teos10EquationOfState(), first, second, 100.0);
        Assert.Equal(teos.SalinityChange_gkg.Value, results.Single(r => r.EquationOfState == "teos10").SalinityChange_gkg.Value);
    }

    [Fact]
    public void EqualWaterMassesNeedNoChange()
    {
        var w = new WaterMass(35.0, 20.0, 100.0);
        var result = DensityThreshold.Solve(new Teos10EquationOfState(), w, w, 50.0);
        Assert.Equal(0.0, result.DensityDifference_kgm3);
        Assert.Equal(0.0, result.SalinityChange_gkg.Value);
        Assert.Equal(0.0, result.FreshwaterInput_m.Value);
        Assert.Equal(0.0, result.TemperatureChange_K.Value);
        Assert.True(double.IsNaN(result.DensityRatio)); // 0/0, as documented
    }

    [Fact]
    public void NoSolutionIsReportedClearly()
    {
        // ρ(S ≤ 42, 40 °C) < ρ(42, −2 °C): no salinity in range equalises; ρ(10, T) < ρ(42, −2) for every T.
        var result = DensityThreshold.Solve(new Teos10EquationOfState(), new WaterMass(10.0, 40.0), new WaterMass(42.0, -2.0), 50.0);
        Assert.False(result.SalinityChange_gkg.Found);
        Assert.Contains("no salinity in 0 to 42 g/kg", result.SalinityChange_gkg.NoSolutionReason);
        Assert.Contains("kg/m³", result.SalinityChange_gkg.NoSolutionReason);
        Assert.False(result.FreshwaterInput_m.Found);
        Assert.False(result.TemperatureChange_K.Found);
        Assert.Contains("no temperature in -2 to 40 °C", result.TemperatureChange_K.NoSolutionReason);
        Assert.StartsWith("no solution:", result.TemperatureChange_K.ToString());
    }

    [Fact]
    public void TemperatureChangeTakesTheRootNearestTheFirstOnEitherSideOfTheDensityMaximum()
    {
        // Fresh water has its density maximum near 4 °C (common practice), so two temperatures give a density
        // just below the maximum; the one nearest the start is reported (gsw cases 'fresh_water_*' check the values).
        var eos = new Teos10EquationOfState();
        var r = DensityThreshold.Solve(eos, new WaterMass(0.5, 2.0), new WaterMass(0.5, 5.0), 10.0);
        double tNew = 2.0 + r.TemperatureChange_K.Value;
        Assert.InRange(tNew, 2.0, 5.0 - 1e-3);
        Assert.Equal(eos.Density(0.5, 5.0, 0.0), eos.Density(0.5, tNew, 0.0), 1e-9);
    }

    [Fact]
    public void FreshwaterConventionAndItsLimits()
    {
        // S' = S H/(H + h_f) ⇒ h_f = H (S/S' − 1).
        Assert.Equal(100.0 * (35.0 / 34.0 - 1.0), DensityThreshold.Freshwater(35.0, ThresholdChange.Solved(-1.0, 3), 100.0).Value, 1e-12);
        Assert.True(DensityThreshold.Freshwater(35.0, ThresholdChange.Solved(1.0, 3), 100.0).Value < 0); // evaporation
        var toZero = DensityThreshold.Freshwater(10.0, ThresholdChange.Solved(-10.0, 3), 100.0);
        Assert.False(toZero.Found);
        Assert.Contains("0 g/kg", toZero.NoSolutionReason);
        var freshLayer = DensityThreshold.Freshwater(0.0, ThresholdChange.Solved(2.0, 3), 100.0);
        Assert.False(freshLayer.Found);
        Assert.Contains("fresh", freshLayer.NoSolutionReason);
    }

    [Theory]
    [InlineData(-0.1, 10.0, 0.0, "salinity", "-0.1", "0 to 42 g/kg")]
    [InlineData(42.5, 10.0, 0.0, "salinity", "42.5", "0 to 42 g/kg")]
    [InlineData(double.NaN, 10.0, 0.0, "salinity", "NaN", "0 to 42 g/kg")]
    [InlineData(35.0, -2.5, 0.0, "temperature", "-2.5", "-2 to 40 °C")]
    [InlineData(35.0, 41.0, 0.0, "temperature", "41", "-2 to 40 °C")]
    [InlineData(35.0, double.NaN, 0.0, "temperature", "NaN", "-2 to 40 °C")]
    [InlineData(35.0, 10.0, -1.0, "pressure_dbar", "-1", "0 to 8000 dbar")]
    public void BadWaterMassesAreRejectedNamingTheValueAndTheRange(double s, double t, double p, string name, string value, string range)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new WaterMass(s, t, p));
        Assert.Equal(name, ex.ParamName);
        Assert.Contains($"{name} = {value}", ex.Message);
        Assert.Contains(range, ex.Message);
    }

    [Theory]
    [InlineData(-10.0)]
    [InlineData(0.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void BadLayerThicknessIsRejected(double thickness)
    {
        var w = new WaterMass(35.0, 10.0);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => DensityThreshold.Solve(new LinearEquationOfState(), w, w, thickness));
        Assert.Equal("layerThickness_m", ex.ParamName);
        Assert.Contains("greater than 0", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => DensityThreshold.SolveAll(w, w, thickness));
    }

    [Fact]
    public void BadOptionsAreRejectedNamingThem()
    {
        var w = new WaterMass(35.0, 10.0);
        var eos = new LinearEquationOfState();
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() =>
            DensityThreshold.Solve(eos, w, w, 10.0, new DensityThresholdOptions { ReferencePressure_dbar = 9000 }));
        Assert.Contains("ReferencePressure_dbar = 9000", ex.Message);
        ex = Assert.Throws<ArgumentOutOfRangeException>(() =>
            DensityThreshold.Solve(eos, w, w, 10.0, new DensityThresholdOptions { DensityTolerance_kgm3 = 0 }));
        Assert.Contains("DensityTolerance_kgm3", ex.Message);
    }

    [Fact]
    public void AnIterationCutShortIsReportedAsNoSolution()
    {
        // One iteration cannot reach 1e-10 kg/m³ from ΔS = 0 when ΔS ≈ −0.6 g/kg (the subpolar gsw case): the
        // calculator must say so rather than report the unconverged iterate.
        var options = new DensityThresholdOptions { MaxIterations = 1 };
        var r = DensityThreshold.Solve(new Teos10EquationOfState(), new WaterMass(35.2, 4.0), new WaterMass(34.9, 6.0), 100.0, options);
        Assert.False(r.SalinityChange_gkg.Found);
        Assert.Contains("MaxIterations = 1", r.SalinityChange_gkg.NoSolutionReason);
        var converged = DensityThreshold.Solve(new Teos10EquationOfState(), new WaterMass(35.2, 4.0), new WaterMass(34.9, 6.0), 100.0);
        Assert.InRange(converged.SalinityChange_gkg.Iterations, 2, 10); // Newton: a handful of steps
    }

    [Fact]
    public void WaterMassAtDepthUsesThePressureOfThatDepth()
    {
        // Saunders (1981); tested against gsw.p_from_z in ConversionTests.
        var w = WaterMass.AtDepth(34.9, 2.0, 4000.0);
        Assert.Equal(SeawaterDepth.PressureFromDepth(4000.0), w.Pressure_dbar);
        Assert.InRange(w.Pressure_dbar, 4058.0, 4063.0); // gsw.p_from_z(-4000, 0) = 4060.5 dbar (python3-gsw 3.6.16)
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => WaterMass.AtDepth(34.9, 2.0, 7990.0));
        Assert.Contains("depth_m = 7990", ex.Message);
    }
}
