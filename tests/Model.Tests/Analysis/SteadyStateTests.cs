using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models;
using Xunit;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>Damped Newton steady states and their stability.</summary>
public class SteadyStateTests
{
    [Fact]
    public void StommelHasThreeCoexistingEquilibriaAtEta2EqualsOne()
    {
        // Closed form (Stommel 1961): steady states solve η2 = (η3 + |q|)(η1/(1 + |q|) − q); at η1 = 3, η2 = 1, η3 = 0.3
        // this has three roots q (thermal, middle, salinity driven), found here independently by bisection on a grid.
        var roots = new List<double>();
        static double G(double q) => (0.3 + Math.Abs(q)) * (3 / (1 + Math.Abs(q)) - q) - 1;
        for (double q = -3; q < 3; q += 0.01)
        {
            if (Math.Sign(G(q)) == Math.Sign(G(q + 0.01))) continue;
            double a = q, b = q + 0.01;
            for (int i = 0; i < 200; i++) { double m = 0.5 * (a + b); if (Math.Sign(G(m)) == Math.Sign(G(a))) a = m; else b = m; }
            roots.Add(0.5 * (a + b));
        }
        Assert.Equal(3, roots.Count);
        var model = new StommelBoxModel(3, 1, 0.3);
        var starts = new List<double[]>();
        for (double t = 0.5; t <= 3; t += 0.5) for (double s = 0.5; s <= 4; s += 0.5) starts.Add([t, s]);
        var found = SteadyState.FindAll(model, starts, [3.0, 1.0, 0.3]);
        var flows = found.Equilibria.Select(e => StommelBoxModel.Flow(e.State.AsSpan())).Order().ToList();
        Assert.Equal(3, flows.Count);
        for (int i = 0; i < 3; i++) Assert.True(Math.Abs(flows[i] - roots[i]) <= 1e-9, $"q = {flows[i]:R} vs {roots[i]:R}");
        Assert.All(found.Equilibria, e => Assert.True(e.Residual <= 1e-10));
        Assert.Equal(starts.Count, found.PerStart.Count);
        // Stability: the outer two are stable, the middle one a saddle (Stommel 1961).
        var types = found.Equilibria.OrderBy(e => StommelBoxModel.Flow(e.State.AsSpan()))
            .Select(e => Stability.Analyze(model, e.State.AsSpan(), [3.0, 1.0, 0.3]).Type).ToList();
        Assert.Equal([StabilityType.Stable, StabilityType.Saddle, StabilityType.Stable], types);
    }

    [Fact]
    public void NonConvergenceIsDiagnosedWithResidualIterationsAndSuggestion()
    {
        // x' = μ − x² has no equilibrium for μ < 0 (Kuznetsov §3.2): Newton must fail and say why.
        var r = SteadyState.Solve(new SaddleNodeNormalForm(-1), [0.5], [-1.0]);
        Assert.False(r.Converged);
        Assert.NotEqual(NewtonFailure.None, r.Failure);
        Assert.True(r.Residual >= 1, $"residual {r.Residual}"); // |μ − x²| ≥ 1 everywhere
        Assert.True(r.Iterations >= 1);
        Assert.Contains("residual", r.Diagnosis);
        Assert.Contains("mu = -1", r.Diagnosis);
        Assert.Contains("FromRunEnd", r.Diagnosis);
    }

    [Fact]
    public void SteadyStateFromRunEndFindsTheAttractorOfTheRun()
    {
        // x' = μ − x² from x = 5 at μ = 4 relaxes to the stable root x = +2 (closed form √μ).
        var r = SteadyState.FromRunEnd(new SaddleNodeNormalForm(4), TransientIntegrators.Default, [5.0], [4.0], 5);
        Assert.True(r.Converged);
        Assert.Equal(2.0, r.State[0], 12);
    }

    [Fact]
    public void StabilityReportsEFoldingTimeAndPeriod()
    {
        // Hopf normal form origin: eigenvalues μ ± iω ⇒ e-folding time 1/|μ|, period 2π/ω (exact).
        var report = Stability.Analyze(new HopfNormalForm(-0.5, 2.0), [0.0, 0.0], [-0.5, 2.0]);
        Assert.Equal(StabilityType.Stable, report.Type);
        Assert.Equal(2.0, report.EFoldingTime, 12);
        Assert.Equal(Math.PI, report.OscillationPeriod!.Value, 12);
        Assert.Equal(-0.5, report.Leading.Real, 12);
        Assert.Equal(2.0, report.Leading.Imaginary, 12);
        var unstable = Stability.Analyze(new HopfNormalForm(0.25, 2.0), [0.0, 0.0], [0.25, 2.0]);
        Assert.Equal(StabilityType.Unstable, unstable.Type);
        Assert.Equal(2, unstable.UnstableCount);
        Assert.Equal(4.0, unstable.EFoldingTime, 12);
        // Saddle-node at x = 0, μ = 0: eigenvalue exactly 0.
        Assert.Equal(StabilityType.NonHyperbolic, Stability.Analyze(new SaddleNodeNormalForm(0), [0.0], [0.0]).Type);
        Assert.Null(Stability.Analyze(new SaddleNodeNormalForm(1), [1.0], [1.0]).OscillationPeriod);
    }
}
