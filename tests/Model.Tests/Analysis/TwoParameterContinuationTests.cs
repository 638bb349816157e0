using MathNet.Numerics.RootFinding;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models;
using Xunit;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>Fold and Hopf curves against closed forms.</summary>
public class TwoParameterContinuationTests
{
    private static Branch CuspBranch() =>
        Continuation.Trace(new CuspNormalForm(0, 1), "a", [1.0], new ContinuationOptions { ParameterMin = -2, ParameterMax = 2 });

    [Fact]
    public void CuspNormalFormFoldsAreAtPlusMinusTwoOverThreeRootThree()
    {
        // x' = a + bx − x³ at b = 1: folds where b = 3x², i.e. a = ∓2/(3√3) (Kuznetsov, Elements of Applied Bifurcation Theory, §8.2).
        var folds = CuspBranch().OfKind(SpecialPointKind.Fold).Select(f => f.Parameter).Order().ToList();
        Assert.Equal(2, folds.Count);
        double expected = 2 / (3 * Math.Sqrt(3));
        Assert.True(Math.Abs(folds[0] + expected) <= 1e-10, $"{folds[0]:R}");
        Assert.True(Math.Abs(folds[1] - expected) <= 1e-10, $"{folds[1]:R}");
    }

    [Fact]
    public void CuspFoldCurveLiesOn4bCubedEquals27aSquaredAndHasItsCuspAtTheOrigin()
    {
        var sys = new CuspNormalForm(0, 1);
        var branch = CuspBranch();
        var fold = branch.OfKind(SpecialPointKind.Fold).First();
        var curve = TwoParameterContinuation.TraceFold(sys, branch, fold, "b",
            new CurveOptions { FirstParameterMin = -2, FirstParameterMax = 2, SecondParameterMin = -1, SecondParameterMax = 2, MaxStep = 0.05 });
        Assert.True(curve.Points.Count > 20);
        // Every point on the fold curve 4b³ = 27a² (Kuznetsov, §8.2).
        foreach (var p in curve.Points)
        {
            double a = p.FirstParameter, b = p.SecondParameter;
            Assert.True(Math.Abs(4 * b * b * b - 27 * a * a) <= 1e-8, $"off the fold curve at a = {a:R}, b = {b:R}");
        }
        var cusp = Assert.Single(curve.OfKind(SpecialPointKind.Cusp));
        Assert.True(cusp.Located);
        Assert.True(Math.Abs(cusp.Parameter) <= 1e-8 && Math.Abs(cusp.SecondParameter!.Value) <= 1e-8, $"cusp at a = {cusp.Parameter:R}, b = {cusp.SecondParameter:R}");
        Assert.Empty(curve.OfKind(SpecialPointKind.BogdanovTakens)); // a scalar equation has no double zero eigenvalue
        // Both branches of the cusp are traced up to b = 2 (through the cusp).
        Assert.Equal(EndReason.ParameterBoundReached, curve.Forward.Reason);
        Assert.Equal(EndReason.ParameterBoundReached, curve.Reverse!.Reason);
        Assert.Contains(curve.Points, p => p.FirstParameter > 0.5);
        Assert.Contains(curve.Points, p => p.FirstParameter < -0.5);

        // The bistable interval at b: a ∈ [−2(b/3)^{3/2}, +2(b/3)^{3/2}]; none for b < 0.
        var map = BistableRegion.Map(sys, curve, [0.5, 1.0, 1.7, -0.5]);
        foreach (var row in map.Take(3))
        {
            double half = 2 * Math.Pow(row.SecondParameter / 3, 1.5);
            Assert.True(row.IsBistable);
            Assert.True(Math.Abs(row.Lower + half) <= 1e-10 && Math.Abs(row.Upper - half) <= 1e-10, $"b = {row.SecondParameter}: [{row.Lower:R}, {row.Upper:R}] vs ±{half:R}");
        }
        Assert.False(map[3].IsBistable);
    }

