using System.CommandLine;
using System.Globalization;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Runner.Configuration;
using Thermostrat.Runner.Models;
using Thermostrat.Runner.Output;

namespace Thermostrat.Runner.Commands;

/// <summary>Options shared by the commands that work on a model's equilibria.</summary>
internal sealed class ModelChoiceOptions
{
    public Option<string> Model { get; } = new("--model", "-m")
    {
        Description = "Model: " + string.Join(", ", ModelHosts.Names) + ".",
        DefaultValueFactory = _ => ModelHosts.Names[0],
    };

    public Option<string[]> With { get; } = new("--with")
    {
        Description = "Set a model parameter by its analysis name before starting, NAME=VALUE (repeatable).",
    };

    public Option<string?> StartState { get; } = new("--start-state")
    {
        Description = "Comma-separated first guess of the equilibrium (default: the model's own guess).",
    };

    public void AddTo(Command c)
    {
        c.Options.Add(Model);
        c.Options.Add(With);
        c.Options.Add(StartState);
    }

    /// <summary>The model, its parameter vector with --with applied, and a converged starting equilibrium.</summary>
    public (IModelHost Host, double[] Parameters, SteadyStateResult Start) Prepare(ParseResult pr, IModelHost host, int? vary = null, double? startValue = null)
    {
        var sys = host.System;
        var p = new double[sys.ParameterCount];
        sys.GetParameters(p);
        foreach (var w in pr.GetValue(With) ?? [])
        {
            int eq = w.IndexOf('=');
            if (eq <= 0) throw new ConfigurationException($"--with '{w}' is not NAME=VALUE");
            int idx = ParameterIndex(host, w[..eq].Trim(), "--with");
            if (!double.TryParse(w[(eq + 1)..], NumberStyles.Float, CultureInfo.InvariantCulture, out var v) || !double.IsFinite(v))
                throw new ConfigurationException($"--with {w[..eq]}: '{w[(eq + 1)..]}' is not a finite number");
            p[idx] = v;
        }
        if (vary is int k && startValue is double sv) p[k] = sv;
        double[] guess;
        if (pr.GetValue(StartState) is { } text)
        {
            var parts = text.Split(',', StringSplitOptions.TrimEntries);
            if (parts.Length != sys.Dimension)
                throw new ConfigurationException($"--start-state has {parts.Length} values; model '{host.Name}' has {sys.Dimension} state variables ({string.Join(", ", host.StateColumns.Select(c => c.Name))})");
            guess = parts.Select(x => double.TryParse(x, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) && double.IsFinite(v) ? v
                : throw new ConfigurationException($"--start-state: '{x}' is not a finite number")).ToArray();
        }
        else guess = host.InitialGuess(p);
        var start = SteadyState.Solve(sys, guess, p, NewtonOptions.Default);
        if (!start.Converged)
            throw new RunFailedException($"no equilibrium found from the starting guess: {start.Diagnosis} (residual {start.Residual:G3} after {start.Iterations} iterations). " +
                                         "Try --start-state with a state nearer an equilibrium, or another --start-at.");
        return (host, p, start);
    }

    /// <summary>Index of a parameter by name (case-insensitive), or a message with the closest name.</summary>
    public static int ParameterIndex(IModelHost host, string name, string option)
    {
        var names = ParameterLookup.Names(host.System);
        for (int i = 0; i < names.Count; i++)
            if (string.Equals(names[i], name, StringComparison.OrdinalIgnoreCase)) return i;
        var near = KeySuggester.Closest(name, names);
        throw new ConfigurationException($"{option}: model '{host.Name}' has no parameter '{name}'" +
            (near is null ? "" : $"; did you mean '{near}'?") + $" Parameters: {string.Join(", ", names)}");
    }

    /// <summary>
    /// Continuation settings shared by the analysis commands: the parameter measured in units of its
    /// range and each state variable in units of its typical change (the host's scales), so one
    /// step size suits every model.
    /// </summary>
    public static ContinuationOptions Continuation(IModelHost host, double from, double to, double maxStep = BranchCommand.DefaultMaxStep, int maxPoints = 2000) => new()
    {
        ParameterMin = from,
        ParameterMax = to,
        ParameterScale = to - from,
        InitialStep = maxStep / 10,
        MaxStep = maxStep,
        MinStep = 1e-9,
        MaxPoints = maxPoints,
        StateScale = host.StateScale,
        Validity = host.Validity,
    };

