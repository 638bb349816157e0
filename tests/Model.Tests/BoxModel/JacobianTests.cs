using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Physics;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// The generic right-hand side gives exact derivatives on dual numbers: they agree with central
/// differences to the differences' truncation error, for states and for parameters.
/// </summary>
public class JacobianTests
{
    [Theory]
    [InlineData(false, false)]
    [InlineData(true, false)]
    [InlineData(false, true)]
    public void DualJacobianMatchesCentralDifferences(bool seasonal, bool prognosticRecharge)
    {
        var m = Build(o =>
        {
            o.Forcing.SeasonalCycle = seasonal;
            o.Processes.Get<WarmWaterRechargeOptions>(WarmWaterRecharge.ProcessName).Prognostic = prognosticRecharge;
        }, durationYears: 10);
        var y = Equilibrium(Build(), guess: null);
        var state = m.InitialState();
        Array.Copy(y, state, y.Length);
        state[(int)Box.ColdTongue] -= 0.7;
        state[Boxes.Count + (int)Box.North] += 0.2;
        int n = m.Dimension;
        var jac = new double[n * n];
        var f = new double[n];
        AutoJacobian.OfState(m, 0.37, state, jac, f);
        var fp = new double[n];
        var fm = new double[n];
        for (int j = 0; j < n; j++)
        {
            double h = 1e-5 * Math.Max(1, Math.Abs(state[j]));
            var yp = (double[])state.Clone(); yp[j] += h;
            var ym = (double[])state.Clone(); ym[j] -= h;
            m.Evaluate<double>(0.37, yp, fp);
            m.Evaluate<double>(0.37, ym, fm);
            for (int i = 0; i < n; i++)
            {
                double fd = (fp[i] - fm[i]) / (2 * h);
                Assert.True(Math.Abs(fd - jac[i * n + j]) <= 1e-5 * (1 + Math.Abs(fd)), $"∂f{i}/∂y{j}: dual {jac[i * n + j]}, difference {fd}");
            }
        }
    }

    [Fact]
    public void ParameterDerivativeMatchesCentralDifferences()
    {
        var m = Build();
        var y = Equilibrium(m);
        var p = Parameters(m);
        foreach (var key in new[] { "Model:Processes:SurfaceFreshwater:HosingVentilationBoxes_Sv", "Model:Processes:AtmosphericTransport:ExtratropicalLoss_WmK", "Model:Boxes:ColdTongue:Area_m2" })
        {
            int k = m.ParameterIndex(key);
            var dfdp = new double[m.Dimension];
            AutoJacobian.OfParameter(m, 0, y, p, k, dfdp);
            double h = 1e-6 * Math.Max(1, Math.Abs(p[k]));
            var pp = (double[])p.Clone(); pp[k] += h;
            var pm = (double[])p.Clone(); pm[k] -= h;
            var fp = new double[m.Dimension];
            var fm = new double[m.Dimension];
            m.Evaluate<double>(0, y, pp, fp);
            m.Evaluate<double>(0, y, pm, fm);
            for (int i = 0; i < m.Dimension; i++)
            {
                double fd = (fp[i] - fm[i]) / (2 * h);
                Assert.True(Math.Abs(fd - dfdp[i]) <= 1e-5 * (1 + Math.Abs(fd)) + 1e-12, $"{key}: ∂f{i}/∂p dual {dfdp[i]}, difference {fd}");
            }
        }
    }

    [Fact]
    public void EvaluationWithOwnParametersEqualsEvaluationWithTheirCopy()
    {
        var m = Build();
        var y = Equilibrium(m);
        var a = new double[m.Dimension];
        var b = new double[m.Dimension];
        m.Evaluate<double>(1.5, y, a);
        m.Evaluate<double>(1.5, y, Parameters(m), b);
        Assert.Equal(a, b);
    }
}
