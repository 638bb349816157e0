using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>The linear and the Roquet et al. (2015) simplified equations of state.</summary>
public sealed class SimpleEquationsOfStateTests
{
    private static readonly LinearEosParameters Custom = new()
    {
        ReferenceDensity_kgm3 = 1025.0,
        ReferenceTemperature_C = 15.0,
        ReferenceSalinity_gkg = 34.5,
        ThermalExpansion_perK = 1.7e-4,
        HalineContraction_perGkg = 7.8e-4,
    };

    [Fact]
    public void LinearReproducesItsOwnCoefficientsAtTheReferenceState()
    {
        // Closed form: ρ(S0, T0) = ρ0, −(1/ρ0)∂ρ/∂T = α, (1/ρ0)∂ρ/∂S = β exactly.
        var eos = new LinearEquationOfState(Custom);
        Assert.Equal(1025.0, eos.Density(34.5, 15.0, 0.0));
        Assert.Equal(1.7e-4, eos.ThermalExpansion(34.5, 15.0, 0.0));
        Assert.Equal(7.8e-4, eos.HalineContraction(34.5, 15.0, 3000.0));
    }

    [Fact]
    public void LinearIsLinearEverywhere()
    {
        // ρ = ρ0 (1 − α ΔT + β ΔS), independent of p; ρ·α = ρ0 α and α/β constant, to rounding.
        var eos = new LinearEquationOfState(Custom);
        foreach (double s in new[] { 0.0, 20.0, 36.0, 42.0 })
            foreach (double t in new[] { -2.0, 5.0, 28.0, 40.0 })
            {
                double expected = 1025.0 * (1 - 1.7e-4 * (t - 15.0) + 7.8e-4 * (s - 34.5));
                double rho = eos.Density(s, t, 0.0);
                Assert.Equal(expected, rho, 1e-12);
                Assert.Equal(rho, eos.Density(s, t, 6000.0));
                Assert.Equal(1025.0 * 1.7e-4, rho * eos.ThermalExpansion(s, t, 0.0), 1e-15);
                Assert.Equal(1025.0 * 7.8e-4, rho * eos.HalineContraction(s, t, 0.0), 1e-15);
                Assert.Equal(1.7e-4 / 7.8e-4, eos.ThermalExpansion(s, t, 0.0) / eos.HalineContraction(s, t, 0.0), 1e-14);
            }
    }

    [Fact]
    public void LinearDefaultsAreTheTextbookValues()
    {
        // α ≈ 2e-4 1/K, β ≈ 7.6e-4 per g/kg near the surface (Vallis; quoted from memory in CHECK-VALUES.md).
        var p = new LinearEosParameters();
        Assert.Equal(2e-4, p.ThermalExpansion_perK);
        Assert.Equal(7.6e-4, p.HalineContraction_perGkg);
    }

    [Fact]
    public void LinearRejectsNonFiniteCoefficientsNamingThem()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new LinearEquationOfState(new LinearEosParameters { ReferenceDensity_kgm3 = -1 }));
        Assert.Contains("ReferenceDensity_kgm3", ex.Message);
        Assert.Contains("-1", ex.Message);
        ex = Assert.Throws<ArgumentOutOfRangeException>(() => new LinearEquationOfState(new LinearEosParameters { ThermalExpansion_perK = double.NaN }));
        Assert.Contains("ThermalExpansion_perK", ex.Message);
    }

    private static readonly Roquet2015EquationOfState Roquet = new();

    [Fact]
    public void RoquetAtItsReferenceStateHasItsLinearCoefficients()
    {
        // Roquet et al. (2015), J. Phys. Oceanogr. 45, 2564, simplified EOS (coefficients in CHECK-VALUES.md):
        // at Ta = Sa = z = 0, ρ = ρ0, −∂ρ/∂T = a0, ∂ρ/∂S = b0.
        Assert.Equal(1026.0, Roquet.Density(35.0, 10.0, 0.0));
        Assert.Equal(1.6550e-1 / 1026.0, Roquet.ThermalExpansion(35.0, 10.0, 0.0), 1e-18);
        Assert.Equal(7.6554e-1 / 1026.0, Roquet.HalineContraction(35.0, 10.0, 0.0), 1e-18);
    }

    [Fact]
    public void RoquetCurvaturesAreItsCabbelingCoefficients()
    {
        // ∂²ρ/∂T² = −a0 λ1, ∂²ρ/∂S² = −b0 λ2, ∂²ρ/∂T∂S = −ν; ∂²ρ/∂T∂z = −a0 μ1 (thermobaricity).
        // ρ is quadratic, so second differences are exact up to rounding.
        const double h = 1.0;
        double R(double s, double t, double p) => Roquet.Density(s, t, p);
        Assert.Equal(-1.6550e-1 * 5.9520e-2, (R(35, 12, 0) - 2 * R(35, 11, 0) + R(35, 10, 0)) / (h * h), 1e-10);
        Assert.Equal(-7.6554e-1 * 5.4914e-4, (R(37, 10, 0) - 2 * R(36, 10, 0) + R(35, 10, 0)) / (h * h), 1e-10);
        Assert.Equal(-2.4341e-3, R(36, 11, 0) - R(36, 10, 0) - R(35, 11, 0) + R(35, 10, 0), 1e-10);
        double dz = 1000.0 * Roquet2015EquationOfState.MetresPerDbar;
        Assert.Equal(-1.6550e-1 * 1.4970e-4, (R(35, 11, 1000) - R(35, 10, 1000) - R(35, 11, 0) + R(35, 10, 0)) / dz, 1e-12);
    }

    [Fact]
    public void RoquetIsCloseToTeos10NearItsReferenceState()
    {
        // The simplified EOS was fitted to TEOS-10 (Roquet et al. 2015): near (35 g/kg, 10 °C, 0 dbar) its α and β are
        // within a few per cent of TEOS-10's (measured: 3.0 % and 1.0 %; bound 5 %).
        Assert.InRange(Roquet.ThermalExpansion(35.0, 10.0, 0.0) / Teos10.ThermalExpansion(35.0, 10.0, 0.0), 0.95, 1.05);
        Assert.InRange(Roquet.HalineContraction(35.0, 10.0, 0.0) / Teos10.HalineContraction(35.0, 10.0, 0.0), 0.95, 1.05);
    }
}
