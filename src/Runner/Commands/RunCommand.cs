using System.CommandLine;
using System.Globalization;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Thermostrat.Runner.Configuration;
using Thermostrat.Runner.Output;

namespace Thermostrat.Runner.Commands;

/// <summary>
/// <c>thermostrat run [scenario]</c>: integrate the tropical ocean–cloud box model over a scenario
/// and stream its time series to Parquet, with run.json and a multi-panel figure.
/// </summary>
public sealed class RunCommand : IRunnerCommand
{
    private readonly CommonOptions _common = new("out/run");
    private readonly Argument<string?> _scenario = new("scenario") { Description = "Scenario file (JSON; see scenarios/). Without one, the built-in defaults.", Arity = ArgumentArity.ZeroOrOne };

    /// <inheritdoc />
    public Command Build(TextWriter stdout, TextWriter stderr)
    {
        var cmd = new Command("run",
            "Integrate the tropical ocean–cloud box model over a scenario (duration, start age, forcing, output interval and integrator " +
            "from the Run and Model sections) and write timeseries.parquet (state, diagnostics and forcing columns), run.json and timeseries.png. " +
            "Progress goes to stderr.\n\n" +
            "Examples:\n" +
            "  thermostrat run scenarios/present-equilibrium.json\n" +
            "  thermostrat run scenarios/freshening-hysteresis.json --out out/hysteresis\n" +
            "  thermostrat run --set Run:DurationYears=2000 --set Model:Processes:LowCloud:Enabled=false");
        cmd.Arguments.Add(_scenario);
        _common.AddTo(cmd);
        cmd.SetAction(pr => Cli.Guard(stderr, () => Execute(pr, stdout, stderr)));
        return cmd;
    }

    private int Execute(ParseResult pr, TextWriter stdout, TextWriter stderr)
    {
        var scenario = pr.GetValue(_scenario);
        var settings = ConfigLoader.Load<Settings>(_common.Request(pr, scenario));
        var orbit = OrbitFactory.Create(settings.Orbit);
        var baseDir = scenario is null ? "" : Path.GetDirectoryName(Path.GetFullPath(scenario))!;
        bool quiet = pr.GetValue(_common.Quiet);
        double t0 = IOrbitYears(settings.Run.StartAgeKa), t1 = t0 + settings.Run.DurationYears;
        IReadOnlyList<string> warnings;
        try { warnings = orbit.CheckRange(t0, t1); }
        catch (ArgumentOutOfRangeException e) { throw new ConfigurationException($"Run:StartAgeKa/Run:DurationYears: {e.Message}"); }
        var model = TropicalRun.CreateModel(settings.Model, settings.Run, orbit, settings.Insolation.SolarConstant, baseDir);
        foreach (var w in warnings) stderr.WriteLine("warning: " + w);

        using var output = OutputFolder.Begin(pr.GetValue(_common.Out)!, pr.GetValue(_common.Replace));
        var meta = ResolvedConfig.Metadata(settings, "run", new Dictionary<string, string>
        {
            ["thermostrat.scenario"] = scenario ?? "(built-in defaults)",
            ["thermostrat.description"] = settings.Description,
            ["thermostrat.orbit"] = orbit.Description,
            ["thermostrat.processes"] = string.Join(", ", model.ActiveProcesses),
        });
        long expectedRows = (long)Math.Floor(settings.Run.DurationYears / settings.Run.OutputIntervalYears) + 1;
        using var sink = new ParquetRowSink(output.File_("timeseries.parquet"), meta, expectedRows);
        RunSummary summary;
        using (var progress = new RunProgress(stderr, quiet, settings.Run.DurationYears))
        {
            try
            {
                summary = TropicalRun.Execute(model, settings.Run, sink, progress);
            }
            catch (OdeSolverException e)
            {
                throw new RunFailedException(e.Message + " (no output was written; try a smaller Run:MaxStepYears or tighter tolerances, or check the parameters)", e);
            }
        }
        sink.Complete();
        foreach (var w in sink.Warnings) stderr.WriteLine("warning: " + w);
        RunFigure.Draw(output.File_("timeseries.png"), sink.Columns, sink.Kept, settings.Run.StartAgeKa, settings.Description);
        output.WriteRunRecord("run", Environment.GetCommandLineArgs().Skip(1).ToList(), settings, new Dictionary<string, object?>
        {
            ["scenario"] = scenario,
            ["orbit"] = orbit.Description,
            ["warnings"] = warnings.Concat(sink.Warnings).ToList(),
            ["rows"] = summary.Rows,
            ["final_state"] = model.StateVariables.Select((s, i) => (s.Name, v: summary.FinalState[i])).ToDictionary(x => x.Name, x => (object?)x.v),
            ["integration"] = new Dictionary<string, object?>
            {
                ["accepted_steps"] = summary.AcceptedSteps, ["rejected_steps"] = summary.RejectedSteps,
                ["function_evaluations"] = summary.FunctionEvaluations, ["jacobian_evaluations"] = summary.JacobianEvaluations,
                ["final_method"] = summary.FinalMethod, ["method_switches"] = summary.MethodSwitches, ["wall_seconds"] = summary.WallSeconds,
            },
        });
        output.Commit();

        if (!quiet)
        {
            stdout.WriteLine($"{(scenario is null ? "built-in defaults" : Path.GetFileNameWithoutExtension(scenario))}: {settings.Run.DurationYears.ToString("G6", CultureInfo.InvariantCulture)} years from " +
                             $"{settings.Run.StartAgeKa.ToString("G6", CultureInfo.InvariantCulture)} ka, {summary.Rows} rows, {summary.AcceptedSteps} steps ({summary.FinalMethod}), {summary.WallSeconds:F2} s");
            foreach (var m in summary.MethodSwitches) stdout.WriteLine("  integrator: " + m);
            PrintEnd(stdout, sink);
        }
        stdout.WriteLine($"wrote {output.FinalPath}: timeseries.parquet, timeseries.png, run.json");
        return Cli.Ok;
    }

