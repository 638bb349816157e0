using System.Numerics;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Bench;

/// <summary>
/// Continuation benchmarks: 1000-point branches with their special points located, on the Stommel
/// model (2 variables) and on a 15-variable box-like test system; a 200-point fold curve.
/// Targets: a 1000-point branch with special points in under 0.5 s, a 200-point fold curve in under 2 s (one core).
/// </summary>
public static class ContinuationBench
{
    public static void Run(BenchContext context)
    {
        // Stommel (1961), nondimensional: from the thermal state through the fold (η2 ≈ 1.22) and the |q| corner (η2 = 0.9)
        // out along the salinity-driven branch, until 1000 points.
        var stommel = new StommelBoxModel();
        var stommelOptions = new ContinuationOptions
        {
            ParameterMin = 0, ParameterMax = 1e6, Direction = ContinuationDirection.Increasing, MaxPoints = 1000, MaxStep = 0.01,
        };
        Branch? b1 = null;
        double t1 = context.MedianSeconds(() => b1 = Continuation.Trace(stommel, "Eta2", [2.5, 1.8], [3.0, 1.0, 0.3], stommelOptions));
        context.Report($"Stommel (n = 2) branch, {b1!.Points.Count} points, {Specials(b1)}", t1, "s", "< 0.5 s");
        long bytes1 = BenchContext.AllocatedBytes(() => Continuation.Trace(stommel, "Eta2", [2.5, 1.8], [3.0, 1.0, 0.3], stommelOptions));
        context.Report("  allocated per point", bytes1 / (double)b1.Points.Count, "B");

        // 15-variable box-like loop (below): folds and a Hopf point in its forcing.
        var loop = new StommelLoop();
        var p = new double[loop.ParameterCount];
        loop.GetParameters(p);
        p[0] = 0;
        var x0 = SteadyState.Solve(loop, new double[loop.Dimension], p).State.ToArray();
        var loopOptions = new ContinuationOptions
        {
            ParameterMin = -1, ParameterMax = 1e3, Direction = ContinuationDirection.Increasing, MaxPoints = 1000, MaxStep = 0.02,
        };
        Branch? b2 = null;
        double t2 = context.MedianSeconds(() => b2 = Continuation.Trace(loop, "Forcing", x0, p, loopOptions));
        context.Report($"15-variable loop branch, {b2!.Points.Count} points, {Specials(b2)}", t2, "s", "< 0.5 s");
        double t2NoEig = context.MedianSeconds(() => Continuation.Trace(loop, "Forcing", x0, p, loopOptions with { ComputeEigenvalues = false }));
        context.Report("  same without eigenvalues (no stability, no Hopf detection)", t2NoEig, "s");
        long bytes2 = BenchContext.AllocatedBytes(() => Continuation.Trace(loop, "Forcing", x0, p, loopOptions));
        context.Report("  allocated per point (MathNet EVD included)", bytes2 / (double)b2.Points.Count, "B");

        // 200-point fold curve of the 15-variable loop in (Forcing, Relaxation).
        var fold = b2.OfKind(SpecialPointKind.Fold).First();
        var curveOptions = new CurveOptions
        {
            FirstParameterMin = -100, FirstParameterMax = 100, SecondParameterMin = 0.01, SecondParameterMax = 100,
            Direction = ContinuationDirection.Increasing, MaxPoints = 200, MaxStep = 0.02,
        };
        Curve? c = null;
        double t3 = context.MedianSeconds(() => c = TwoParameterContinuation.TraceFold(loop, b2, fold, "Relaxation", curveOptions));
        context.Report($"15-variable fold curve, {c!.Points.Count} points ({c.Forward.Reason}), {c.SpecialPoints.Count(s => s.Kind != SpecialPointKind.End)} special", t3, "s", "< 2 s");

        // The same on Stommel (η2, η1).
        var sfold = b1.OfKind(SpecialPointKind.Fold).First();
        var sCurveOptions = curveOptions with { FirstParameterMin = 0, FirstParameterMax = 1e3, SecondParameterMin = 0.1, SecondParameterMax = 1e3, MaxStep = 0.01 };
        Curve? sc = null;
        double t4 = context.MedianSeconds(() => sc = TwoParameterContinuation.TraceFold(stommel, b1, sfold, "Eta1", sCurveOptions));
        context.Report($"Stommel fold curve, {sc!.Points.Count} points ({sc.Forward.Reason})", t4, "s", "< 2 s");

        // Eigenvalues alone (MathNet.Numerics managed EVD) for scale.
        var jac = new double[225];
        var f = new double[15];
        AutoJacobian.OfState(loop, 0, x0, p, jac, f);
        double evd = context.MedianNsPerOp(() => { for (int i = 0; i < 100; i++) Stability.FromJacobian(jac, 15); }, 100);
        context.Report("  MathNet EVD of the 15×15 Jacobian", evd / 1000, "µs");
        double jacobian = context.MedianNsPerOp(() => { for (int i = 0; i < 1000; i++) AutoJacobian.OfState(loop, 0, x0, p, jac, f); }, 1000);
        context.Report("  exact 15×15 Jacobian (dual numbers)", jacobian / 1000, "µs");
    }

    private static string Specials(Branch b) =>
        string.Join(", ", b.SpecialPoints.Where(s => s.Kind != SpecialPointKind.End).GroupBy(s => s.Kind).Select(g => $"{g.Count()} {g.Key}"));

    /// <summary>
    /// A benchmark system resembling a box model (invented for the benchmark): a ring of 7 boxes with
    /// temperature and salinity (T_i relaxed toward a pole-to-equator profile, salt added in box 0 and removed in
    /// box 6, weak salinity relaxation), mixed around the ring at a Stommel-like rate E = √(q² + ε²)(1 + 0.1·c·h)
    /// with q the density difference between boxes 0 and 6, and a 15th, thermocline-like variable h relaxing to E.
    /// </summary>
    private sealed class StommelLoop : IParametricSystem
    {
        private const int M = 7;
        private static readonly string[] Names = ["Forcing", "Relaxation", "SaltRelaxation", "Coupling"];
        private readonly double[] _p = [1.0, 3.0, 0.3, 1.0];

        public int Dimension => 2 * M + 1;

        public int ParameterCount => Names.Length;

        public string GetParameterName(int index) => Names[index];

        public void GetParameters(Span<double> destination) => _p.CopyTo(destination);

        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            Span<T> p = [T.CreateChecked(_p[0]), T.CreateChecked(_p[1]), T.CreateChecked(_p[2]), T.CreateChecked(_p[3])];
            Evaluate(t, y, p, dydt);
        }

        public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            T forcing = p[0], eta1 = p[1], eta3 = p[2], coupling = p[3];
            T h = y[2 * M];
            T q = (y[0] - y[M]) - (y[M - 1] - y[2 * M - 1]);
            T e = T.Sqrt(q * q + T.CreateChecked(1e-4)) * (T.One + T.CreateChecked(0.1) * coupling * h);
            T boxes = T.CreateChecked((double)M), half = T.CreateChecked(0.5);
            for (int i = 0; i < M; i++)
            {
                int up = (i + M - 1) % M;
                T target = eta1 * T.CreateChecked(1.0 - 2.0 * i / (M - 1));
                T salt = i == 0 ? forcing * half : i == M - 1 ? -forcing * half : T.Zero;
                dydt[i] = (target - y[i]) + boxes * e * (y[up] - y[i]);
                dydt[M + i] = salt - eta3 * y[M + i] + boxes * e * (y[M + up] - y[M + i]);
            }
            dydt[2 * M] = e - h;
        }
    }
}
