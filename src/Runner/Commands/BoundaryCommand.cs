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
/// <c>thermostrat boundary</c>: curves of folds and Hopf points in a plane of two parameters —
/// the map of where a state collapses and where oscillations are born — with the bistable region
/// between fold curves shaded.
/// </summary>
public sealed class BoundaryCommand : IRunnerCommand
{
    private readonly CommonOptions _common = new("out/boundary");
    private readonly ModelChoiceOptions _model = new();
    private readonly Option<string> _vary = new("--vary") { Description = "First parameter (horizontal axis); the folds are found on a branch in it.", Required = true };
    private readonly Option<double> _from = new("--from") { Description = "Lower end of the first parameter's range.", Required = true };
    private readonly Option<double> _to = new("--to") { Description = "Upper end of the first parameter's range.", Required = true };
    private readonly Option<string> _second = new("--second") { Description = "Second parameter (vertical axis).", Required = true };
    private readonly Option<double> _sFrom = new("--second-from") { Description = "Lower end of the second parameter's range.", Required = true };
    private readonly Option<double> _sTo = new("--second-to") { Description = "Upper end of the second parameter's range.", Required = true };
    private readonly Option<string> _curves = new("--curves") { Description = "Which curves: folds, hopf or both (default both).", DefaultValueFactory = _ => "both" };
    private readonly Option<int> _maxPoints = new("--max-points") { Description = "Largest number of points per curve direction (default 1000).", DefaultValueFactory = _ => 1000 };
    private readonly Option<int> _cuts = new("--cuts") { Description = "Number of second-parameter values at which the bistable interval is tabulated (default 60).", DefaultValueFactory = _ => 60 };

    /// <inheritdoc />
    public Command Build(TextWriter stdout, TextWriter stderr)
    {
        var cmd = new Command("boundary",
            "Trace curves of folds (and Hopf points) in two parameters, starting from those found on a branch in the first parameter; " +
            "detect cusps and Bogdanov–Takens points; tabulate the bistable interval (the collapse thresholds) against the second parameter. " +
            "Writes curves.parquet, curve_points.parquet, bistable.parquet, boundary.png and run.json.\n\n" +
            "Examples:\n" +
            "  thermostrat boundary --model stommel-smooth --vary Eta2 --from 0 --to 2 --second Eta1 --second-from 1 --second-to 5\n" +
            "  thermostrat boundary --model recharge-oscillator --vary mu --from 0.2 --to 1.2 --second gamma --second-from 0.3 --second-to 1.2 --curves hopf");
        foreach (var o in new Option[] { _vary, _from, _to, _second, _sFrom, _sTo, _curves, _maxPoints, _cuts }) cmd.Options.Add(o);
        _model.AddTo(cmd);
        _common.AddTo(cmd);
        cmd.SetAction(pr => Cli.Guard(stderr, () => Execute(pr, stdout, stderr)));
        return cmd;
    }

