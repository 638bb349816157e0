using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>Properties every equation of state must have, and the factory.</summary>
public sealed class EquationOfStateTests
{
    public static TheoryData<string> AllNames() => new(EquationsOfState.Names);

    private static IEnumerable<(double S, double T, double P)> Grid()
    {
        foreach (double s in new[] { 0.0, 2.0, 20.0, 34.0, 35.0, 36.5, 42.0 })
            foreach (double t in new[] { -2.0, 0.0, 3.98, 10.0, 25.0, 40.0 })
                foreach (double p in new[] { 0.0, 1000.0, 5000.0, 8000.0 })
                    yield return (s, t, p);
    }

    [Theory]
    [MemberData(nameof(AllNames))]
    public void ThermalExpansionIsMinusTheNormalisedCentralDifferenceOfDensity(string name)
    {
        // Exact derivative vs central finite difference, h = 1e-3 K: truncation O(h²) ≈ 1e-13 1/K, rounding
        // ≈ 1e-16·ρ/(h ρ) ≈ 1e-13 1/K; α is of order 1e-4, so 1e-10 absolute is a tight, safe bound.
        IEquationOfState eos = EquationsOfState.Create(name);
        const double h = 1e-3;
        Assertions.AllWithin($"{name} α vs −(1/ρ)∂ρ/∂T",
            Grid().Select(g => ($"S {g.S}, T {g.T}, p {g.P}",
                -(eos.Density(g.S, g.T + h, g.P) - eos.Density(g.S, g.T - h, g.P)) / (2 * h) / eos.Density(g.S, g.T, g.P),
                eos.ThermalExpansion(g.S, g.T, g.P))),
            1e-10);
    }

    [Theory]
    [MemberData(nameof(AllNames))]
    public void HalineContractionIsTheNormalisedCentralDifferenceOfDensity(string name)
    {
        // As above with h = 1e-3 g/kg. The grid's S = 0 points are moved to S = 0.5 g/kg: EOS-80's S^{3/2} terms have
        // an unbounded third derivative at S = 0, which spoils a central difference there (not the analytic β).
        IEquationOfState eos = EquationsOfState.Create(name);
        const double h = 1e-3;
        Assertions.AllWithin($"{name} β vs (1/ρ)∂ρ/∂S",
            Grid().Select(g => (S: Math.Max(g.S, 0.5), g.T, g.P)).Select(g => ($"S {g.S}, T {g.T}, p {g.P}",
                (eos.Density(g.S + h, g.T, g.P) - eos.Density(g.S - h, g.T, g.P)) / (2 * h) / eos.Density(g.S, g.T, g.P),
                eos.HalineContraction(g.S, g.T, g.P))),
            1e-10);
    }

    [Theory]
    [MemberData(nameof(AllNames))]
    public void ValuesAreOceanic(string name)
    {
        // Common practice: seawater density 1020–1030 kg/m³ at the surface for S ≈ 35, T 0–30 °C; α > 0, β > 0 there.
        IEquationOfState eos = EquationsOfState.Create(name);
        foreach (double t in new[] { 0.0, 15.0, 30.0 })
        {
            Assert.InRange(eos.Density(35.0, t, 0.0), 1020.0, 1030.0);
            Assert.InRange(eos.ThermalExpansion(35.0, t, 0.0), 0.0, 4e-4);
            Assert.InRange(eos.HalineContraction(35.0, t, 0.0), 6.5e-4, 8.5e-4);
        }
        Assert.Equal(name, eos.Name);
    }

    [Fact]
    public void FactoryKnowsEveryNameAndDefaultsToTeos10()
    {
        Assert.Equal(["linear", "roquet2015", "eos80", "teos10"], EquationsOfState.Names);
        Assert.Equal("teos10", EquationsOfState.DefaultName);
        Assert.IsType<Teos10EquationOfState>(EquationsOfState.Create("TEOS10"));
        Assert.IsType<LinearEquationOfState>(EquationsOfState.Create(" linear "));
    }

    [Fact]
    public void FactoryRejectsAnUnknownNameListingTheAllowedOnes()
    {
        var ex = Assert.Throws<ArgumentException>(() => EquationsOfState.Create("unesco"));
        Assert.Contains("'unesco'", ex.Message);
        foreach (string n in EquationsOfState.Names) Assert.Contains(n, ex.Message);
        Assert.Equal("name", ex.ParamName);
    }

    [Fact]
    public void FactoryPassesLinearCoefficients()
    {
        var eos = (LinearEquationOfState)EquationsOfState.Create("linear", new LinearEosParameters { ThermalExpansion_perK = 1.5e-4 });
        Assert.Equal(1.5e-4, eos.Parameters.ThermalExpansion_perK);
    }
}
