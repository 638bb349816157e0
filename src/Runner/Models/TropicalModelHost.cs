using Thermostrat.Model.Analysis;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Model.Models;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Runner.Models;

/// <summary>The tropical ocean–cloud box model as an analysis target (equilibria at the run's start age).</summary>
public sealed class TropicalModelHost : IModelHost
{
    /// <summary>Length of the spin-up run that gives Newton its first guess, years.</summary>
    public const double SpinUpYears = 5000;

    private readonly TropicalBoxModel _model;
    private readonly Configuration.Settings _settings;

    private TropicalModelHost(TropicalBoxModel model, Configuration.Settings settings)
    {
        _model = model;
        _settings = settings;
        StateColumns = model.StateVariables.Select(s => new ColumnSpec(ModelHostNaming.Column(s.Name, s.Unit), s.Unit, s.Meaning)).ToList();
        DiagnosticColumns = model.DiagnosticEntries.Select(d => new ColumnSpec(ModelHostNaming.Column(d.Name, d.Unit), d.Unit, d.Meaning)).ToList();
        // Continuation norm: 1 K, 0.1 g/kg, 10 m — changes of those sizes count alike.
        StateScale = model.StateVariables.Select(s => s.Unit switch
        {
            "degC" or "°C" or "K" => 1.0,
            "g kg-1" or "g/kg" => 0.1,
            "m" => 10.0,
            _ => 1.0,
        }).ToList();
    }

    /// <summary>Builds the model from the configuration (orbit and forcing at Run:StartAgeKa, no run span).</summary>
    public static TropicalModelHost Create(Configuration.Settings settings)
    {
        var orbit = OrbitFactory.Create(settings.Orbit);
        var run = new RunOptions { StartAgeKa = settings.Run.StartAgeKa, DurationYears = Math.Max(settings.Run.DurationYears, SpinUpYears), OutputIntervalYears = settings.Run.OutputIntervalYears };
        var model = TropicalRun.CreateModel(settings.Model, run, orbit, settings.Insolation.SolarConstant);
        return new TropicalModelHost(model, settings);
    }

    /// <summary>The underlying model.</summary>
    public TropicalBoxModel Model => _model;

    public string Name => ModelHosts.Tropical;
    public Thermostrat.Model.Numerics.IParametricSystem System => _model;
    public IReadOnlyList<ColumnSpec> StateColumns { get; }
    public IReadOnlyList<ColumnSpec> DiagnosticColumns { get; }
    public IReadOnlyList<double>? StateScale { get; }
    public object ResolvedSettings => _settings;

    /// <summary>Temperatures and salinities must stay inside the equation of state's range.</summary>
    public StateValidator? Validity => (y, _) =>
    {
        for (int i = 0; i < y.Length; i++)
        {
            var s = _model.StateVariables[i];
            if (s.Unit is "degC" or "°C" && (y[i] < SeawaterRange.MinTemperature || y[i] > SeawaterRange.MaxTemperature))
                return $"{s.Name} = {y[i]:G5} °C left the equation of state's range {SeawaterRange.MinTemperature} to {SeawaterRange.MaxTemperature} °C";
            if (s.Unit is "g kg-1" or "g/kg" && (y[i] < SeawaterRange.MinSalinity || y[i] > SeawaterRange.MaxSalinity))
                return $"{s.Name} = {y[i]:G5} g/kg left the equation of state's range {SeawaterRange.MinSalinity} to {SeawaterRange.MaxSalinity} g/kg";
        }
        return null;
    };

    public void Diagnostics(double t, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters, Span<double> values) =>
        _model.EvaluateDiagnostics(t, state, values, parameters);

    /// <summary>The end of a spin-up run at the given parameters, from the configured initial state.</summary>
    public double[] InitialGuess(ReadOnlySpan<double> parameters)
    {
        var result = OdeSolver.Solve(_model, parameters, 0, _model.InitialState(), SpinUpYears,
            new SolverOptions { Method = OdeMethod.Auto, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-8, Output = OutputTimes.FinalOnly });
        return [.. result.FinalState];
    }

    public ModelDocument Document
    {
        get
        {
            var d = _model.Describe();
            return new ModelDocument
            {
                Name = Name,
                Title = "Tropical ocean–cloud box model",
                Summary = "A reduced-physics model of an idealized tropical basin of our own: warm pool, cold tongue, northern and southern " +
                          "ventilation boxes, equatorial thermocline and a deep reservoir, coupled by a closed wind-driven overturning loop, " +
                          "with Bjerknes wind coupling, low clouds, salinity budgets and orbital insolation. Every process comes from a published " +
                          "parameterization; the assembly and the default calibration are ours.",
                TimeUnit = "year",
                StateVariables = d.StateVariables.Select(s => new StateVariableInfo(s.Name, s.Unit, s.Meaning)).ToList(),
                Processes = d.Processes.OrderBy(p => p.Order).Select(p => new ProcessDoc(p.Name, p.Role, p.Enabled,
                    p.Equation.Split('\n', StringSplitOptions.RemoveEmptyEntries), p.References)).ToList(),
                Parameters = d.Options.Select(o => new ParameterDoc(o.Key, o.Value, o.Unit, o.Meaning, o.Source)).ToList(),
                Diagnostics = d.Columns.Where(c => c.Kind != "state").Select(c => (c.Name, c.Unit, c.Meaning)).ToList(),
                Notes = d.Forcing,
            };
        }
    }
}
