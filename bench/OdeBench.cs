using System.Diagnostics;
using System.Globalization;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using MVector = MathNet.Numerics.LinearAlgebra.Vector<double>;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Numerics.Ode;
using MathNetRungeKutta = MathNet.Numerics.OdeSolvers.RungeKutta;

namespace Thermostrat.Bench;

/// <summary>
/// The ODE engine: work–precision tables (achieved error against wall time and function evaluations) on Robertson,
/// Van der Pol μ = 1000 and a Stommel-type two-box problem, with MathNet.Numerics' fixed-step RK4 as a baseline; the
/// speed targets (stiff Robertson solve, per-step overheads, allocation per step); LU and dispatch measurements.
/// </summary>
public static class OdeBench
{
    public static void Run(BenchContext context)
    {
        var o = context.Out;
        var references = LoadReferences();

        o.WriteLine("### Work–precision (error = max relative error over components at tEnd vs SciPy Radau rtol 1e-12, tests/Model.Tests/Fixtures/Numerics)");
        WorkPrecision(context, "Robertson [0, 40]", new Robertson(), [1, 0, 0], 40, references[("robertson", 40)], 1e-4, explicitCap: 400_000);
        WorkPrecision(context, "Van der Pol mu = 1000 [0, 3000]", new VanDerPol(1000), [2, 0], 3000, references[("vanderpol_mu1000", 3000)], 1e-3, explicitCap: 300_000);
        WorkPrecision(context, "Stommel-type two-box, periodic freshwater forcing [0, 50] (invented scenario)", new Stommel(3.0, 1.0, 0.5, 10.0, 0.3), [1.0, 0.5], 50, references[("stommel_forced", 50)], 1.0, explicitCap: 2_000_000);

        o.WriteLine();
        o.WriteLine("### Targets");
        StiffRobertsonTarget(context, references[("robertson", 100000)]);
        ExplicitOverhead(context);
        StiffOverhead(context);
        Allocation(context);

        o.WriteLine();
        o.WriteLine("### Building blocks");
        LuComparison(context);
        Dispatch(context);
    }

    // ---------------------------------------------------------------- work–precision