    private int Execute(ParseResult pr, TextWriter stdout, TextWriter stderr)
    {
        var settings = ConfigLoader.Load<Settings>(_common.Request(pr));
        var (from, to) = ModelChoiceOptions.Range("--from/--to", pr.GetValue(_from), pr.GetValue(_to));
        var (sFrom, sTo) = ModelChoiceOptions.Range("--second-from/--second-to", pr.GetValue(_sFrom), pr.GetValue(_sTo));
        var which = (pr.GetValue(_curves) ?? "both").ToLowerInvariant();
        if (which is not ("folds" or "hopf" or "both")) throw new ConfigurationException($"--curves '{which}': allowed folds, hopf, both");
        int maxPoints = pr.GetValue(_maxPoints), cuts = pr.GetValue(_cuts);
        if (maxPoints < 2 || maxPoints > 1_000_000) throw new ConfigurationException($"--max-points = {maxPoints}: allowed 2 to 1000000");
        if (cuts < 2 || cuts > 100_000) throw new ConfigurationException($"--cuts = {cuts}: allowed 2 to 100000");

        var host = ModelHosts.Create(pr.GetValue(_model.Model)!, settings);
        int k1 = ModelChoiceOptions.ParameterIndex(host, pr.GetValue(_vary)!, "--vary");
        int k2 = ModelChoiceOptions.ParameterIndex(host, pr.GetValue(_second)!, "--second");
        if (k1 == k2) throw new ConfigurationException("--vary and --second name the same parameter; two different parameters are needed");
        var p0 = new double[host.System.ParameterCount];
        host.System.GetParameters(p0);
        var (_, p, start) = _model.Prepare(pr, host, k1, Math.Clamp(p0[k1], from, to));
        if (p[k2] < sFrom || p[k2] > sTo)
            throw new ConfigurationException($"the model's {host.System.GetParameterName(k2)} = {p[k2].ToString("G6", CultureInfo.InvariantCulture)} lies outside --second-from/--second-to; the curves start from folds found at that value");

        var branch = Model.Analysis.Continuation.Trace(host.System, k1, start.State.AsSpan(), p, ModelChoiceOptions.Continuation(host, from, to));
        var curveOptions = new CurveOptions
        {
            FirstParameterMin = from, FirstParameterMax = to, SecondParameterMin = sFrom, SecondParameterMax = sTo,
            InitialStep = 0.01, MaxStep = 0.1, MaxPoints = maxPoints, StateScale = host.StateScale, Validity = host.Validity,
        };
        var curves = new List<Curve>();
        var notes = new List<string>();
        if (which is "folds" or "both")
            foreach (var fold in branch.OfKind(SpecialPointKind.Fold))
            {
                if (curves.Any(c => c.Kind == CurveKind.Fold && OnCurve(c, fold.Parameter, p[k2], from, to, sFrom, sTo))) continue;
                curves.Add(TwoParameterContinuation.TraceFold(host.System, branch, fold, host.System.GetParameterName(k2), curveOptions));
            }
        if (which is "hopf" or "both")
            foreach (var hopf in branch.OfKind(SpecialPointKind.Hopf))
            {
                if (curves.Any(c => c.Kind == CurveKind.Hopf && OnCurve(c, hopf.Parameter, p[k2], from, to, sFrom, sTo))) continue;
                curves.Add(TwoParameterContinuation.TraceHopf(host.System, branch, hopf, host.System.GetParameterName(k2), curveOptions));
            }
        if (curves.Count == 0)
            notes.Add($"no {(which == "hopf" ? "Hopf points" : which == "folds" ? "folds" : "folds or Hopf points")} on the branch in {host.System.GetParameterName(k1)} over [{from:G6}, {to:G6}] at {host.System.GetParameterName(k2)} = {p[k2]:G6}; nothing to continue");
        var cutValues = Enumerable.Range(0, cuts).Select(i => sFrom + (sTo - sFrom) * i / (cuts - 1)).ToArray();
        // The bistable interval at each cut is bounded by the outermost folds of all fold curves
        // together: the two folds of a hysteresis loop may lie on separate curves in the window.
        var perCurve = curves.Where(c => c.Kind == CurveKind.Fold).Select(c => BistableRegion.Map(host.System, c, cutValues)).ToList();
        var bistable = new List<IReadOnlyList<BistableInterval>>();
        if (perCurve.Count > 0)
            bistable.Add(cutValues.Select((v, i) => new BistableInterval
            {
                SecondParameter = v,
                Folds = [.. perCurve.SelectMany(m => m[i].Folds).Order()],
                Residual = perCurve.Max(m => m[i].Residual),
            }).ToList());

        using var output = OutputFolder.Begin(pr.GetValue(_common.Out)!, pr.GetValue(_common.Replace));
        string n1 = host.System.GetParameterName(k1), n2 = host.System.GetParameterName(k2);
        var meta = ResolvedConfig.Metadata(host.ResolvedSettings, "boundary", new Dictionary<string, string>
        {
            ["thermostrat.model"] = host.Name,
            ["thermostrat.first_parameter"] = n1,
            ["thermostrat.second_parameter"] = n2,
            ["thermostrat.ended_early"] = curves.Any(c => c.EndedEarly) ? "true" : "false",
        });
        WriteCurves(output.File_("curve_points.parquet"), host, curves, meta);
        WriteCurveSummary(output.File_("curves.parquet"), curves, meta);
        WriteBistable(output.File_("bistable.parquet"), cutValues, bistable, meta);
        BoundaryFigure.Draw(output.File_("boundary.png"), host.Name, n1, n2, curves, cutValues, bistable, (from, to, sFrom, sTo), (p[k1], p[k2]));
        output.WriteRunRecord("boundary", Environment.GetCommandLineArgs().Skip(1).ToList(),
            new Dictionary<string, object?> { ["model"] = host.Name, ["model_settings"] = host.ResolvedSettings, ["configuration"] = settings },
            new Dictionary<string, object?>
            {
                ["first_parameter"] = n1, ["second_parameter"] = n2, ["curves"] = curves.Count,
                ["curve_ends"] = curves.Select(c => new[] { c.Forward.Message, c.Reverse?.Message }).ToList(), ["notes"] = notes,
            });
        output.Commit();

        if (!pr.GetValue(_common.Quiet))
        {
            stdout.WriteLine($"{host.Name}: {curves.Count(c => c.Kind == CurveKind.Fold)} fold curve(s), {curves.Count(c => c.Kind == CurveKind.Hopf)} Hopf curve(s) in ({n1}, {n2})");
            var rows = new List<string[]> { new[] { "curve", "kind", "points", "special points", "ends" } };
            for (int i = 0; i < curves.Count; i++)
            {
                var c = curves[i];
                rows.Add([(i + 1).ToString(CultureInfo.InvariantCulture), c.Kind.ToString().ToLowerInvariant(), c.Points.Count.ToString(CultureInfo.InvariantCulture),
                    string.Join("; ", c.SpecialPoints.Where(s => s.Kind != SpecialPointKind.End).Select(s => $"{BranchTables.KindName(s.Kind)} at ({s.Parameter:G6}, {s.SecondParameter:G6})")),
                    $"{c.Forward.Reason}/{c.Reverse?.Reason}"]);
            }
            if (curves.Count > 0) TextTable.Write(stdout, rows);
            foreach (var n in notes) stdout.WriteLine("  " + n);
            foreach (var c in curves.Where(c => c.EndedEarly))
                stderr.WriteLine($"warning: a {c.Kind.ToString().ToLowerInvariant()} curve ended early: {c.Forward.Message} {c.Reverse?.Message}");
        }
        stdout.WriteLine($"wrote {output.FinalPath}: curves.parquet, curve_points.parquet, bistable.parquet, boundary.png, run.json");
        return Cli.Ok;
    }


