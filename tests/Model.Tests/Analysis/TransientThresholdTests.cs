using MathNet.Numerics.RootFinding;
using Thermostrat.Model.Analysis;
using Xunit;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>Quasi-static ramps and collapse thresholds by transient runs against closed forms.</summary>
public class TransientThresholdTests
{
    [Fact]
    public void RampOvershootsTheSaddleNodeByTheAiryDelay()
    {
        // Slow passage through a saddle-node, x' = μ(t) − x², μ = μ0 − εt: the run escapes at
        // μ ≈ a1 ε^{2/3}, a1 = −2.33810741 the first zero of Ai (Haberman 1979, SIAM J. Appl. Math. 37, 69;
        // a1 from Abramowitz and Stegun Table 10.13, confirmed with scipy.special.ai_zeros). With escape
        // defined as x < −10 the exact value is −0.0232810818685 for ε = 1e-3 (SciPy 1.10 solve_ivp LSODA,
        // rtol 1e-12, event x = −10; computed here), ε/10 = 1e-4 short of the asymptotic blow-up.
        const double eps = 1e-3;
        var sys = new SaddleNodeNormalForm(0.1);
        var branch = Continuation.Trace(sys, "mu", [Math.Sqrt(0.1)], new ContinuationOptions { ParameterMin = -0.2, ParameterMax = 0.2 });
        var ramp = RampRun.Run(sys, "mu", [0.3], [0.1], new RampOptions
        {
            StartValue = 0.1, EndValue = -0.2, Rate = eps, SampleInterval = 0.005, StopWhen = x => x[0] < -20,
        });
        Assert.True(ramp.EndedEarly);
        Assert.Contains("stop condition", ramp.Message);
        var cmp = RampRun.Compare(ramp, branch, departureTolerance: 10);
        Assert.NotNull(cmp.Fold);
        Assert.Equal(SpecialPointKind.Fold, cmp.Fold!.Kind);
        Assert.True(Math.Abs(cmp.DepartureParameter!.Value - -0.0232810818685) <= 2e-6, $"departure at μ = {cmp.DepartureParameter:R}");
        Assert.True(Math.Abs(cmp.Overshoot!.Value - 0.0232810818685) <= 2e-6);
        Assert.True(Math.Abs(cmp.Overshoot.Value - 2.33810741 * Math.Pow(eps, 2.0 / 3)) <= 2e-4); // the asymptotic law, within ε/10 + sampling
        Assert.Contains("beyond the Fold", cmp.Summary);
        // Before the fold the run lags the stable branch x = √μ by O(ε): distance well below 0.1.
        for (int k = 0; k < ramp.Times.Length; k++)
            if (ramp.ParameterValues[k] > 0.02) Assert.True(cmp.Distance[k] < 0.05, $"lag {cmp.Distance[k]} at μ = {ramp.ParameterValues[k]}");
    }

    [Fact]
    public void RampWithACallerSuppliedIntegratorAgreesWithTheBuiltInSolve()
    {
        // The same ramp driven sample by sample through a TransientIntegrator (classical RK4, fixed step 1e-3)
        // must give the same departure as one adaptive solve (both approximate the exact value above).
        const double eps = 1e-3;
        var sys = new SaddleNodeNormalForm(0.1);
        var branch = Continuation.Trace(sys, "mu", [Math.Sqrt(0.1)], new ContinuationOptions { ParameterMin = -0.2, ParameterMax = 0.2 });
        var rk4 = TransientIntegrators.FromSolver(new Thermostrat.Model.Numerics.Ode.SolverOptions
        {
            Method = Thermostrat.Model.Numerics.Ode.OdeMethod.RungeKutta4, FixedStep = 1e-3,
        });
        var options = new RampOptions { StartValue = 0.1, EndValue = -0.2, Rate = eps, SampleInterval = 0.01, StopWhen = x => x[0] < -20 };
        var viaDelegate = RampRun.Compare(RampRun.Run(sys, "mu", [0.3], [0.1], options with { Integrator = rk4 }), branch, 10);
        var builtIn = RampRun.Compare(RampRun.Run(sys, "mu", [0.3], [0.1], options), branch, 10);
        Assert.True(Math.Abs(viaDelegate.DepartureParameter!.Value - builtIn.DepartureParameter!.Value) <= 1e-5,
            $"{viaDelegate.DepartureParameter:R} vs {builtIn.DepartureParameter:R}");
        Assert.True(Math.Abs(viaDelegate.DepartureParameter.Value - -0.0232810818685) <= 2e-5);
    }

