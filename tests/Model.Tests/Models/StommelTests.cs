using MathNet.Numerics.RootFinding;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models;
using Xunit;

namespace Thermostrat.Model.Tests.Models;

/// <summary>
/// Stommel (1961) box model: continuation against the closed-form steady-state relation
/// η2 = (η3 + E(q))(η1/(1 + E(q)) − q), E(q) = |q| or √(q² + ε²), which follows from
/// T = η1/(1 + E), S = η2/(η3 + E), q = T − S (Stommel 1961; derived here in the test).
/// </summary>
public class StommelTests
{
    private const double Eta1 = 3.0, Eta3 = 0.3;

    /// <summary>dη2/dq of the closed-form relation for q &gt; 0 with E = |q| = q.</summary>
    private static double SlopeAbsolute(double q) => (Eta1 / (1 + q) - q) + (Eta3 + q) * (-Eta1 / ((1 + q) * (1 + q)) - 1);

    private static double ForcingSmoothed(double q, double eps)
    {
        double e = Math.Sqrt(q * q + eps * eps);
        return (Eta3 + e) * (Eta1 / (1 + e) - q);
    }

    private static double SlopeSmoothed(double q, double eps)
    {
        double e = Math.Sqrt(q * q + eps * eps), de = q / e;
        return de * (Eta1 / (1 + e) - q) + (Eta3 + e) * (-Eta1 * de / ((1 + e) * (1 + e)) - 1);
    }

    private static Branch TraceFromThermalState(StommelBoxModel model)
    {
        var p = new double[3];
        model.GetParameters(p);
        p[1] = 1.0;
        // Thermally driven guess (q > 0); Newton polishes it.
        return Continuation.Trace(model, "Eta2", [2.5, 1.8], p, new ContinuationOptions { ParameterMin = 0, ParameterMax = 3 });
    }

    [Fact]
    public void SmoothFoldMatchesRootOfTheClosedFormRelation()
    {
        // Independent answer: the fold is where dη2/dq = 0 on the thermally driven side (Brent's method, MathNet.Numerics).
        double qFold = Brent.FindRoot(SlopeAbsolute, 0.05, 1.2, 1e-15, 200);
        double eta2Fold = (Eta3 + qFold) * (Eta1 / (1 + qFold) - qFold);
        var branch = TraceFromThermalState(new StommelBoxModel(Eta1, 1.0, Eta3));
        var fold = Assert.Single(branch.OfKind(SpecialPointKind.Fold));
        Assert.True(fold.Located);
        Assert.True(Math.Abs(fold.Parameter - eta2Fold) <= 1e-8, $"fold at η2 = {fold.Parameter:R}, closed form {eta2Fold:R}");
        Assert.True(Math.Abs(StommelBoxModel.Flow(fold.State.AsSpan()) - qFold) <= 1e-6, $"fold at q = {StommelBoxModel.Flow(fold.State.AsSpan()):R}, closed form {qFold:R}");
        // Also agrees with SciPy 1.10 brentq on the same relation: 1.2201153171955241 (computed here with python3-scipy).
        Assert.Equal(1.2201153171955241, fold.Parameter, 9);
    }

    [Fact]
    public void CornerOfTheAbsoluteFlowLawIsPassedAndReportedAsNonSmoothTurn()
    {
        // The other end of the bistable range is q = 0, where η2 = η1·η3 exactly (closed form above with q = 0).
        var branch = TraceFromThermalState(new StommelBoxModel(Eta1, 1.0, Eta3));
        var turn = Assert.Single(branch.OfKind(SpecialPointKind.NonSmoothTurn));
        Assert.True(Math.Abs(turn.Parameter - Eta1 * Eta3) <= 1e-8, $"corner at η2 = {turn.Parameter:R}, expected {Eta1 * Eta3}");
        Assert.True(Math.Abs(StommelBoxModel.Flow(turn.State.AsSpan())) <= 1e-8);
        Assert.True(turn.Residual <= 1e-9);
        // Continuation passed it: the salinity-driven states (q < 0) up to η2 = 3 are on the branch, and nothing ended early.
        Assert.Contains(branch.Points, p => StommelBoxModel.Flow(p.State.AsSpan()) < -0.5);
        Assert.False(branch.EndedEarly);
        Assert.Empty(branch.OfKind(SpecialPointKind.BranchPoint));
        // Every point satisfies the closed-form relation.
        foreach (var p in branch.Points)
        {
            double q = StommelBoxModel.Flow(p.State.AsSpan());
            Assert.True(Math.Abs(p.Parameter - (Eta3 + Math.Abs(q)) * (Eta1 / (1 + Math.Abs(q)) - q)) <= 1e-9);
        }
        // Stability: the middle branch (0 < q < q_fold) is a saddle; both outer branches are stable (Stommel 1961).
        double qFold = Brent.FindRoot(SlopeAbsolute, 0.05, 1.2, 1e-15, 200);
        foreach (var p in branch.Points.Where(p => p.Type == BranchPointType.Regular))
        {
            double q = StommelBoxModel.Flow(p.State.AsSpan());
            var expected = q > 1e-6 && q < qFold - 1e-6 ? StabilityType.Saddle : q < -1e-6 || q > qFold + 1e-6 ? StabilityType.Stable : p.Stability;
            Assert.Equal(expected, p.Stability);
        }
    }

