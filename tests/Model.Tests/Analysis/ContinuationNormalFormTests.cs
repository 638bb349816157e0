using Thermostrat.Model.Analysis;
using Xunit;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>One-parameter continuation against normal forms with exactly known bifurcation points.</summary>
public class ContinuationNormalFormTests
{
    [Fact]
    public void SaddleNodeFoldIsAtZeroAndTheBranchContinuesThroughIt()
    {
        // x' = μ − x²: fold at μ = 0, x = 0 (Kuznetsov, Elements of Applied Bifurcation Theory, §3.2).
        var sys = new SaddleNodeNormalForm(1);
        var branch = Continuation.Trace(sys, "mu", [1.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 2 });
        var folds = branch.OfKind(SpecialPointKind.Fold).ToList();
        Assert.Single(folds);
        Assert.True(folds[0].Located);
        Assert.True(Math.Abs(folds[0].Parameter) <= 1e-10, $"fold at μ = {folds[0].Parameter:R}");
        Assert.True(Math.Abs(folds[0].State[0]) <= 1e-8, $"fold at x = {folds[0].State[0]:R}");
        Assert.True(folds[0].Residual <= 1e-10);
        Assert.Empty(branch.OfKind(SpecialPointKind.BranchPoint));
        Assert.Empty(branch.OfKind(SpecialPointKind.Hopf));
        // Through the fold: both x = +√μ (stable, eigenvalue −2x) and x = −√μ (unstable) are on the branch, up to μ = 2.
        Assert.Contains(branch.Points, p => p.State[0] > 1 && p.Stability == StabilityType.Stable);
        Assert.Contains(branch.Points, p => p.State[0] < -1 && p.Stability == StabilityType.Unstable);
        foreach (var p in branch.Points)
            Assert.True(Math.Abs(p.Parameter - p.State[0] * p.State[0]) <= 1e-10, $"off the branch at μ = {p.Parameter}");
        Assert.False(branch.EndedEarly);
        Assert.Equal(EndReason.ParameterBoundReached, branch.Forward.Reason);
        Assert.Equal(EndReason.ParameterBoundReached, branch.Reverse!.Reason);
        Assert.Equal(2.0, branch.Points[0].Parameter, 12);
        Assert.Equal(2.0, branch.Points[^1].Parameter, 12);
    }

    [Fact]
    public void HopfNormalFormHasItsHopfPointAtZeroWithPeriodTwoPiOverOmega()
    {
        // Origin of the Hopf normal form: eigenvalues μ ± iω (Kuznetsov, §3.4).
        const double omega = 2.5;
        var sys = new HopfNormalForm(-1, omega);
        var branch = Continuation.Trace(sys, "mu", [0.0, 0.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 1, Direction = ContinuationDirection.Increasing });
        var hopf = Assert.Single(branch.OfKind(SpecialPointKind.Hopf));
        Assert.True(hopf.Located);
        Assert.True(Math.Abs(hopf.Parameter) <= 1e-10, $"Hopf at μ = {hopf.Parameter:R}");
        Assert.Equal(2 * Math.PI / omega, hopf.Period!.Value, 10);
        Assert.Equal(omega, hopf.Frequency!.Value, 10);
        // Stable before, unstable after; the leading pair has period 2π/ω everywhere on the branch.
        Assert.All(branch.Points.Where(p => p.Parameter < -1e-6), p => Assert.Equal(StabilityType.Stable, p.Stability));
        Assert.All(branch.Points.Where(p => p.Parameter > 1e-6), p => Assert.Equal(StabilityType.Unstable, p.Stability));
    }

    [Theory]
    [InlineData(-1.0, 2.5)]
    [InlineData(1.0, 2.5)]
    [InlineData(-0.3, 0.7)]
    public void FirstLyapunovCoefficientOfTheHopfNormalFormIsTwoSOverOmega(double s, double omega)
    {
        // ż = (μ + iω) z + s z|z|², z = x + iy. Kuznetsov (Elements of Applied Bifurcation Theory, §3.5) defines
        // l1 = Re c1/ω for ẇ = λw + c1 w|w|² in the coordinate w = ⟨p, x⟩, x = wq + w̄q̄, with ⟨q, q⟩ = 1 (from memory).
        // Here q = (1, −i)/√2, so z = √2 w and ẇ = λw + 2s w|w|²: l1 = 2s/ω; s < 0 is supercritical.
        var sys = new HopfNormalForm(-1, omega, s);
        var branch = Continuation.Trace(sys, "mu", [0.0, 0.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 1, Direction = ContinuationDirection.Increasing });
        var hopf = Assert.Single(branch.OfKind(SpecialPointKind.Hopf));
        double expected = 2 * s / omega;
        Assert.True(Math.Abs(hopf.FirstLyapunovCoefficient!.Value - expected) <= 1e-6 * Math.Abs(expected), $"l1 = {hopf.FirstLyapunovCoefficient:R}, expected {expected:R}");
        Assert.Contains(s < 0 ? "supercritical" : "subcritical", hopf.Description);
    }

    [Theory]
    [InlineData("transcritical")]
    [InlineData("pitchfork")]
    public void BranchPointOnTheTrivialBranchIsAtZero(string which)
    {
        // x' = μx − x² and x' = μx − x³: the trivial branch x = 0 meets another branch at μ = 0 (Strogatz, §3.2, §3.4).
        Thermostrat.Model.Numerics.IParametricSystem sys = which == "transcritical" ? new TranscriticalNormalForm(-1) : new PitchforkNormalForm(-1);
        var branch = Continuation.Trace(sys, "mu", [0.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 1, Direction = ContinuationDirection.Increasing });
        var bp = Assert.Single(branch.OfKind(SpecialPointKind.BranchPoint));
        Assert.True(bp.Located);
        Assert.True(Math.Abs(bp.Parameter) <= 1e-10, $"branch point at μ = {bp.Parameter:R}");
        Assert.True(Math.Abs(bp.State[0]) <= 1e-10);
        Assert.Empty(branch.OfKind(SpecialPointKind.Fold));
    }

    [Fact]
    public void FoldIsUnchangedInMixedCoordinatesWithExtraDimensions()
    {
        // Exact property: a linear change of coordinates plus decoupled decaying modes moves neither the fold nor its parameter.
        var sys = new MixedCoordinates(new SaddleNodeNormalForm(1), extra: 13);
        var start = sys.ToMixed([1.0]);
        var branch = Continuation.Trace(sys, "mu", start, new ContinuationOptions { ParameterMin = -1, ParameterMax = 2, MaxStep = 0.3 });
        var fold = Assert.Single(branch.OfKind(SpecialPointKind.Fold));
        Assert.True(Math.Abs(fold.Parameter) <= 1e-10, $"fold at μ = {fold.Parameter:R}");
        Assert.True(Math.Abs(sys.ToInner(fold.State.AsSpan())[0]) <= 1e-8);
        Assert.Equal(14, fold.State.Length);
    }
}
