using Thermostrat.Model.Analysis;
using Xunit;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>Bogdanov–Takens points, closed branches and non-smooth kinks against exact answers.</summary>
public class SpecialCaseTests
{
    private static Branch BtBranch() =>
        Continuation.Trace(new BogdanovTakensNormalForm(-0.5, -1), "beta1", [-0.366, 0.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 1 });

    [Fact]
    public void BogdanovTakensNormalFormHasItsFoldAndHopfWhereTheJacobianSays()
    {
        // β2 = −1: fold at β1 = β2²/4 = 1/4 (x = 1/2); Hopf at β1 = 0 (x = 0) with ω² = −β2 = 1 (Kuznetsov §8.4).
        var branch = BtBranch();
        var fold = Assert.Single(branch.OfKind(SpecialPointKind.Fold));
        Assert.True(Math.Abs(fold.Parameter - 0.25) <= 1e-10 && Math.Abs(fold.State[0] - 0.5) <= 1e-8);
        var hopf = Assert.Single(branch.OfKind(SpecialPointKind.Hopf));
        Assert.True(Math.Abs(hopf.Parameter) <= 1e-10 && Math.Abs(hopf.State[0]) <= 1e-10);
        Assert.Equal(2 * Math.PI, hopf.Period!.Value, 9);
    }

    [Fact]
    public void FoldCurvePassesTheBogdanovTakensPointAndTheHopfCurveEndsThere()
    {
        var sys = new BogdanovTakensNormalForm(-0.5, -1);
        var branch = BtBranch();
        var options = new CurveOptions { FirstParameterMin = -2, FirstParameterMax = 2, SecondParameterMin = -2, SecondParameterMax = 2, MaxStep = 0.05 };
        var foldCurve = TwoParameterContinuation.TraceFold(sys, branch, branch.OfKind(SpecialPointKind.Fold).Single(), "beta2", options);
        foreach (var p in foldCurve.Points)
            Assert.True(Math.Abs(p.FirstParameter - p.SecondParameter * p.SecondParameter / 4) <= 1e-9, $"β1 = {p.FirstParameter:R}, β2 = {p.SecondParameter:R}");
        var bt = Assert.Single(foldCurve.OfKind(SpecialPointKind.BogdanovTakens));
        Assert.True(bt.Located);
        Assert.True(Math.Abs(bt.Parameter) <= 1e-8 && Math.Abs(bt.SecondParameter!.Value) <= 1e-8, $"BT at ({bt.Parameter:R}, {bt.SecondParameter:R})");
        Assert.Empty(foldCurve.OfKind(SpecialPointKind.Cusp)); // the quadratic coefficient wᵀB(v, v) ≠ 0 along this fold curve

        var hopfCurve = TwoParameterContinuation.TraceHopf(sys, branch, branch.OfKind(SpecialPointKind.Hopf).Single(), "beta2",
            options with { Direction = ContinuationDirection.Increasing, MaxStep = 0.02 });
        foreach (var p in hopfCurve.Points)
        {
            Assert.True(Math.Abs(p.FirstParameter) <= 1e-10);
            Assert.True(Math.Abs(p.Frequency!.Value * p.Frequency.Value + p.SecondParameter) <= 1e-9);
        }
        Assert.Equal(EndReason.HopfFrequencyVanished, hopfCurve.Forward.Reason);
        Assert.True(Math.Abs(hopfCurve.Points[^1].SecondParameter) <= 1e-6);
    }

    [Fact]
    public void ClosedBranchEndsAsAClosedLoopWithBothFolds()
    {
        // Equilibria of x' = μ² + x² − 1 form the unit circle; folds at μ = ±1 (exact).
        var branch = Continuation.Trace(new CircleOfEquilibria(0), "mu", [1.0], new ContinuationOptions
        {
            ParameterMin = -2, ParameterMax = 2, Direction = ContinuationDirection.Increasing, MaxStep = 0.05,
        });
        Assert.Equal(EndReason.ClosedLoop, branch.Forward.Reason);
        Assert.False(branch.EndedEarly);
        var folds = branch.OfKind(SpecialPointKind.Fold).Select(f => f.Parameter).Order().ToList();
        Assert.Equal(2, folds.Count);
        Assert.Equal(-1.0, folds[0], 10);
        Assert.Equal(1.0, folds[1], 10);
        Assert.All(branch.Points, p => Assert.Equal(1.0, p.Parameter * p.Parameter + p.State[0] * p.State[0], 10));
    }

    [Fact]
    public void KinkWithoutTurnIsPassedAndReported()
    {
        // x' = μ − x − |x|/2: slope 1/1.5 for x > 0 and 2 for x < 0, corner at μ = x = 0 (exact).
        var branch = Continuation.Trace(new KinkedLine(1), "mu", [0.5], new ContinuationOptions
        {
            ParameterMin = -1, ParameterMax = 1, Direction = ContinuationDirection.Decreasing,
        });
        Assert.False(branch.EndedEarly);
        var kink = Assert.Single(branch.OfKind(SpecialPointKind.NonSmoothKink));
        Assert.True(Math.Abs(kink.Parameter) <= 1e-9 && Math.Abs(kink.State[0]) <= 1e-9, $"kink at μ = {kink.Parameter:R}");
        Assert.Empty(branch.OfKind(SpecialPointKind.NonSmoothTurn));
        Assert.Empty(branch.OfKind(SpecialPointKind.Fold));
        Assert.Equal(-2.0, branch.Points[^1].State[0], 10); // x = 2μ at μ = −1
    }
}