    private static void WorkPrecision(BenchContext context, string title, IOdeSystem system, double[] y0, double tEnd, double[] reference, double atolScale, int explicitCap)
    {
        var o = context.Out;
        o.WriteLine();
        o.WriteLine($"{title}; atol = {atolScale:G2}·rtol");
        o.WriteLine($"  {"method",-18} {"rtol",8} {"error",10} {"time ms",10} {"f evals",10} {"steps",9} {"Jac",7}  note");
        double[] rtols = context.Quick ? [1e-4, 1e-8] : [1e-4, 1e-6, 1e-8, 1e-10];
        var targets = new List<double>();
        foreach (var method in new[] { OdeMethod.DormandPrince54, OdeMethod.BogackiShampine32, OdeMethod.Rodas4, OdeMethod.Auto })
        {
            foreach (double rtol in rtols)
            {
                var options = new SolverOptions
                {
                    Method = method, RelativeTolerance = rtol, AbsoluteTolerance = atolScale * rtol, Output = OutputTimes.FinalOnly,
                    MaxSteps = method is OdeMethod.Rodas4 or OdeMethod.Auto ? 10_000_000 : explicitCap,
                };
                SolveResult? result = null;
                string note = "";
                double seconds;
                try
                {
                    result = OdeSolver.Solve(system, 0, y0, tEnd, options);
                    var r = result;
                    seconds = r.Statistics.FunctionEvaluations > 2_000_000 ? Time(() => OdeSolver.Solve(system, 0, y0, tEnd, options), 1) : Steady(context, () => OdeSolver.Solve(system, 0, y0, tEnd, options));
                }
                catch (OdeSolverException ex) when (ex.Kind == OdeFailureKind.TooManySteps)
                {
                    o.WriteLine($"  {method,-18} {rtol,8:G2} {"—",10} {"—",10} {ex.Statistics.FunctionEvaluations,10} {">" + ex.Statistics.AcceptedSteps,9} {"",7}  stopped at MaxSteps (t = {ex.LastGoodTime:G3}): stiff for an explicit method");
                    break;
                }
                double err = MaxRelativeError(result.FinalState, reference);
                if (result.MethodSwitches.Count > 0) note = $"switched to Rodas4 at t = {result.MethodSwitches[0].Time:G3}";
                else if (result.StiffnessDetectedAt is { } ts) note = $"stiffness reported at t = {ts:G3}";
                if (method == OdeMethod.DormandPrince54) targets.Add(err);
                var s = result.Statistics;
                o.WriteLine($"  {method,-18} {rtol,8:G2} {err,10:E2} {seconds * 1e3,10:F3} {s.FunctionEvaluations,10} {s.AcceptedSteps,9} {s.JacobianEvaluations,7}  {note}");
            }
        }

        // Fixed-step RK4: ours and MathNet's, at the step that reaches the error of each DOPRI5 run (doubling N).
        foreach (double target in targets.Where(e => e > 1e-13).Distinct())
        {
            foreach (bool mathNet in new[] { false, true })
            {
                long maxN = mathNet ? 1 << 20 : 1 << 24;
                long n = 16;
                double err = double.NaN;
                for (; n <= maxN; n *= 2)
                {
                    err = mathNet ? MathNetRk4Error(system, y0, tEnd, (int)n, reference) : OurRk4Error(system, y0, tEnd, n, reference);
                    if (err <= target) break;
                }
                string name = mathNet ? "MathNet RK4" : "RungeKutta4";
                if (n > maxN)
                {
                    o.WriteLine($"  {name,-18} {"fixed",8} {"—",10} {"—",10} {4 * maxN,10} {">" + maxN,9} {"",7}  did not reach {target:E1} within {maxN} steps");
                    continue;
                }
                long steps = n;
                double seconds = steps * 4 > 4_000_000
                    ? Time(() => Rk4(mathNet, system, y0, tEnd, steps), 1)
                    : Steady(context, () => Rk4(mathNet, system, y0, tEnd, steps));
                string why = err < 0.01 * target ? " (first stable step: stability, not accuracy, sets it)" : "";
                o.WriteLine($"  {name,-18} {"fixed",8} {err,10:E2} {seconds * 1e3,10:F3} {4 * steps,10} {steps,9} {"",7}  steps needed for DOPRI5's {target:E1}{why}");
            }
        }
    }

    private static void Rk4(bool mathNet, IOdeSystem system, double[] y0, double tEnd, long n)
    {
        if (mathNet) MathNetRk4Error(system, y0, tEnd, (int)n, null);
        else OurRk4Error(system, y0, tEnd, n, null);
    }

    private static double OurRk4Error(IOdeSystem system, double[] y0, double tEnd, long n, double[]? reference)
    {
        try
        {
            var r = OdeSolver.Solve(system, 0, y0, tEnd, new SolverOptions { Method = OdeMethod.RungeKutta4, FixedStep = tEnd / n, Output = OutputTimes.FinalOnly, MaxSteps = n + 10 });
            return reference is null ? 0 : MaxRelativeError(r.FinalState, reference);
        }
        catch (OdeSolverException)
        {
            return double.PositiveInfinity; // unstable at this step
        }
    }

    /// <summary>MathNet.Numerics.OdeSolvers.RungeKutta.FourthOrder with N points on [0, tEnd] (N − 1 steps); its API returns every point.</summary>
    private static double MathNetRk4Error(IOdeSystem system, double[] y0, double tEnd, int n, double[]? reference)
    {
        int dim = system.Dimension;
        var f = new Func<double, MVector, MVector>((t, y) =>
        {
            var dy = new double[dim];
            system.Evaluate<double>(t, y.AsArray() ?? y.ToArray(), dy);
            return MVector.Build.Dense(dy);
        });
        var result = MathNetRungeKutta.FourthOrder(MVector.Build.DenseOfArray(y0), 0, tEnd, n + 1, f);
        if (reference is null) return 0;
        var last = result[^1].ToArray();
        if (last.Any(v => !double.IsFinite(v))) return double.PositiveInfinity;
        return MaxRelativeError(last, reference);
    }

