using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Runner.Configuration;

namespace Thermostrat.Runner.Models;

/// <summary>
/// One output column of a model (a state variable or a diagnostic), read from a state at a given
/// value of the continuation parameter: what the analysis commands plot and watch.
/// </summary>
public sealed class ColumnReader
{
    private readonly IModelHost _host;
    private readonly int _column, _nState, _parameterIndex;
    private readonly double[] _p, _diag;

    /// <param name="host">The model.</param>
    /// <param name="column">Index into the state columns followed by the diagnostic columns.</param>
    /// <param name="parameters">All parameter values (copied).</param>
    /// <param name="parameterIndex">The parameter whose value <see cref="Value"/> sets.</param>
    public ColumnReader(IModelHost host, int column, ReadOnlySpan<double> parameters, int parameterIndex)
    {
        _host = host;
        _column = column;
        _nState = host.StateColumns.Count;
        _p = parameters.ToArray();
        _parameterIndex = parameterIndex;
        _diag = new double[host.DiagnosticColumns.Count];
        Column = column < _nState ? host.StateColumns[column] : host.DiagnosticColumns[column - _nState];
    }

    /// <summary>The column read.</summary>
    public ColumnSpec Column { get; }

    /// <summary>The column's value at <paramref name="state"/> with the parameter at <paramref name="parameterValue"/>.</summary>
    public double Value(ReadOnlySpan<double> state, double parameterValue, double t = 0)
    {
        if (_column < _nState) return state[_column];
        _p[_parameterIndex] = parameterValue;
        _host.Diagnostics(t, state, _p, _diag);
        return _diag[_column - _nState];
    }

    /// <summary>
    /// Index of the column named <paramref name="name"/> (default: the first diagnostic, else the
    /// first state variable), matched case-insensitively; an unknown name is an error naming the closest column and all of them.
    /// </summary>
    public static int Find(IModelHost host, string? name, string option)
    {
        var columns = host.StateColumns.Concat(host.DiagnosticColumns).Select(c => c.Name).ToList();
        name ??= host.DiagnosticColumns.Count > 0 ? host.DiagnosticColumns[0].Name : host.StateColumns[0].Name;
        int i = columns.FindIndex(c => string.Equals(c, name, StringComparison.OrdinalIgnoreCase));
        if (i >= 0) return i;
        throw new ConfigurationException($"{option} '{name}' is not a column of model '{host.Name}'" +
            (KeySuggester.Closest(name, columns) is { } near ? $"; did you mean '{near}'?" : "") +
            $" Columns: {string.Join(", ", columns)}");
    }
}
