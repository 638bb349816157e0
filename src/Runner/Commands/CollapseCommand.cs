using System.CommandLine;
using System.Globalization;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Runner.Configuration;
using Thermostrat.Runner.Models;
using Thermostrat.Runner.Output;

namespace Thermostrat.Runner.Commands;

/// <summary>
/// <c>thermostrat collapse</c>: a collapse threshold from transient runs (bisection on a parameter
/// for the value where a watched quantity falls below a level), compared with the nearest fold of
/// the continued branch; optionally a quasi-static ramp run showing how far a finite-rate ramp
/// overshoots the fold.
/// </summary>
public sealed class CollapseCommand : IRunnerCommand
{
    private readonly CommonOptions _common = new("out/collapse");
    private readonly ModelChoiceOptions _model = new();
    private readonly Option<string> _vary = new("--vary") { Description = "The parameter searched.", Required = true };
    private readonly Option<double> _from = new("--from") { Description = "Parameter value at which the state holds (one end of the bracket).", Required = true };
    private readonly Option<double> _to = new("--to") { Description = "Parameter value at which it collapses (the other end).", Required = true };
    private readonly Option<string?> _watch = new("--watch") { Description = "Column watched (a state or diagnostic column; default the first diagnostic)." };
    private readonly Option<double> _below = new("--below") { Description = "Collapse level: a fraction of the watched quantity's starting value (default 0.1), or an absolute value with --absolute.", DefaultValueFactory = _ => 0.1 };
    private readonly Option<bool> _absolute = new("--absolute") { Description = "Read --below as an absolute value in the column's unit." };
    private readonly Option<double> _duration = new("--duration") { Description = "Length of each transient run, in the model's time unit (years for the tropical model).", Required = true };
    private readonly Option<double?> _tolerance = new("--tolerance") { Description = "Stop when the bracket is this narrow (parameter units; default 1e-6 of the range)." };
    private readonly Option<double?> _ramp = new("--ramp-rate") { Description = "Also run a quasi-static ramp from --from to --to at this rate (parameter units per time unit) and compare it with the branch." };

    /// <inheritdoc />
    public Command Build(TextWriter stdout, TextWriter stderr)
    {
        var cmd = new Command("collapse",
            "Find a collapse threshold by transient runs: bisection on a parameter for the value at which a watched quantity, started from the " +
            "equilibrium at --from, falls below a level within --duration; reported with its bracket and compared with the nearest fold of the branch. " +
            "With --ramp-rate, also a quasi-static ramp run and where it leaves the branch. Writes collapse_runs.parquet, branch.parquet, " +
            "[ramp.parquet], collapse.png and run.json.\n\n" +
            "Examples:\n" +
            "  thermostrat collapse --model stommel --vary Eta2 --from 1 --to 1.6 --watch flow_q --below 0.1 --duration 200\n" +
            "  thermostrat collapse --model stommel --vary Eta2 --from 1 --to 1.6 --duration 200 --ramp-rate 0.001");
        foreach (var o in new Option[] { _vary, _from, _to, _watch, _below, _absolute, _duration, _tolerance, _ramp }) cmd.Options.Add(o);
        _model.AddTo(cmd);
        _common.AddTo(cmd);
        cmd.SetAction(pr => Cli.Guard(stderr, () => Execute(pr, stdout, stderr)));
        return cmd;
    }

