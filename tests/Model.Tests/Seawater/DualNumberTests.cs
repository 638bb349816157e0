using Thermostrat.Model.Numerics;
using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>
/// The equations of state seen through forward-mode dual numbers: the derivative that a model
/// Jacobian obtains from <c>Density&lt;Dual&gt;</c> must be the analytic one, −ρα in temperature and
/// ρβ in salinity (an exact identity of the definitions α = −(1/ρ)∂ρ/∂T, β = (1/ρ)∂ρ/∂S).
/// </summary>
public sealed class DualNumberTests
{
    public static TheoryData<string> AllNames() => new(EquationsOfState.Names);

    private static IEnumerable<(double S, double T, double P)> Grid()
    {
        foreach (double s in new[] { 0.0, 5.0, 34.5, 35.16504, 42.0 })
            foreach (double t in new[] { -2.0, 4.0, 18.0, 40.0 })
                foreach (double p in new[] { 0.0, 2500.0, 8000.0 })
                    yield return (s, t, p);
    }

    [Theory]
    [MemberData(nameof(AllNames))]
    public void DualDerivativeOfDensityIsMinusRhoAlphaInTemperature(string name)
    {
        IEquationOfState eos = EquationsOfState.Create(name);
        Assertions.AllWithin($"{name} ∂ρ/∂T by dual numbers vs −ρα",
            Grid().Select(g => ($"S {g.S}, T {g.T}, p {g.P}",
                -eos.Density(g.S, g.T, g.P) * eos.ThermalExpansion(g.S, g.T, g.P),
                eos.Density(Dual.Constant(g.S), Dual.Variable(g.T), Dual.Constant(g.P)).Derivative)),
            expected => 1e-12 * Math.Max(Math.Abs(expected), 1e-2));
    }

    [Theory]
    [MemberData(nameof(AllNames))]
    public void DualDerivativeOfDensityIsRhoBetaInSalinity(string name)
    {
        IEquationOfState eos = EquationsOfState.Create(name);
        Assertions.AllWithin($"{name} ∂ρ/∂S by dual numbers vs ρβ",
            Grid().Select(g => ($"S {g.S}, T {g.T}, p {g.P}",
                eos.Density(g.S, g.T, g.P) * eos.HalineContraction(g.S, g.T, g.P),
                eos.Density(Dual.Variable(g.S), Dual.Constant(g.T), Dual.Constant(g.P)).Derivative)),
            expected => 1e-12 * Math.Max(Math.Abs(expected), 1e-2));
    }

    [Theory]
    [MemberData(nameof(AllNames))]
    public void DualValuesEqualDoubleValues(string name)
    {
        // The generic code gives the same value for Dual as for double (the derivative part does not feed back).
        IEquationOfState eos = EquationsOfState.Create(name);
        foreach (var g in Grid())
        {
            Assert.Equal(eos.Density(g.S, g.T, g.P), eos.Density(Dual.Variable(g.S), (Dual)g.T, (Dual)g.P).Value);
            Assert.Equal(eos.ThermalExpansion(g.S, g.T, g.P), eos.ThermalExpansion((Dual)g.S, Dual.Variable(g.T), (Dual)g.P).Value);
            Assert.Equal(eos.HalineContraction(g.S, g.T, g.P), eos.HalineContraction((Dual)g.S, (Dual)g.T, Dual.Variable(g.P)).Value);
        }
    }

    [Fact]
    public void Eos80StaysFiniteForDualNumbersInFreshWater()
    {
        // S^{3/2} at S = 0: value 0 and derivative 0, not 0·∞ (see Eos80 remarks).
        var eos = new Eos80EquationOfState();
        Dual rho = eos.Density(Dual.Variable(0.0), (Dual)10.0, (Dual)0.0);
        Assert.True(double.IsFinite(rho.Derivative));
        Dual beta = eos.HalineContraction(Dual.Variable(0.0), (Dual)10.0, (Dual)0.0);
        Assert.True(double.IsFinite(beta.Value) && double.IsFinite(beta.Derivative));
        Assert.Equal(eos.HalineContraction(0.0, 10.0, 0.0), beta.Value);
    }
}