    public static (double From, double To) Range(string option, double from, double to)
    {
        if (!double.IsFinite(from) || !double.IsFinite(to))
            throw new ConfigurationException($"{option}: the range {from}…{to} must be finite");
        if (!(from < to))
            throw new ConfigurationException($"{option}: the range {from.ToString("G6", CultureInfo.InvariantCulture)} to {to.ToString("G6", CultureInfo.InvariantCulture)} is empty or inverted; 'from' must be below 'to'");
        return (from, to);
    }
}

/// <summary>
/// <c>thermostrat branch</c>: pseudo-arclength continuation of equilibria in one parameter, with
/// stability, folds, Hopf points and branch points located; a table and a bifurcation diagram.
/// </summary>
public sealed class BranchCommand : IRunnerCommand
{
    /// <summary>Default largest continuation step (scaled arclength).</summary>
    public const double DefaultMaxStep = 0.25;

    private readonly CommonOptions _common = new("out/branch");
    private readonly ModelChoiceOptions _model = new();
    private readonly Option<string> _vary = new("--vary") { Description = "The parameter to continue in (its analysis name; see 'describe').", Required = true };
    private readonly Option<double> _from = new("--from") { Description = "Lower end of the parameter range.", Required = true };
    private readonly Option<double> _to = new("--to") { Description = "Upper end of the parameter range.", Required = true };
    private readonly Option<double?> _startAt = new("--start-at") { Description = "Parameter value of the starting equilibrium (default: the model's value, clipped into the range)." };
    private readonly Option<int> _maxPoints = new("--max-points") { Description = "Largest number of points in each direction (default 2000).", DefaultValueFactory = _ => 2000 };
    private readonly Option<double> _maxStep = new("--max-step") { Description = "Largest continuation step in the scaled arclength norm: the parameter measured in units of its range, each state variable in units of its typical change (default 0.25).", DefaultValueFactory = _ => DefaultMaxStep };
    private readonly Option<string?> _show = new("--show") { Description = "Column for the vertical axis of the diagram (a state or diagnostic column; default the first diagnostic)." };

    /// <inheritdoc />
    public Command Build(TextWriter stdout, TextWriter stderr)
    {
        var cmd = new Command("branch",
            "Continue a branch of equilibria in one parameter (pseudo-arclength continuation, both directions, through folds). " +
            "Locates folds, Hopf points (with the period at onset), branch points and non-smooth turning points; writes " +
            "branch.parquet, special_points.parquet, branch.png and run.json.\n\n" +
            "Examples:\n" +
            "  thermostrat branch --model stommel --vary Eta2 --from 0 --to 2\n" +
            "  thermostrat branch --model recharge-oscillator --vary mu --from 0.3 --to 1 --show t_k");
        foreach (var o in new Option[] { _vary, _from, _to, _startAt, _maxPoints, _maxStep, _show }) cmd.Options.Add(o);
        _model.AddTo(cmd);
        _common.AddTo(cmd);
        cmd.SetAction(pr => Cli.Guard(stderr, () => Execute(pr, stdout, stderr)));
        return cmd;
    }

