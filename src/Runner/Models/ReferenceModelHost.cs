using Thermostrat.Model.Analysis;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Model.Models;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Runner.Models;

/// <summary>A published reference model (Stommel 1961, Jin 1997) as an analysis target.</summary>
public sealed class ReferenceModelHost : IModelHost
{
    private readonly IDescribedModel _described;

    private ReferenceModelHost(string name, IParametricSystem system)
    {
        Name = name;
        System = system;
        _described = system as IDescribedModel
            ?? throw new InvalidOperationException($"reference model '{name}' does not describe itself");
        StateColumns = Description.StateVariables.Select(v => new ColumnSpec(ModelHostNaming.Column(v.Name, v.Unit), v.Unit, v.Meaning)).ToList();
        bool stommel = name.StartsWith("stommel", StringComparison.OrdinalIgnoreCase);
        DiagnosticColumns = stommel
            ? [new ColumnSpec(name.Contains("dimensional") ? "flow_strength" : "flow_q", name.Contains("dimensional") ? "model units" : "1", "overturning strength q (equator-to-pole density difference)")]
            : [];
        _flow = stommel;
    }

    private readonly bool _flow;

    /// <summary>Creates the host for a reference model by name.</summary>
    /// <exception cref="ConfigurationException">Unknown name (with the closest valid one).</exception>
    public static ReferenceModelHost Create(string name)
    {
        try
        {
            return new ReferenceModelHost(name, ReferenceModels.Create(name));
        }
        catch (ArgumentException e)
        {
            throw new ConfigurationException("--model: " + e.Message);
        }
    }

    public string Name { get; }
    public IParametricSystem System { get; }
    public IReadOnlyList<ColumnSpec> StateColumns { get; }
    public IReadOnlyList<ColumnSpec> DiagnosticColumns { get; }
    private ModelDescription Description => _described.Description;

    public ModelDocument Document => ModelDocument.From(Description, DiagnosticColumns.Select(c => (c.Name, c.Unit, c.Description)).ToList());
    public StateValidator? Validity => null;
    public IReadOnlyList<double>? StateScale => null;

    public object ResolvedSettings => new Dictionary<string, object?>
    {
        ["model"] = Name,
        ["parameters"] = Enumerable.Range(0, System.ParameterCount).ToDictionary(System.GetParameterName, i =>
        {
            Span<double> p = stackalloc double[System.ParameterCount];
            System.GetParameters(p);
            return (object?)p[i];
        }),
    };

    public void Diagnostics(double t, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters, Span<double> values)
    {
        // Stommel's flow strength is the density difference, q = T − S in scaled variables
        // (the thermal and haline terms of the linear equation of state).
        if (_flow) values[0] = state[0] - state[1];
    }

    public double[] InitialGuess(ReadOnlySpan<double> parameters)
    {
        // A thermally driven state (T near its restoring value, S smaller) is the usual starting
        // point for Stommel's model; the recharge oscillator's equilibrium is at the origin.
        int n = System.Dimension;
        var g = new double[n];
        if (_flow && Name.Contains("dimensional", StringComparison.OrdinalIgnoreCase))
        {
            // Dimensional form: ΔT near its restoring value ΔT* (parameter 0), a modest ΔS.
            g[0] = parameters[0];
            g[1] = 0.5;
        }
        else if (_flow) { g[0] = 1.0; g[1] = 0.3; }
        else for (int i = 0; i < n; i++) g[i] = 0.01;
        return g;
    }
}