    private static double IOrbitYears(double ageKa) => Model.Orbital.IOrbitSource.YearsFromAgeKa(ageKa);

    private static readonly string[] Headline =
    [
        "sst_warm_pool_degc", "sst_cold_tongue_degc", "east_west_sst_difference_k", "thermocline_depth_east_m", "thermocline_depth_west_m",
        "ventilation_north_sv", "ventilation_south_sv", "upwelling_sv", "low_cloud_fraction_cold_tongue", "salinity_north_gkg",
    ];

    private static void PrintEnd(TextWriter o, ParquetRowSink sink)
    {
        if (sink.Kept.Count == 0) return;
        var first = sink.Kept[0];
        var last = sink.Kept[^1];
        // Minimum and maximum over the (thinned) rows show a collapse that start and end would hide.
        var rows = new List<string[]> { new[] { "quantity", "start", "minimum", "maximum", "end", "unit" } };
        foreach (var name in Headline)
        {
            int i = sink.Columns.ToList().FindIndex(c => c.Name == name);
            if (i < 0) continue;
            string F(double v) => v.ToString("F3", CultureInfo.InvariantCulture);
            rows.Add([name, F(first[i]), F(sink.Kept.Min(r => r[i])), F(sink.Kept.Max(r => r[i])), F(last[i]), sink.Columns[i].Unit]);
        }
        TextTable.Write(o, rows);
    }
}

/// <summary>Streams run rows into a Parquet table and keeps an evenly thinned copy (at most ~4000 rows) for the figure.</summary>
internal sealed class ParquetRowSink(string path, Dictionary<string, string> meta, long expectedRows) : IRowSink, IDisposable
{
    private ParquetTableWriter? _writer;
    private readonly long _every = Math.Max(1, expectedRows / 4000);
    private long _n;

    public IReadOnlyList<ColumnSpec> Columns { get; private set; } = [];
    public List<double[]> Kept { get; } = [];

    /// <summary>Hard limits beyond which a run has left the model's physics and is stopped (°C, g/kg).</summary>
    public const double HardMinTemperature = -5, HardMaxTemperature = 50, HardMinSalinity = 0, HardMaxSalinity = 50;

    private (int Index, string Name, double Min, double Max, double HardMin, double HardMax, string Unit)[] _ranges = [];
    private int _timeColumn = -1;
    private readonly HashSet<string> _warned = [];

    /// <summary>Warnings raised during the run (a variable outside the equation of state's funnel).</summary>
    public List<string> Warnings { get; } = [];

