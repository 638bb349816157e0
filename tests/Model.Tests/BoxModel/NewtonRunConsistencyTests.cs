using Thermostrat.Model.Analysis;
using Thermostrat.Model.Numerics.Ode;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// Two numerical paths must agree (exact property): every stable equilibrium Newton finds is a
/// fixed point of a long transient run started near it. Checked for both coexisting states inside
/// the hosing bistable range of the default model.
/// </summary>
public class NewtonRunConsistencyTests
{
    private const string Hosing = "Model:Processes:SurfaceFreshwater:HosingVentilationBoxes_Sv";

    [Fact]
    public void StableEquilibriaFromNewtonAreFixedPointsOfLongRuns()
    {
        var model = Build();
        var p = Parameters(model);
        int k = model.ParameterIndex(Hosing);
        var on0 = Equilibrium(model, p);
        p[k] = 1.0; // inside the bistable range (folds near 0.88 and 1.11 Sv in the default model)
        var on = Equilibrium(model, p, on0);
        var pHigh = (double[])p.Clone();
        pHigh[k] = 1.5; // beyond the collapse fold: the run falls to the collapsed state
        var high = OdeSolver.Solve(model, pHigh, 0, on, 20000, new SolverOptions { Method = OdeMethod.Rodas4, Output = OutputTimes.FinalOnly });
        var off = Equilibrium(model, p, [.. high.FinalState]);
        Assert.True(Math.Abs(on[0] - off[0]) > 0.5 || Math.Abs(on[1] - off[1]) > 0.5, "two distinct equilibria expected");

        foreach (var (name, eq) in new[] { ("ventilated", on), ("collapsed", off) })
        {
            var stability = Stability.Analyze(model, eq, p);
            Assert.True(stability.IsStable, name + " state must be stable");
            // Start 0.2 K / 0.02 g/kg away and run 15 slowest e-folding times (a perturbation decays
            // by e^-15 ≈ 3e-7): the run must land on Newton's answer.
            var y0 = eq.Select((v, i) => v + (i % 2 == 0 ? 0.2 : -0.2) * (model.StateVariables[i].Unit == "g kg-1" ? 0.1 : 1)).ToArray();
            var run = OdeSolver.Solve(model, p, 0, y0, 15 * stability.EFoldingTime, new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-9, AbsoluteTolerance = 1e-11, Output = OutputTimes.FinalOnly });
            for (int i = 0; i < eq.Length; i++)
                Assert.True(Math.Abs(run.FinalState[i] - eq[i]) < 1e-4, $"{name}: {model.StateVariables[i].Name} run {run.FinalState[i]} vs Newton {eq[i]}");
        }
    }
}