    [Fact]
    public void StommelFoldCurveMatchesTheClosedFormFoldAtEveryEta1()
    {
        // Fold of the Stommel model in (η2, η1): for each η1, root of dη2/dq = 0 of η2 = (η3 + q)(η1/(1 + q) − q) (see StommelTests).
        const double eta3 = 0.3;
        var model = new StommelBoxModel(3, 1, eta3);
        var branch = Continuation.Trace(model, "Eta2", [2.5, 1.8], new ContinuationOptions { ParameterMin = 0, ParameterMax = 3 });
        var fold = branch.OfKind(SpecialPointKind.Fold).Single();
        var curve = TwoParameterContinuation.TraceFold(model, branch, fold, "Eta1",
            new CurveOptions { FirstParameterMin = 0, FirstParameterMax = 5, SecondParameterMin = 2, SecondParameterMax = 4 });
        Assert.False(curve.EndedEarly);
        foreach (var p in curve.Points)
        {
            double eta1 = p.SecondParameter;
            double qFold = Brent.FindRoot(q => (eta1 / (1 + q) - q) + (eta3 + q) * (-eta1 / ((1 + q) * (1 + q)) - 1), 0.01, 2, 1e-15, 200);
            double eta2Fold = (eta3 + qFold) * (eta1 / (1 + qFold) - qFold);
            Assert.True(Math.Abs(p.FirstParameter - eta2Fold) <= 1e-8, $"η1 = {eta1:R}: fold at η2 = {p.FirstParameter:R}, closed form {eta2Fold:R}");
        }
    }

    [Fact]
    public void HopfCurveOfTheNormalFormIsMuEqualsZeroWithFrequencyOmega()
    {
        // Hopf normal form: eigenvalues μ ± iω, so the Hopf curve in (μ, ω) is μ = 0 with frequency ω (Kuznetsov, §3.4).
        var sys = new HopfNormalForm(-1, 2.5);
        var branch = Continuation.Trace(sys, "mu", [0.0, 0.0], new ContinuationOptions { ParameterMin = -1, ParameterMax = 1 });
        var hopf = branch.OfKind(SpecialPointKind.Hopf).Single();
        var curve = TwoParameterContinuation.TraceHopf(sys, branch, hopf, "omega",
            new CurveOptions { FirstParameterMin = -1, FirstParameterMax = 1, SecondParameterMin = 1, SecondParameterMax = 4 });
        Assert.False(curve.EndedEarly);
        Assert.True(curve.Points.Count > 5);
        foreach (var p in curve.Points)
        {
            Assert.True(Math.Abs(p.FirstParameter) <= 1e-10);
            Assert.True(Math.Abs(p.Frequency!.Value - p.SecondParameter) <= 1e-10);
        }
        Assert.Equal(1.0, curve.Points.Min(p => p.SecondParameter), 10);
        Assert.Equal(4.0, curve.Points.Max(p => p.SecondParameter), 10);
    }

    [Fact]
    public void RechargeOscillatorHopfCurveEndsWhereTheDeterminantVanishes()
    {
        // Jin (1997) recharge oscillator, Jacobian [[γb − c, γ], [−αb, −r]] with b = b0 μ. On the Hopf curve in (μ, r):
        // trace 0 ⇒ μ = (c + r)/(γ b0); ω² = det = α(c + r) − r², which vanishes (a Bogdanov–Takens point) at
        // r* = (α + √(α² + 4αc))/2 (derived here from the 2×2 Jacobian).
        var model = new RechargeOscillator(nonlinear: true, mu: 0.5);
        var branch = Continuation.Trace(model, "mu", [0.0, 0.0], new ContinuationOptions { ParameterMin = 0.3, ParameterMax = 1, Direction = ContinuationDirection.Increasing });
        var hopf = branch.OfKind(SpecialPointKind.Hopf).Single();
        var curve = TwoParameterContinuation.TraceHopf(model, branch, hopf, "r",
            new CurveOptions { FirstParameterMin = 0, FirstParameterMax = 2, SecondParameterMin = 0.05, SecondParameterMax = 1, Direction = ContinuationDirection.Increasing, MaxStep = 0.02 });
        double b0 = 2.5, gamma = 0.75, c = 1, alpha = 0.125;
        foreach (var p in curve.Points)
        {
            double r = p.SecondParameter;
            Assert.True(Math.Abs(p.FirstParameter - (c + r) / (gamma * b0)) <= 1e-10, $"r = {r}: μ = {p.FirstParameter:R}");
            Assert.True(Math.Abs(p.Frequency!.Value * p.Frequency.Value - (alpha * (c + r) - r * r)) <= 1e-9, $"r = {r}: ω = {p.Frequency:R}");
        }
        Assert.Equal(EndReason.HopfFrequencyVanished, curve.Forward.Reason);
        double rStar = (alpha + Math.Sqrt(alpha * alpha + 4 * alpha * c)) / 2;
        Assert.True(Math.Abs(curve.Points[^1].SecondParameter - rStar) <= 1e-3, $"ended at r = {curve.Points[^1].SecondParameter:R}, BT at {rStar:R}");
    }
}