    private int Execute(ParseResult pr, TextWriter stdout, TextWriter stderr)
    {
        var settings = ConfigLoader.Load<Settings>(_common.Request(pr));
        var (from, to) = ModelChoiceOptions.Range("--from/--to", pr.GetValue(_from), pr.GetValue(_to));
        int maxPoints = pr.GetValue(_maxPoints);
        if (maxPoints < 2 || maxPoints > 1_000_000) throw new ConfigurationException($"--max-points = {maxPoints}: allowed 2 to 1000000");
        double maxStep = pr.GetValue(_maxStep);
        if (!(maxStep > 0 && maxStep <= 1)) throw new ConfigurationException($"--max-step = {maxStep}: allowed > 0 and <= 1 (scaled arclength)");

        var probe = ModelHosts.Create(pr.GetValue(_model.Model)!, settings);
        int k = ModelChoiceOptions.ParameterIndex(probe, pr.GetValue(_vary)!, "--vary");
        var p0 = new double[probe.System.ParameterCount];
        probe.System.GetParameters(p0);
        double startAt = pr.GetValue(_startAt) ?? Math.Clamp(p0[k], from, to);
        if (startAt < from || startAt > to)
            throw new ConfigurationException($"--start-at = {startAt.ToString("G6", CultureInfo.InvariantCulture)} lies outside the range {from.ToString("G6", CultureInfo.InvariantCulture)} to {to.ToString("G6", CultureInfo.InvariantCulture)}");
        var (host, p, start) = _model.Prepare(pr, probe, k, startAt);
        int show = ColumnReader.Find(host, pr.GetValue(_show), "--show");

        using var output = OutputFolder.Begin(pr.GetValue(_common.Out)!, pr.GetValue(_common.Replace));
        var options = ModelChoiceOptions.Continuation(host, from, to, maxStep, maxPoints);
        var branch = Model.Analysis.Continuation.Trace(host.System, k, start.State.AsSpan(), p, options);
        string paramName = host.System.GetParameterName(k);
        var meta = ResolvedConfig.Metadata(host.ResolvedSettings, "branch", new Dictionary<string, string>
        {
            ["thermostrat.model"] = host.Name,
            ["thermostrat.parameter"] = paramName,
            ["thermostrat.ended_early"] = branch.EndedEarly ? "true" : "false",
            ["thermostrat.end_forward"] = $"{branch.Forward.Reason}: {branch.Forward.Message}",
            ["thermostrat.end_reverse"] = branch.Reverse is { } r ? $"{r.Reason}: {r.Message}" : "",
        });
        BranchTables.WriteBranch(output.File_("branch.parquet"), host, branch, p, meta);
        BranchTables.WriteSpecialPoints(output.File_("special_points.parquet"), host, branch.SpecialPoints, p, k, meta);
        BranchFigure.Draw(output.File_("branch.png"), host, branch, p, show, paramName);
        output.WriteRunRecord("branch", Environment.GetCommandLineArgs().Skip(1).ToList(), new Dictionary<string, object?>
        {
            ["model"] = host.Name,
            ["model_settings"] = host.ResolvedSettings,
            ["configuration"] = settings,
        }, new Dictionary<string, object?>
        {
            ["parameter"] = paramName,
            ["range"] = new[] { from, to },
            ["points"] = branch.Points.Count,
            ["ended_early"] = branch.EndedEarly,
            ["end_forward"] = branch.Forward.Message,
            ["end_reverse"] = branch.Reverse?.Message,
        });
        output.Commit();

        if (!pr.GetValue(_common.Quiet))
        {
            stdout.WriteLine($"{host.Name}: branch in {paramName} over [{from.ToString("G6", CultureInfo.InvariantCulture)}, {to.ToString("G6", CultureInfo.InvariantCulture)}], {branch.Points.Count} points, start at {startAt.ToString("G6", CultureInfo.InvariantCulture)}");
            var rows = new List<string[]> { new[] { "#", "kind", paramName, "residual", "period", "note" } };
            var shown = new HashSet<string>();
            foreach (var (s, label) in BranchFigure.Labelled(branch.SpecialPoints).Where(x => shown.Add(x.Label)))
                rows.Add([label, BranchTables.KindName(s.Kind), s.Parameter.ToString("G10", CultureInfo.InvariantCulture), s.Residual.ToString("G2", CultureInfo.InvariantCulture),
                    s.Period is { } per ? per.ToString("G5", CultureInfo.InvariantCulture) : "", s.Description]);
            if (rows.Count > 1) TextTable.Write(stdout, rows); else stdout.WriteLine("  no special points in range");
            foreach (var t in new[] { branch.Forward, branch.Reverse }.Where(t => t is not null && t.EndedEarly))
                stderr.WriteLine($"warning: branch ended early ({t!.Reason}): {t.Message}");
        }
        stdout.WriteLine($"wrote {output.FinalPath}: branch.parquet, special_points.parquet, branch.png, run.json");
        return Cli.Ok;
    }
}