    private int Execute(ParseResult pr, TextWriter stdout, TextWriter stderr)
    {
        var settings = ConfigLoader.Load<Settings>(_common.Request(pr));
        double a = pr.GetValue(_from), b = pr.GetValue(_to);
        if (!double.IsFinite(a) || !double.IsFinite(b) || a == b)
            throw new ConfigurationException($"--from/--to: {a.ToString("G6", CultureInfo.InvariantCulture)} and {b.ToString("G6", CultureInfo.InvariantCulture)} must be finite and different");
        double duration = pr.GetValue(_duration);
        if (!(duration > 0) || !double.IsFinite(duration)) throw new ConfigurationException($"--duration = {duration.ToString("G6", CultureInfo.InvariantCulture)}: must be a finite number > 0");
        double below = pr.GetValue(_below);
        bool absolute = pr.GetValue(_absolute);
        if (!double.IsFinite(below) || (!absolute && (below <= 0 || below >= 1)))
            throw new ConfigurationException($"--below = {below.ToString("G6", CultureInfo.InvariantCulture)}: a fraction must lie strictly between 0 and 1 (or pass --absolute for a value)");
        double? tol = pr.GetValue(_tolerance);
        if (tol is { } t && !(t > 0)) throw new ConfigurationException($"--tolerance = {t}: must be > 0");
        double? rate = pr.GetValue(_ramp);
        if (rate is { } r && !(r > 0 && double.IsFinite(r))) throw new ConfigurationException($"--ramp-rate = {r}: must be a finite number > 0");

        var host = ModelHosts.Create(pr.GetValue(_model.Model)!, settings);
        int k = ModelChoiceOptions.ParameterIndex(host, pr.GetValue(_vary)!, "--vary");
        int wi = ColumnReader.Find(host, pr.GetValue(_watch), "--watch");
        var (_, p, start) = _model.Prepare(pr, host, k, a);
        // Diagnostics are evaluated with the run's other parameters (the searched one at its start value).
        var watchReader = new ColumnReader(host, wi, p, k);
        string watch = watchReader.Column.Name;
        double Watch(ReadOnlySpan<double> y) => watchReader.Value(y, a);

        double lo = Math.Min(a, b), hi = Math.Max(a, b);
        var branch = Model.Analysis.Continuation.Trace(host.System, k, start.State.AsSpan(), p, ModelChoiceOptions.Continuation(host, lo, hi));
        ThresholdResult result;
        try
        {
            result = ThresholdBisection.Find(host.System, k, start.State.AsSpan(), p, new ThresholdOptions
            {
                Lower = a, Upper = b, Duration = duration, Diagnostic = Watch, Level = below, RelativeLevel = !absolute,
                Tolerance = tol, Folds = branch.SpecialPoints,
            });
        }
        catch (Model.Numerics.Ode.OdeSolverException e)
        {
            throw new RunFailedException("a transient run failed: " + e.Message, e);
        }
        RampTrajectory? ramp = null;
        RampComparison? comparison = null;
        double? rampCollapse = null;
        if (rate is { } rr)
        {
            ramp = RampRun.Run(host.System, k, start.State.AsSpan(), p, new RampOptions { StartValue = a, EndValue = b, Rate = rr });
            comparison = RampRun.Compare(ramp, branch, 0.2, host.StateScale);
            // Where the ramp itself collapses: the first sample at which the watched quantity is
            // below the same level as in the transient runs (interpolated between samples).
            for (int i = 1; i < ramp.Times.Length && rampCollapse is null; i++)
            {
                double w0 = Watch(ramp.States[i - 1].AsSpan()) - result.AbsoluteLevel, w1 = Watch(ramp.States[i].AsSpan()) - result.AbsoluteLevel;
                if (w0 >= 0 && w1 < 0)
                    rampCollapse = ramp.ParameterValues[i - 1] + w0 / (w0 - w1) * (ramp.ParameterValues[i] - ramp.ParameterValues[i - 1]);
            }
        }

        using var output = OutputFolder.Begin(pr.GetValue(_common.Out)!, pr.GetValue(_common.Replace));
        string pname = host.System.GetParameterName(k);
        var meta = ResolvedConfig.Metadata(host.ResolvedSettings, "collapse", new Dictionary<string, string>
        {
            ["thermostrat.model"] = host.Name,
            ["thermostrat.parameter"] = pname,
            ["thermostrat.watch"] = watch,
            ["thermostrat.summary"] = result.Summary,
        });
        using (var w = ParquetTableWriter.Create(output.File_("collapse_runs.parquet"),
        [
            new ColumnSpec("run", "1", "transient run number, in the order made", ColumnKind.Int64),
            new ColumnSpec("parameter_value", "", $"value of {pname}"),
            new ColumnSpec("collapsed", "1", $"1 if {watch} fell below the level within the run", ColumnKind.Int64),
            new ColumnSpec("collapse_time", "time", "time of the collapse since the start of the run (NaN if none)"),
            new ColumnSpec("final_" + watch, watchReader.Column.Unit, $"{watch} at the end of the run (or at collapse)"),
        ], meta))
        {
            for (int i = 0; i < result.Runs.Count; i++)
            {
                var run = result.Runs[i];
                w.Set(0, (long)(i + 1)); w.Set(1, run.Parameter); w.Set(2, run.Collapsed ? 1L : 0L); w.Set(3, run.CollapseTime ?? double.NaN); w.Set(4, run.FinalDiagnostic);
                w.EndRow();
            }
            w.Complete();
        }
        BranchTables.WriteBranch(output.File_("branch.parquet"), host, branch, p, meta);
        if (ramp is not null) WriteRamp(output.File_("ramp.parquet"), host, ramp, p, meta);
        CollapseFigure.Draw(output.File_("collapse.png"), host, branch, p, wi, result, ramp, comparison);
        output.WriteRunRecord("collapse", Environment.GetCommandLineArgs().Skip(1).ToList(),
            new Dictionary<string, object?> { ["model"] = host.Name, ["model_settings"] = host.ResolvedSettings, ["configuration"] = settings },
            new Dictionary<string, object?>
            {
                ["parameter"] = pname, ["watch"] = watch, ["level"] = result.AbsoluteLevel, ["bracketed"] = result.Bracketed,
                ["threshold"] = result.Threshold, ["bracket"] = new[] { result.NotCollapsedAt, result.CollapsedAt },
                ["nearest_fold"] = result.NearestFold?.Parameter, ["difference_from_fold"] = result.DifferenceFromFold,
                ["summary"] = result.Summary, ["ramp"] = comparison?.Summary, ["ramp_collapse"] = rampCollapse,
                ["ramp_overshoot_beyond_fold"] = rampCollapse is { } rc0 && result.NearestFold is { } nf0 ? rc0 - nf0.Parameter : null,
            });
        output.Commit();

        stdout.WriteLine(result.Summary);
        if (!pr.GetValue(_common.Quiet))
        {
            var rows = new List<string[]>
            {
                new[] { "quantity", "value" },
                new[] { "threshold", result.Threshold.ToString("G10", CultureInfo.InvariantCulture) },
                new[] { "holds at", result.NotCollapsedAt.ToString("G10", CultureInfo.InvariantCulture) },
                new[] { "collapses at", result.CollapsedAt.ToString("G10", CultureInfo.InvariantCulture) },
                new[] { "level of " + watch, result.AbsoluteLevel.ToString("G6", CultureInfo.InvariantCulture) },
                new[] { "transient runs", result.Runs.Count.ToString(CultureInfo.InvariantCulture) },
                new[] { "nearest fold", result.NearestFold is { } f ? $"{f.Parameter.ToString("G10", CultureInfo.InvariantCulture)} ({BranchTables.KindName(f.Kind)})" : "none in range" },
            };
            TextTable.Write(stdout, rows);
            if (comparison is not null)
            {
                stdout.WriteLine("  ramp: " + comparison.Summary);
                stdout.WriteLine(rampCollapse is { } rc
                    ? $"  ramp: {watch} falls below {result.AbsoluteLevel.ToString("G6", CultureInfo.InvariantCulture)} at {pname} = {rc.ToString("G8", CultureInfo.InvariantCulture)}" +
                      (result.NearestFold is { } nf ? $", {(rc - nf.Parameter).ToString("G4", CultureInfo.InvariantCulture)} beyond the fold (the lag of a finite-rate ramp)" : "")
                    : $"  ramp: {watch} stays above the level over the whole ramp");
            }
        }
        if (!result.Bracketed) stderr.WriteLine("warning: the threshold was not bracketed: " + result.Summary);
        stdout.WriteLine($"wrote {output.FinalPath}: collapse_runs.parquet, branch.parquet{(ramp is null ? "" : ", ramp.parquet")}, collapse.png, run.json");
        return Cli.Ok;
    }

    private static void WriteRamp(string path, IModelHost host, RampTrajectory ramp, double[] p, Dictionary<string, string> meta)
    {
        var cols = new List<ColumnSpec>
        {
            new("time", "time", "model time since the start of the ramp"),
            new("parameter_value", "", $"value of {ramp.ParameterName} (ramped at {ramp.Rate.ToString("G4", CultureInfo.InvariantCulture)} per time unit)"),
        };
        cols.AddRange(host.StateColumns);
        cols.AddRange(host.DiagnosticColumns);
        using var w = ParquetTableWriter.Create(path, cols, meta);
        var q = (double[])p.Clone();
        var diag = new double[host.DiagnosticColumns.Count];
        for (int i = 0; i < ramp.Times.Length; i++)
        {
            q[ramp.ParameterIndex] = ramp.ParameterValues[i];
            host.Diagnostics(ramp.Times[i], ramp.States[i].AsSpan(), q, diag);
            int c = 0;
            w.Set(c++, ramp.Times[i]);
            w.Set(c++, ramp.ParameterValues[i]);
            foreach (var v in ramp.States[i]) w.Set(c++, v);
            foreach (var v in diag) w.Set(c++, v);
            w.EndRow();
        }
        w.Complete();
    }
}