    private static double MaxRelativeError(IReadOnlyList<double> y, double[] reference)
    {
        double e = 0;
        for (int i = 0; i < reference.Length; i++) e = Math.Max(e, Math.Abs(y[i] - reference[i]) / Math.Abs(reference[i]));
        return double.IsNaN(e) ? double.PositiveInfinity : e;
    }

    /// <summary>
    /// Median seconds of <paramref name="action"/> in steady state: runs it for at least 0.3 s (and 30 calls) first, so that
    /// the JIT's tiered compilation has promoted the solver's methods before timing.
    /// </summary>
    private static double Steady(BenchContext context, Action action, int samples = 5)
    {
        var sw = Stopwatch.StartNew();
        for (int i = 0; i < 30 || sw.Elapsed.TotalSeconds < 0.3; i++)
        {
            action();
            if (sw.Elapsed.TotalSeconds > 3) break;
        }
        return context.MedianSeconds(action, samples);
    }

    private static double Time(Action a, int repeats)
    {
        var sw = Stopwatch.StartNew();
        for (int i = 0; i < repeats; i++) a();
        return sw.Elapsed.TotalSeconds / repeats;
    }

    // ---------------------------------------------------------------- targets

    private static void StiffRobertsonTarget(BenchContext context, double[] reference)
    {
        var options = new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-14, IsAutonomous = true, Output = OutputTimes.FinalOnly };
        var sys = new Robertson();
        var r = OdeSolver.Solve(sys, 0, [1, 0, 0], 1e5, options);
        var (best, median) = context.SteadyNsPerOp(() => OdeSolver.Solve(sys, 0, [1, 0, 0], 1e5, options), 1, warmSeconds: 1.0, samples: 101);
        context.Report($"Robertson [0, 1e5], Rodas4 rtol 1e-8 ({r.Statistics.AcceptedSteps} steps, err {MaxRelativeError(r.FinalState, reference):E1}): best CPU", best / 1e6, "ms", "< 0.5 ms");
        context.Report("  same, median wall", median / 1e6, "ms");
        context.Report($"  per attempted step (best CPU; {r.Statistics.FunctionEvaluations} f, {r.Statistics.JacobianEvaluations} J)", best / (r.Statistics.AcceptedSteps + r.Statistics.RejectedSteps), "ns");
        var nonAuto = options with { IsAutonomous = false };
        var (best2, _) = context.SteadyNsPerOp(() => OdeSolver.Solve(sys, 0, [1, 0, 0], 1e5, nonAuto), 1, warmSeconds: 0.5, samples: 51);
        context.Report("  same, with the ∂f/∂t difference (IsAutonomous = false), best CPU", best2 / 1e6, "ms");
    }

    private static void ExplicitOverhead(BenchContext context)
    {
        // Two systems: Lorenz-96 (a real right-hand side, whose cost is subtracted) and a nearly free one, y' = −y with
        // 20 components (≈ 5 ns per evaluation), where the step's own work dominates and the subtraction cannot mislead.
        foreach (IOdeSystem sys in new IOdeSystem[] { new Lorenz96(20, 8.0), new LinearDecay(20) })
        {
            var y0 = Enumerable.Range(0, 20).Select(i => 8.0 + (i == 0 ? 0.01 : 0.0)).ToArray();
            var f = RightHandSide.Bind<double>(sys);
            double tRhs = RhsNs(context, f, y0);
            string name = sys is Lorenz96 ? "Lorenz-96" : "y' = −y";
            foreach (var method in new[] { OdeMethod.DormandPrince54, OdeMethod.BogackiShampine32 })
            {
                var options = new SolverOptions { Method = method, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-8, Output = OutputTimes.FinalOnly, MaxStep = 1e-3 };
                double tEnd = context.Quick ? 5 : 20;
                var r = OdeSolver.Solve(sys, 0, y0, tEnd, options);
                long steps = r.Statistics.AcceptedSteps + r.Statistics.RejectedSteps;
                var (best, median) = context.SteadyNsPerOp(() => OdeSolver.Solve(sys, 0, y0, tEnd, options), steps, samples: 15);
                double evalsPerStep = (double)r.Statistics.FunctionEvaluations / steps;
                context.Report($"{method} 20-variable ({name}) step: best CPU", best, "ns");
                context.Report($"  median wall", median, "ns");
                context.Report($"  of which RHS ({evalsPerStep:F2} evals × {tRhs:F1} ns, best CPU)", evalsPerStep * tRhs, "ns");
                context.Report($"  overhead beyond the RHS", best - evalsPerStep * tRhs, "ns", method == OdeMethod.DormandPrince54 ? "< 150 ns" : null);
            }
        }
    }

    private static void StiffOverhead(BenchContext context)
    {
        var sys = new AllenCahn(20);
        var y0 = Enumerable.Range(0, 20).Select(i => Math.Sin(Math.PI * (i + 1) / 21.0)).ToArray();
        var f = RightHandSide.Bind<double>(sys);
        var fd = RightHandSide.Bind<Dual>(sys);
        double tRhs = RhsNs(context, f, y0);
        double tDual = DualRhsNs(context, fd, y0);
        var options = new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-8, IsAutonomous = true, Output = OutputTimes.FinalOnly, MaxStep = 1e-3 };
        double tEnd = context.Quick ? 0.5 : 2;
        var r = OdeSolver.Solve(sys, 0, y0, tEnd, options);
        var s = r.Statistics;
        long attempts = s.AcceptedSteps + s.RejectedSteps;
        var (best, median) = context.SteadyNsPerOp(() => OdeSolver.Solve(sys, 0, y0, tEnd, options), attempts, samples: 15);
        double rhs = ((double)s.FunctionEvaluations * tRhs + (double)s.JacobianEvaluations * 20 * tDual) / attempts;
        context.Report($"Rodas4 20-variable (Allen–Cahn line) step: best CPU (λ_min ≈ {-4 * 441:F0})", best, "ns");
        context.Report("  median wall", median, "ns");
        context.Report($"  of which RHS: {(double)s.FunctionEvaluations / attempts:F2} × {tRhs:F0} ns + 20 dual × {tDual:F0} ns", rhs, "ns");
        context.Report("  Jacobian assembly, LU, stages beyond the RHS evaluations", (best - rhs) / 1e3, "µs", "< 5 µs");
    }

    private static double RhsNs(BenchContext context, RhsFunction<double> f, double[] y)
    {
        var d = new double[y.Length];
        const int reps = 20_000;
        return context.SteadyNsPerOp(() => { for (int i = 0; i < reps; i++) f(0.0, y, d); }, reps, warmSeconds: 0.2).BestNs;
    }

    private static double DualRhsNs(BenchContext context, RhsFunction<Dual> f, double[] y)
    {
        var yd = y.Select((v, i) => new Dual(v, i == 0 ? 1 : 0)).ToArray();
        var d = new Dual[y.Length];
        const int reps = 10_000;
        return context.SteadyNsPerOp(() => { for (int i = 0; i < reps; i++) f(0.0, yd, d); }, reps, warmSeconds: 0.2).BestNs;
    }

    private static void Allocation(BenchContext context)
    {
        var sys = new Lorenz96(20, 8.0);
        var y0 = Enumerable.Range(0, 20).Select(i => 8.0 + (i == 0 ? 0.01 : 0.0)).ToArray();
        var sink = new NullSink();
        foreach (var method in new[] { OdeMethod.DormandPrince54, OdeMethod.Rodas4, OdeMethod.RungeKutta4 })
        {
            SolverOptions Options() => new() { Method = method, MaxStep = 1e-3, FixedStep = method == OdeMethod.RungeKutta4 ? 1e-3 : null, Output = OutputTimes.Uniform(0.01) };
            long shortSteps = OdeSolver.Solve(sys, 0, y0, 1, Options(), sink).Statistics.AcceptedSteps;
            long longSteps = OdeSolver.Solve(sys, 0, y0, 5, Options(), sink).Statistics.AcceptedSteps;
            long a = BenchContext.AllocatedBytes(() => OdeSolver.Solve(sys, 0, y0, 1, Options(), sink));
            long b = BenchContext.AllocatedBytes(() => OdeSolver.Solve(sys, 0, y0, 5, Options(), sink));
            context.Report($"{method}: bytes allocated per step ({longSteps - shortSteps} extra steps; per solve {a} B)", (double)(b - a) / (longSteps - shortSteps), "B", "0");
        }
    }

    private sealed class NullSink : IOutputSink
    {
        public double Last;
        public void Write(double t, ReadOnlySpan<double> y) => Last = y[0];
    }

    // ---------------------------------------------------------------- building blocks

    private static void LuComparison(BenchContext context)
    {
        foreach (int n in new[] { 3, 10, 20, 50 })
        {
            var rng = new Random(1);
            var a = new double[n * n];
            for (int i = 0; i < a.Length; i++) a[i] = rng.NextDouble();
            for (int i = 0; i < n; i++) a[i * n + i] += n; // well conditioned, like I/(hγ) − J
            var b = Enumerable.Range(0, n).Select(i => rng.NextDouble()).ToArray();
            var work = new double[n * n];
            var x = new double[n];
            var piv = new int[n];
            int reps = 200_000 / n;
            double own = context.MedianNsPerOp(() =>
            {
                for (int r = 0; r < reps; r++)
                {
                    a.CopyTo(work, 0);
                    DenseLu.Factor(work, n, piv);
                    for (int s = 0; s < 6; s++) { b.CopyTo(x, 0); DenseLu.Solve(work, n, piv, x); }
                }
            }, reps);
            var m = Matrix<double>.Build.DenseOfRowMajor(n, n, a);
            var vb = MVector.Build.DenseOfArray(b);
            var vx = MVector.Build.Dense(n);
            double mathNet = context.MedianNsPerOp(() =>
            {
                for (int r = 0; r < reps; r++)
                {
                    var lu = m.LU();
                    for (int s = 0; s < 6; s++) lu.Solve(vb, vx);
                }
            }, reps);
            context.Report($"LU factor + 6 solves, n = {n}: DenseLu (stack spans)", own / 1e3, "µs");
            context.Report($"LU factor + 6 solves, n = {n}: MathNet Matrix.LU().Solve", mathNet / 1e3, "µs");
        }
    }

    private static void Dispatch(BenchContext context)
    {
        var sys = new Lorenz96(20, 8.0);
        IOdeSystem viaInterface = sys;
        var y = Enumerable.Range(0, 20).Select(i => 8.0 + i * 0.1).ToArray();
        var d = new double[20];
        var bound = RightHandSide.Bind<double>(sys);
        const int reps = 20_000;
        double direct = context.SteadyNsPerOp(() => { for (int i = 0; i < reps; i++) sys.Evaluate<double>(0, y, d); }, reps, warmSeconds: 0.2).BestNs;
        double iface = context.SteadyNsPerOp(() => { for (int i = 0; i < reps; i++) viaInterface.Evaluate<double>(0, y, d); }, reps, warmSeconds: 0.2).BestNs;
        double del = context.SteadyNsPerOp(() => { for (int i = 0; i < reps; i++) bound(0, y, d); }, reps, warmSeconds: 0.2).BestNs;
        context.Report("Lorenz-96 (n = 20) RHS: direct call on the sealed type", direct, "ns");
        context.Report("Lorenz-96 (n = 20) RHS: through IOdeSystem (generic virtual)", iface, "ns");
        context.Report("Lorenz-96 (n = 20) RHS: bound delegate (what the solver uses)", del, "ns");
        double bind = context.MedianNsPerOp(() => { RightHandSide.Bind<double>(sys); RightHandSide.Bind<Dual>(sys); }, 1);
        context.Report("binding both delegates (once per solve)", bind / 1e3, "µs");
    }

    // ---------------------------------------------------------------- references and problems

    private static Dictionary<(string, double), double[]> LoadReferences()
    {
        string? dir = AppContext.BaseDirectory;
        while (dir is not null && !File.Exists(Path.Combine(dir, "Thermostrat.slnx"))) dir = Path.GetDirectoryName(dir);
        dir ??= Directory.GetCurrentDirectory();
        string path = Path.Combine(dir, "tests", "Model.Tests", "Fixtures", "Numerics", "ode_references.csv");
        var map = new Dictionary<(string, double), double[]>();
        foreach (string line in File.ReadLines(path))
        {
            if (line.StartsWith('#') || line.StartsWith("problem,", StringComparison.Ordinal)) continue;
            var c = line.Split(',');
            map[(c[0], double.Parse(c[1], CultureInfo.InvariantCulture))] =
                c.Skip(3).Where(s => s.Length > 0).Select(s => double.Parse(s, CultureInfo.InvariantCulture)).ToArray();
        }
        return map;
    }

    /// <summary>Robertson (1966) kinetics; Hairer and Wanner II, Sect. IV.1.</summary>
    private sealed class Robertson : IOdeSystem
    {
        public int Dimension => 3;
        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            T a = T.CreateChecked(0.04) * y[0], b = T.CreateChecked(1e4) * y[1] * y[2], c = T.CreateChecked(3e7) * y[1] * y[1];
            dydt[0] = b - a;
            dydt[1] = a - b - c;
            dydt[2] = c;
        }
    }

    /// <summary>Van der Pol, unscaled: y1' = y2, y2' = μ(1 − y1²)y2 − y1.</summary>
    private sealed class VanDerPol(double mu) : IOdeSystem
    {
        public int Dimension => 2;
        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            dydt[0] = y[1];
            dydt[1] = T.CreateChecked(mu) * (T.One - y[0] * y[0]) * y[1] - y[0];
        }
    }

    /// <summary>
    /// Stommel (1961)-type two-box model, nondimensional: T' = η1 − T − |T − S|T, S' = η2(t) − η3 S − |T − S|S (form from memory),
    /// with invented periodic freshwater forcing η2(t) = η2 + a sin(2πt/P).
    /// </summary>
    private sealed class Stommel(double eta1, double eta2, double amplitude, double period, double eta3) : IOdeSystem
    {
        public int Dimension => 2;
        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            T q = T.Abs(y[0] - y[1]);
            dydt[0] = T.CreateChecked(eta1) - y[0] - q * y[0];
            dydt[1] = T.CreateChecked(eta2 + amplitude * Math.Sin(2 * Math.PI * t / period)) - T.CreateChecked(eta3) * y[1] - q * y[1];
        }
    }

    /// <summary>Lorenz (1996) "model 96": x_i' = (x_{i+1} − x_{i−2}) x_{i−1} − x_i + F, cyclic; non-stiff.</summary>
    private sealed class Lorenz96(int n, double forcing) : IOdeSystem
    {
        public int Dimension => n;
        public void Evaluate<T>(double t, ReadOnlySpan<T> x, Span<T> dxdt) where T : struct, IFloatingPointIeee754<T>
        {
            T f = T.CreateChecked(forcing);
            for (int i = 0; i < n; i++)
            {
                int ip = i + 1 == n ? 0 : i + 1, im = i == 0 ? n - 1 : i - 1, im2 = i < 2 ? i + n - 2 : i - 2;
                dxdt[i] = (x[ip] - x[im2]) * x[im] - x[i] + f;
            }
        }
    }

    /// <summary>y_i' = −y_i: a right-hand side that costs almost nothing, to expose the step's own work.</summary>
    private sealed class LinearDecay(int n) : IOdeSystem
    {
        public int Dimension => n;
        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            for (int i = 0; i < y.Length; i++) dydt[i] = -y[i];
        }
    }

    /// <summary>Allen–Cahn on a line of n nodes (finite differences, Dirichlet 0): u_i' = (u_{i−1} − 2u_i + u_{i+1})/Δx² + u_i − u_i³; stiff.</summary>
    private sealed class AllenCahn(int n) : IOdeSystem
    {
        private readonly double _inv = (n + 1.0) * (n + 1.0);
        public int Dimension => n;
        public void Evaluate<T>(double t, ReadOnlySpan<T> u, Span<T> dudt) where T : struct, IFloatingPointIeee754<T>
        {
            T c = T.CreateChecked(_inv), two = T.CreateChecked(2);
            for (int i = 0; i < n; i++)
            {
                T left = i > 0 ? u[i - 1] : T.Zero, right = i < n - 1 ? u[i + 1] : T.Zero;
                dudt[i] = c * (left - two * u[i] + right) + u[i] - u[i] * u[i] * u[i];
            }
        }
    }
}