    /// <summary>True if curve <paramref name="c"/> passes through (first, second): it crosses the line of
    /// the second parameter's value within 0.1 % of the first parameter's range of the point.</summary>
    private static bool OnCurve(Curve c, double first, double second, double from, double to, double sFrom, double sTo)
    {
        var q = c.Points;
        for (int i = 1; i < q.Count; i++)
        {
            double a = q[i - 1].SecondParameter - second, b = q[i].SecondParameter - second;
            if (a * b > 0) continue;
            double w = a == b ? 0 : a / (a - b);
            double x = q[i - 1].FirstParameter + w * (q[i].FirstParameter - q[i - 1].FirstParameter);
            if (Math.Abs(x - first) < 1e-3 * (to - from)) return true;
        }
        return false;
    }

    private static void WriteCurves(string path, IModelHost host, List<Curve> curves, Dictionary<string, string> meta)
    {
        var cols = new List<ColumnSpec>
        {
            new("curve", "1", "curve number (see curves.parquet)", ColumnKind.Int64),
            new("kind", "", "fold | hopf", ColumnKind.Text),
            new("point_index", "1", "point number along the curve", ColumnKind.Int64),
            new("first_parameter_value", "", "value of the first parameter"),
            new("second_parameter_value", "", "value of the second parameter"),
            new("frequency", "rad/time", "ω of the critical pair on a Hopf curve (NaN on fold curves)"),
            new("period", "time", "2π/ω on a Hopf curve (NaN on fold curves)"),
            new("point_type", "", "regular | start | end | cusp | bogdanov-takens | corner-kink", ColumnKind.Text),
        };
        cols.AddRange(host.StateColumns);
        using var w = ParquetTableWriter.Create(path, cols, meta);
        for (int ci = 0; ci < curves.Count; ci++)
            for (int i = 0; i < curves[ci].Points.Count; i++)
            {
                var q = curves[ci].Points[i];
                int c = 0;
                w.Set(c++, (long)(ci + 1));
                w.Set(c++, curves[ci].Kind.ToString().ToLowerInvariant());
                w.Set(c++, (long)i);
                w.Set(c++, q.FirstParameter);
                w.Set(c++, q.SecondParameter);
                w.Set(c++, q.Frequency ?? double.NaN);
                w.Set(c++, q.Frequency is double f && f > 0 ? 2 * Math.PI / f : double.NaN);
                w.Set(c++, BranchTables.TypeName(q.Type));
                foreach (var v in q.State) w.Set(c++, v);
                w.EndRow();
            }
        w.Complete();
    }

