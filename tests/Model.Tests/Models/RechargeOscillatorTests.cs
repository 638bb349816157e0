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
    }
}