    [Fact]
    public void SmoothedFlowLawHasTwoSmoothFoldsAtTheClosedFormRoots()
    {
        const double eps = 0.01;
        double qUpper = Brent.FindRoot(q => SlopeSmoothed(q, eps), 0.05, 1.2, 1e-15, 200);
        double qLower = Brent.FindRoot(q => SlopeSmoothed(q, eps), -0.2, 0.05, 1e-15, 200);
        var branch = TraceFromThermalState(new StommelBoxModel(Eta1, 1.0, Eta3, StommelFlowLaw.Smoothed, eps));
        var folds = branch.OfKind(SpecialPointKind.Fold).OrderBy(f => f.Parameter).ToList();
        Assert.Equal(2, folds.Count);
        Assert.All(folds, f => Assert.True(f.Located));
        Assert.True(Math.Abs(folds[0].Parameter - ForcingSmoothed(qLower, eps)) <= 1e-8, $"{folds[0].Parameter:R} vs {ForcingSmoothed(qLower, eps):R}");
        Assert.True(Math.Abs(folds[1].Parameter - ForcingSmoothed(qUpper, eps)) <= 1e-8, $"{folds[1].Parameter:R} vs {ForcingSmoothed(qUpper, eps):R}");
        Assert.Empty(branch.OfKind(SpecialPointKind.NonSmoothTurn));
    }

    [Fact]
    public void DimensionalModelFoldMapsOntoTheNondimensionalFold()
    {
        // Exact property of the scaling: η2 = 2λβτ_T S0 F / V, so F_fold = η2_fold · V / (2λβτ_T S0).
        var model = new StommelDimensionalModel();
        var p = new double[model.ParameterCount];
        model.GetParameters(p);
        var groups = StommelDimensionalModel.NondimensionalGroups(p);
        Assert.Equal(3.0, groups.Eta1, 12);
        Assert.Equal(0.3, groups.Eta3, 12);
        double qFold = Brent.FindRoot(SlopeAbsolute, 0.05, 1.2, 1e-15, 200);
        double eta2Fold = (Eta3 + qFold) * (Eta1 / (1 + qFold) - qFold);
        double tauT_s = p[1] * StommelDimensionalModel.SecondsPerYear;
        double fFold_Sv = eta2Fold * p[5] / (2 * groups.Lambda * p[7] * tauT_s * p[8]) / StommelDimensionalModel.CubicMetresPerSecondPerSv;

        // Thermally driven start near ΔT*: a few K, fresher poles.
        var branch = Continuation.Trace(model, "FreshwaterTransport_Sv", [8.0, 1.0], p,
            new ContinuationOptions { ParameterMin = 0, ParameterMax = 1.5, ParameterScale = 0.1, MaxStep = 0.05, StateScale = [1.0, 0.1] });
        var fold = Assert.Single(branch.OfKind(SpecialPointKind.Fold));
        Assert.True(Math.Abs(fold.Parameter - fFold_Sv) <= 1e-8 * fFold_Sv, $"fold at F = {fold.Parameter:R} Sv, from the nondimensional fold {fFold_Sv:R} Sv");
        var turn = Assert.Single(branch.OfKind(SpecialPointKind.NonSmoothTurn));
        double fCorner_Sv = Eta1 * Eta3 * p[5] / (2 * groups.Lambda * p[7] * tauT_s * p[8]) / StommelDimensionalModel.CubicMetresPerSecondPerSv;
        Assert.True(Math.Abs(turn.Parameter - fCorner_Sv) <= 1e-8 * fCorner_Sv, $"corner at F = {turn.Parameter:R} Sv, expected {fCorner_Sv:R}");
        Assert.InRange(fFold_Sv, 0.47, 0.50); // the documented ≈ 0.48 Sv collapse of the demonstration values

        // Eigenvalues scale with 1/τ_T: dimensional eigenvalue (per year) = nondimensional eigenvalue / τ_T.
        var start = branch.Points[branch.StartIndex];
        double eta2 = 2 * groups.Lambda * p[7] * tauT_s * p[8] * (p[3] * StommelDimensionalModel.CubicMetresPerSecondPerSv) / p[5];
        var nondimensional = Stability.Analyze(new StommelBoxModel(Eta1, eta2, Eta3),
            [groups.Lambda * p[6] * start.State[0], groups.Lambda * p[7] * start.State[1]], [Eta1, eta2, Eta3]);
        for (int i = 0; i < 2; i++)
        {
            Assert.Equal(nondimensional.Eigenvalues[i].Real / p[1], start.Eigenvalues[i].Real, 10);
            Assert.Equal(nondimensional.Eigenvalues[i].Imaginary / p[1], start.Eigenvalues[i].Imaginary, 10);
        }
    }
}
