using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models;
using Xunit;

namespace Thermostrat.Model.Tests.Models;

/// <summary>
/// Jin (1997) recharge oscillator: the Hopf point of the origin against the analytic condition on the
/// 2×2 Jacobian [[γb − c, γ], [−αb, −r]] (b = b0 μ): trace zero with positive determinant, period 2π/√det.
/// </summary>
public class RechargeOscillatorTests
{
    [Theory]
    [InlineData(true, RechargeOscillatorUnits.Nondimensional)]
    [InlineData(false, RechargeOscillatorUnits.Nondimensional)]
    [InlineData(true, RechargeOscillatorUnits.Dimensional)]
    public void HopfPointMatchesTheTraceAndDeterminantCondition(bool nonlinear, RechargeOscillatorUnits units)
    {
        var model = new RechargeOscillator(nonlinear, units, mu: 0.4);
        var p = new double[model.ParameterCount];
        model.GetParameters(p);
        double b0 = p[1], gamma = p[2], c = p[3], r = p[4], alpha = p[5];
        // Analytic: trace = γ b0 μ − c − r = 0.
        double muC = (c + r) / (gamma * b0);
        double b = b0 * muC, growth = gamma * b - c;
        double det = alpha * b * gamma - r * growth;
        Assert.True(det > 0);
        double period = 2 * Math.PI / Math.Sqrt(det);
        if (units == RechargeOscillatorUnits.Dimensional) period *= RechargeOscillator.TimeScale_yr;

        var branch = Continuation.Trace(model, "mu", [0.0, 0.0], p,
            new ContinuationOptions { ParameterMin = 0.3, ParameterMax = 1.0, Direction = ContinuationDirection.Increasing, MaxStep = 0.02 });
        var hopf = Assert.Single(branch.OfKind(SpecialPointKind.Hopf));
        Assert.True(hopf.Located);
        Assert.True(Math.Abs(hopf.Parameter - muC) <= 1e-10, $"Hopf at μ = {hopf.Parameter:R}, analytic {muC:R}");
        Assert.True(Math.Abs(hopf.Period!.Value - period) <= 1e-9 * period, $"period {hopf.Period:R}, analytic {period:R}");
        Assert.Equal(2.0 / 3.0, muC, 14); // μ_c = 2/3 for Jin's parameters (Jin 1997a; from memory).
        Assert.True(hopf.Residual <= 1e-10);
        if (!nonlinear) Assert.True(Math.Abs(hopf.FirstLyapunovCoefficient!.Value) <= 1e-6); // a linear system has l1 = 0
    }

    [Fact]
    public void FirstLyapunovCoefficientMatchesTheCubicTermInClosedForm()
    {
        // Only the cubic −e_n (h + bT)³ contributes (no quadratic terms), so Kuznetsov's eq. (3.20) reduces to
        // l1 = Re(p̄_T · C_T(q, q, q̄)) / (2ω) with C_T = −6 e_n L(q)² L(q̄), L(v) = v_h + b v_T; q, p the right and left
        // eigenvectors of [[R, γ], [−αb, −r]] for ±iω, ⟨q, q⟩ = ⟨p, q⟩ = 1 (computed here by hand from the 2×2 matrix).
        var model = new RechargeOscillator(nonlinear: true, mu: 0.4);
        var p = new double[model.ParameterCount];
        model.GetParameters(p);
        double b0 = p[1], gamma = p[2], c = p[3], r = p[4], alpha = p[5], en = p[6];
        double muC = (c + r) / (gamma * b0), b = b0 * muC, growth = gamma * b - c;
        double omega = Math.Sqrt(alpha * b * gamma - r * growth);
        var i = System.Numerics.Complex.ImaginaryOne;
        // (J − iω) q = 0 from the first row: (R − iω) q_T + γ q_h = 0.
        System.Numerics.Complex qT = gamma, qh = -(growth - i * omega);
        double qn = Math.Sqrt(qT.Magnitude * qT.Magnitude + qh.Magnitude * qh.Magnitude);
        qT /= qn; qh /= qn;
        // (Jᵀ + iω) p = 0 from the first row of Jᵀ = [[R, −αb], [γ, −r]]: (R + iω) p_T − αb p_h = 0.
        System.Numerics.Complex pT = alpha * b, ph = growth + i * omega;
        var s = System.Numerics.Complex.Conjugate(pT) * qT + System.Numerics.Complex.Conjugate(ph) * qh;
        pT /= System.Numerics.Complex.Conjugate(s);
        var l = qh + b * qT;
        double expected = (System.Numerics.Complex.Conjugate(pT) * (-6 * en) * l * l * System.Numerics.Complex.Conjugate(l)).Real / (2 * omega);

        var branch = Continuation.Trace(model, "mu", [0.0, 0.0], p,
            new ContinuationOptions { ParameterMin = 0.3, ParameterMax = 1.0, Direction = ContinuationDirection.Increasing });
        var hopf = Assert.Single(branch.OfKind(SpecialPointKind.Hopf));
        Assert.True(Math.Abs(hopf.FirstLyapunovCoefficient!.Value - expected) <= 1e-6 * Math.Abs(expected), $"l1 = {hopf.FirstLyapunovCoefficient:R}, closed form {expected:R}");
        Assert.True(expected < 0); // supercritical: a stable oscillation grows from the critical coupling
    }
}