    private static void WriteCurveSummary(string path, List<Curve> curves, Dictionary<string, string> meta)
    {
        using var w = ParquetTableWriter.Create(path,
        [
            new ColumnSpec("curve", "1", "curve number", ColumnKind.Int64),
            new ColumnSpec("kind", "", "fold | hopf, or a special point kind on the curve", ColumnKind.Text),
            new ColumnSpec("first_parameter_value", "", "first parameter (of the special point; NaN for the curve row)"),
            new ColumnSpec("second_parameter_value", "", "second parameter (of the special point)"),
            new ColumnSpec("residual", "1", "residual of the located special point"),
            new ColumnSpec("description", "", "ends of the curve, or what the special point is", ColumnKind.Text),
        ], meta);
        for (int ci = 0; ci < curves.Count; ci++)
        {
            var c = curves[ci];
            w.Set(0, (long)(ci + 1)); w.Set(1, c.Kind.ToString().ToLowerInvariant()); w.Set(2, double.NaN); w.Set(3, double.NaN); w.Set(4, double.NaN);
            w.Set(5, $"{c.Points.Count} points; forward end: {c.Forward.Reason} ({c.Forward.Message}); reverse end: {c.Reverse?.Reason} ({c.Reverse?.Message})");
            w.EndRow();
            foreach (var s in c.SpecialPoints)
            {
                w.Set(0, (long)(ci + 1)); w.Set(1, BranchTables.KindName(s.Kind)); w.Set(2, s.Parameter); w.Set(3, s.SecondParameter ?? double.NaN); w.Set(4, s.Residual);
                w.Set(5, s.Description);
                w.EndRow();
            }
        }
        w.Complete();
    }

    private static void WriteBistable(string path, double[] cuts, List<IReadOnlyList<BistableInterval>> maps, Dictionary<string, string> meta)
    {
        using var w = ParquetTableWriter.Create(path,
        [
            new ColumnSpec("fold_curve", "1", "always 1: the folds of all fold curves together", ColumnKind.Int64),
            new ColumnSpec("second_parameter_value", "", "value of the second parameter"),
            new ColumnSpec("fold_count", "1", "folds of the first parameter at this value", ColumnKind.Int64),
            new ColumnSpec("lower_threshold", "", "smallest fold of the first parameter (NaN with fewer than two folds)"),
            new ColumnSpec("upper_threshold", "", "largest fold of the first parameter (NaN with fewer than two folds)"),
            new ColumnSpec("residual", "1", "largest residual of the refined folds"),
        ], meta);
        for (int m = 0; m < maps.Count; m++)
            foreach (var b in maps[m])
            {
                w.Set(0, (long)(m + 1)); w.Set(1, b.SecondParameter); w.Set(2, (long)b.Folds.Length); w.Set(3, b.Lower); w.Set(4, b.Upper); w.Set(5, b.Residual);
                w.EndRow();
            }
        w.Complete();
    }
}