    [Fact]
    public void SlowerRampsOvershootLess()
    {
        // Haberman (1979): overshoot ∝ ε^{2/3}; halving ε scales it by 2^{-2/3} ≈ 0.63 (to within the ε/L escape correction).
        var sys = new SaddleNodeNormalForm(0.05);
        var branch = Continuation.Trace(sys, "mu", [Math.Sqrt(0.05)], new ContinuationOptions { ParameterMin = -0.2, ParameterMax = 0.2 });
        double Overshoot(double eps)
        {
            var ramp = RampRun.Run(sys, "mu", [0.2], [0.05], new RampOptions { StartValue = 0.05, EndValue = -0.2, Rate = eps, SampleInterval = 0.01, StopWhen = x => x[0] < -200 });
            return RampRun.Compare(ramp, branch, 100).Overshoot!.Value;
        }
        double ratio = Overshoot(5e-4) / Overshoot(1e-3);
        Assert.True(Math.Abs(ratio - Math.Pow(0.5, 2.0 / 3)) <= 0.01, $"ratio {ratio}");
    }

    [Fact]
    public void ThresholdBisectionFindsTheClosedFormCollapseParameter()
    {
        // x' = μ − x² from x = 1: for μ = −m < 0 it reaches x = −1 after T(m) = (2/√m)·atan(1/√m) (elementary
        // integral of dx/(x² + m)); with runs of length 10 the collapse threshold solves T(m) = 10:
        // μ* = −0.0690467818112 (computed here with MathNet's Brent; SciPy brentq gives −0.06904678181117094).
        double mStar = Brent.FindRoot(m => 2 / Math.Sqrt(m) * Math.Atan(1 / Math.Sqrt(m)) - 10, 1e-6, 1, 1e-15, 200);
        var sys = new SaddleNodeNormalForm(0);
        var fold = Continuation.Trace(sys, "mu", [1.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 2 }).OfKind(SpecialPointKind.Fold);
        var result = ThresholdBisection.Find(sys, "mu", [1.0], [0.0], new ThresholdOptions
        {
            Lower = -0.5, Upper = 0.5, Duration = 10, Diagnostic = x => x[0], Level = -1, RelativeLevel = false,
            Tolerance = 1e-9, CheckInterval = 0.05, Folds = fold,
        });
        Assert.True(result.Bracketed);
        Assert.True(Math.Abs(result.Threshold - -mStar) <= 1e-6, $"threshold {result.Threshold:R} vs {-mStar:R}");
        Assert.True(result.BracketWidth <= 1e-9);
        Assert.True(result.CollapsedAt < result.NotCollapsedAt); // collapse for μ below the threshold
        Assert.Equal(SpecialPointKind.Fold, result.NearestFold!.Kind);
        Assert.Equal(result.Threshold - result.NearestFold.Parameter, result.DifferenceFromFold!.Value, 12);
        Assert.True(Math.Abs(result.NearestFold.Parameter) <= 1e-10);
        Assert.Contains("bracket", result.Summary);
    }

    [Fact]
    public void ThresholdNotBracketedIsReportedAndBadSettingsAreRejected()
    {
        var sys = new SaddleNodeNormalForm(0);
        var none = ThresholdBisection.Find(sys, "mu", [1.0], [0.0], new ThresholdOptions
        {
            Lower = 0.1, Upper = 0.5, Duration = 10, Diagnostic = x => x[0], Level = -1, RelativeLevel = false,
        });
        Assert.False(none.Bracketed);
        Assert.Contains("does not collapse at both ends", none.Summary);
        Assert.Equal(2, none.Runs.Count);
        var e = Assert.Throws<ArgumentException>(() => ThresholdBisection.Find(sys, "mu", [1.0], [0.0], new ThresholdOptions
        {
            Lower = 0.5, Upper = 0.1, Duration = 10, Diagnostic = x => x[0],
        }));
        Assert.Contains("empty or inverted", e.Message);
        Assert.Throws<ArgumentException>(() => ThresholdBisection.Find(sys, "nu", [1.0], [0.0], new ThresholdOptions
        {
            Lower = 0.1, Upper = 0.5, Duration = 10, Diagnostic = x => x[0],
        }));
    }
}
