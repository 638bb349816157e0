using Thermostrat.Model.Analysis;
using Thermostrat.Model.IO;
using Thermostrat.Model.Models;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Runner.Models;

/// <summary>
/// What the analysis commands need from a model, whichever it is: the system, named state and
/// diagnostic columns, a first guess of an equilibrium, and its description.
/// </summary>
public interface IModelHost
{
    /// <summary>Name as given on the command line.</summary>
    string Name { get; }

    /// <summary>The parametric right-hand side.</summary>
    IParametricSystem System { get; }

    /// <summary>One column per state variable (snake_case name with unit, unit, meaning).</summary>
    IReadOnlyList<ColumnSpec> StateColumns { get; }

    /// <summary>Derived quantities written beside the state.</summary>
    IReadOnlyList<ColumnSpec> DiagnosticColumns { get; }

    /// <summary>Fills <paramref name="values"/> (length of <see cref="DiagnosticColumns"/>) at an equilibrium or a time.</summary>
    void Diagnostics(double t, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters, Span<double> values);

    /// <summary>A first guess of an equilibrium at <paramref name="parameters"/> (for Newton).</summary>
    double[] InitialGuess(ReadOnlySpan<double> parameters);

    /// <summary>Typical size of a change in each state variable, for the continuation norm (null: all 1).</summary>
    IReadOnlyList<double>? StateScale { get; }

    /// <summary>A check that rejects states outside the model's valid range (null: none).</summary>
    StateValidator? Validity { get; }

    /// <summary>The model's description (equations, variables, processes, parameters, sources).</summary>
    ModelDocument Document { get; }

    /// <summary>The model's resolved settings, written into run.json and Parquet metadata.</summary>
    object ResolvedSettings { get; }
}

/// <summary>Helpers shared by model hosts.</summary>
public static class ModelHostNaming
{
    /// <summary>snake_case column name for a variable name and its unit (e.g. "T_W", "degC" → "t_w_degc").</summary>
    public static string Column(string name, string unit)
    {
        var baseName = new string(name.Select(c => char.IsLetterOrDigit(c) ? char.ToLowerInvariant(c) : '_').ToArray()).Trim('_');
        while (baseName.Contains("__")) baseName = baseName.Replace("__", "_");
        var u = UnitSuffix(unit);
        return u.Length == 0 || baseName.EndsWith("_" + u) ? baseName : baseName + "_" + u;
    }

    /// <summary>A unit as a column-name suffix ("W m-2" → "wm2", "°C" → "degc", "1" → "").</summary>
    public static string UnitSuffix(string unit)
    {
        if (string.IsNullOrWhiteSpace(unit) || unit == "1") return "";
        var u = unit.Replace("°C", "degc").Replace("°", "deg").Replace("/", "per").Replace("⁻", "-").Replace("²", "2").Replace("³", "3");
        return new string(u.Where(char.IsLetterOrDigit).Select(char.ToLowerInvariant).ToArray());
    }
}