    public void Begin(IReadOnlyList<ColumnInfo> columns)
    {
        Columns = columns.Select(c => new ColumnSpec(c.Name, c.Unit, c.Meaning)).ToList();
        _timeColumn = columns.ToList().FindIndex(c => c.Name == "time_yr");
        // State temperatures and salinities are watched against the equation of state's range (the
        // TEOS-10 funnel, −2…40 °C and 0…42 g/kg): outside it the densities are extrapolated, which
        // is reported as a warning; far outside (hard limits) the run has left the model's physics
        // and is stopped with a diagnosis.
        _ranges = columns.Select((c, i) => (c, i)).Where(x => x.c.Kind == "state" && x.c.Unit is "degC" or "g kg-1")
            .Select(x => x.c.Unit == "degC"
                ? (x.i, x.c.Name, Model.Seawater.SeawaterRange.MinTemperature, Model.Seawater.SeawaterRange.MaxTemperature, HardMinTemperature, HardMaxTemperature, "°C")
                : (x.i, x.c.Name, Model.Seawater.SeawaterRange.MinSalinity, Model.Seawater.SeawaterRange.MaxSalinity, HardMinSalinity, HardMaxSalinity, "g/kg"))
            .ToArray();
        _writer = ParquetTableWriter.Create(path, Columns, meta);
    }

    private double[]? _lastRow;

    public void Write(ReadOnlySpan<double> row)
    {
        foreach (var (i, name, min, max, hardMin, hardMax, unit) in _ranges)
        {
            double v = row[i];
            if (v >= min && v <= max) continue;
            string at = $"{name} = {v.ToString("G6", CultureInfo.InvariantCulture)} {unit} at year {(_timeColumn >= 0 ? row[_timeColumn] : double.NaN).ToString("G8", CultureInfo.InvariantCulture)}";
            if (!(v >= hardMin && v <= hardMax))
                throw new RunFailedException(
                    $"{at} is beyond the limits {hardMin.ToString(CultureInfo.InvariantCulture)} to {hardMax.ToString(CultureInfo.InvariantCulture)} {unit} " +
                    $"(the equation of state's range is {min.ToString(CultureInfo.InvariantCulture)} to {max.ToString(CultureInfo.InvariantCulture)} {unit}); the run was stopped and no output was written " +
                    "(the parameters drive the model outside its physics; check the heat or freshwater fluxes).");
            if (_warned.Add(name))
                Warnings.Add($"{at} left the equation of state's range {min.ToString(CultureInfo.InvariantCulture)} to {max.ToString(CultureInfo.InvariantCulture)} {unit}; densities there are extrapolated (first occurrence)");
        }
        _writer!.AppendRow(row);
        bool keep = _n++ % _every == 0;
        if (keep) Kept.Add(row.ToArray());
        _lastRow ??= new double[row.Length];
        row.CopyTo(_lastRow);
        _lastKept = keep;
    }

    private bool _lastKept;

    public void End(RunSummary summary)
    {
        // Keep the very last row for the figure and summary even when thinning skipped it.
        if (_lastRow is not null && !_lastKept) Kept.Add(_lastRow);
        _last = true;
    }

    private bool _last;

    public void Complete()
    {
        if (!_last) throw new InvalidOperationException("the run did not finish");
        if (Warnings.Count > 0) _writer!.SetMetadata("thermostrat.warnings", string.Join("\n", Warnings));
        _writer!.Complete();
    }

    public void Dispose() => _writer?.Dispose();
}

/// <summary>Progress of a run on stderr: a live bar in a terminal, a line every 10 % otherwise.</summary>
internal sealed class RunProgress(TextWriter stderr, bool quiet, double durationYears) : IProgress<double>, IDisposable
{
    private int _lastDecile = -1;
    private readonly DateTime _start = DateTime.UtcNow;

    public void Report(double fraction)
    {
        if (quiet) return;
        // Short runs finish before anyone waits: report only once a run has taken a second.
        if ((DateTime.UtcNow - _start).TotalSeconds < 1.0 && fraction < 1) return;
        int decile = (int)Math.Floor(Math.Clamp(fraction, 0, 1) * 10);
        if (decile <= _lastDecile || (fraction >= 1 && _lastDecile < 0)) return;
        _lastDecile = decile;
        double elapsed = (DateTime.UtcNow - _start).TotalSeconds;
        stderr.WriteLine($"run: {decile * 10,3}% (year {(fraction * durationYears).ToString("F0", CultureInfo.InvariantCulture)} of {durationYears.ToString("G6", CultureInfo.InvariantCulture)}, {elapsed:F1} s)");
    }

    public void Dispose() { }
}
