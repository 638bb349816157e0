using Thermostrat.Model.Analysis;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Orbital;
using Thermostrat.Model.Physics;

namespace Thermostrat.Bench;

/// <summary>
/// Tropical box model benchmarks: the right-hand side and its exact Jacobian, then three runs of the
/// issue's performance targets on one core — 1 Myr with annual-mean orbital forcing (&lt; 0.5 s), 100 kyr
/// with the seasonal cycle resolved (&lt; 5 s), 10 kyr with interannual (recharge-oscillator) variability
/// (&lt; 2 s) — and memory growth with run length (streamed output: flat).
/// </summary>
public static class BoxModelBench
{
    public static void Run(BenchContext context)
    {
        // Right-hand side at the default equilibrium.
        var model = Build(new TropicalModelOptions(), startAgeKa: 0, durationYears: 1000);
        double[] y = Equilibrium(model);
        var dydt = new double[model.Dimension];
        var jacobian = new double[model.Dimension * model.Dimension];
        var f = new double[model.Dimension];
        context.Report($"right-hand side (n = {model.Dimension}, {model.ActiveProcesses.Count} processes, TEOS-10)",
            context.MedianNsPerOp(() => { for (int i = 0; i < 10000; i++) model.Evaluate<double>(12.3, y, dydt); }, 10000), "ns");
        context.Report("  exact Jacobian (dual numbers)", context.MedianNsPerOp(() => { for (int i = 0; i < 500; i++) AutoJacobian.OfState(model, 12.3, y, jacobian, f); }, 500), "ns");
        context.Report("  allocated per right-hand side", BenchContext.AllocatedBytes(() => { for (int i = 0; i < 1000; i++) model.Evaluate<double>(12.3, y, dydt); }) / 1000.0, "B");
        var forcing = new double[ForcingChannel.Count];
        context.Report("  forcing lookup (annual mean)", context.MedianNsPerOp(() => { for (int i = 0; i < 10000; i++) model.Forcing.At(12.3 + i * 1e-3, forcing); }, 10000), "ns");
        foreach (var eos in new[] { "linear", "roquet2015", "eos80" })
        {
            var o = new TropicalModelOptions { EquationOfState = eos };
            var m = Build(o, 0, 1000);
            context.Report($"  right-hand side with EOS '{eos}'", context.MedianNsPerOp(() => { for (int i = 0; i < 10000; i++) m.Evaluate<double>(12.3, y, dydt); }, 10000), "ns");
        }

        // 1 Myr, annual-mean Berger (1978) forcing from 1000 ka, output every 1 kyr (stiff: Rosenbrock), steps ≤ 1 kyr.
        {
            var run = new RunOptions { StartAgeKa = 1000, DurationYears = 1e6, OutputIntervalYears = 1000, Method = RunMethod.Auto, RelativeTolerance = 1e-5, AbsoluteTolerance = 1e-6, MaxStepYears = 1000 };
            double build = context.MedianSeconds(() => Build(new TropicalModelOptions(), run.StartAgeKa, run.DurationYears), 3);
            var m = Build(new TropicalModelOptions(), run.StartAgeKa, run.DurationYears);
            RunSummary? s = null;
            double secs = context.MedianSeconds(() => s = TropicalRun.Execute(m, run, new CountingSink(), initialState: y), 3);
            context.Report($"1 Myr annual-mean orbital run ({s!.AcceptedSteps} steps, {s.Rows} rows, {s.FinalMethod})", secs, "s", "< 0.5 s");
            context.Report("  model build (forcing precompute on one core)", build, "s");
            context.Report("  build + run", build + secs, "s", "< 0.5 s");
            long big = BenchContext.AllocatedBytes(() => TropicalRun.Execute(m, run, new CountingSink(), initialState: y));
            var shortRun = new RunOptions { StartAgeKa = run.StartAgeKa, DurationYears = 1e5, OutputIntervalYears = run.OutputIntervalYears, Method = run.Method, RelativeTolerance = run.RelativeTolerance, AbsoluteTolerance = run.AbsoluteTolerance };
            var m2 = Build(new TropicalModelOptions(), run.StartAgeKa, shortRun.DurationYears);
            long small = BenchContext.AllocatedBytes(() => TropicalRun.Execute(m2, shortRun, new CountingSink(), initialState: y));
            context.Report("  allocated by the run, 1 Myr", big / 1024.0, "KiB");
            context.Report("  allocated by the run, 100 kyr", small / 1024.0, "KiB");
        }

        // 100 kyr with the seasonal cycle (daily insolation), output every 100 years.
        {
            var o = new TropicalModelOptions();
            o.Forcing.SeasonalCycle = true;
            var run = new RunOptions { StartAgeKa = 100, DurationYears = 1e5, OutputIntervalYears = 100, Method = RunMethod.DormandPrince54, RelativeTolerance = 1e-5, AbsoluteTolerance = 1e-6 };
            double build = context.MedianSeconds(() => Build(o, run.StartAgeKa, run.DurationYears), 3);
            var m = Build(o, run.StartAgeKa, run.DurationYears);
            RunSummary? s = null;
            double secs = context.MedianSeconds(() => s = TropicalRun.Execute(m, run, new CountingSink(), initialState: y), 3);
            context.Report($"100 kyr seasonal-cycle run ({s!.AcceptedSteps} steps, {s.AcceptedSteps / 1e5:F1} per year)", secs, "s", "< 5 s");
            context.Report("  model build (seasonal forcing precompute on one core)", build, "s");
        }

        // 10 kyr with the recharge oscillator prognostic (interannual oscillations), output every year.
        {
            var o = new TropicalModelOptions();
            o.Processes.Get<WarmWaterRechargeOptions>(WarmWaterRecharge.ProcessName).Prognostic = true;
            var run = new RunOptions { StartAgeKa = 10, DurationYears = 1e4, OutputIntervalYears = 1, Method = RunMethod.DormandPrince54, RelativeTolerance = 1e-5, AbsoluteTolerance = 1e-6 };
            var m = Build(o, run.StartAgeKa, run.DurationYears);
            var y0 = m.InitialState();
            y.AsSpan().CopyTo(y0);
            y0[(int)Box.ColdTongue] += 0.1;
            RunSummary? s = null;
            double secs = context.MedianSeconds(() => s = TropicalRun.Execute(m, run, new CountingSink(), initialState: y0), 3);
            context.Report($"10 kyr interannual run ({s!.AcceptedSteps} steps, {s.Rows} rows)", secs, "s", "< 2 s");
        }
    }

    private static TropicalBoxModel Build(TropicalModelOptions options, double startAgeKa, double durationYears) =>
        TropicalBoxModel.Create(options, new ForcingEnvironment { Orbit = Berger1978Orbit.Shared, StartAgeKa = startAgeKa, DurationYears = durationYears, ParallelPrecompute = false });

    private static double[] Equilibrium(TropicalBoxModel model)
    {
        var p = new double[model.ParameterCount];
        model.GetParameters(p);
        return SteadyState.Solve(model, model.InitialState(), p).State.ToArray();
    }

    /// <summary>A sink that only counts rows (the runner's Parquet writer would stream them to disk).</summary>
    private sealed class CountingSink : IRowSink
    {
        public long Rows;
        public double Checksum;
        public void Begin(IReadOnlyList<ColumnInfo> columns) { }
        public void Write(ReadOnlySpan<double> row) { Rows++; Checksum += row[2]; }
        public void End(RunSummary summary) { }
    }
}
