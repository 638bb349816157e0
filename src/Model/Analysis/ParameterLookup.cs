using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>Finds a parametric system's parameters by name, with helpful errors for misspellings.</summary>
public static class ParameterLookup
{
    /// <summary>All parameter names of <paramref name="system"/>, in index order.</summary>
    public static IReadOnlyList<string> Names(IParametricSystem system)
    {
        ArgumentNullException.ThrowIfNull(system);
        var names = new string[system.ParameterCount];
        for (int i = 0; i < names.Length; i++) names[i] = system.GetParameterName(i);
        return names;
    }

    /// <summary>
    /// The index of the parameter called <paramref name="name"/>. An exact (ordinal) match wins;
    /// otherwise a unique case-insensitive match is accepted.
    /// </summary>
    /// <exception cref="ArgumentException">
    /// No such parameter: the message names the bad value, the closest valid name and lists all valid names.
    /// </exception>
    public static int IndexOf(IParametricSystem system, string name, string argumentName = "parameter")
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(name);
        var names = Names(system);
        for (int i = 0; i < names.Count; i++)
            if (string.Equals(names[i], name, StringComparison.Ordinal)) return i;
        int found = -1;
        for (int i = 0; i < names.Count; i++)
        {
            if (!string.Equals(names[i], name, StringComparison.OrdinalIgnoreCase)) continue;
            if (found >= 0) { found = -2; break; }
            found = i;
        }
        if (found >= 0) return found;
        string? closest = EditDistance.Closest(name, names);
        string suggestion = closest is null ? "the system has no parameters" : $"did you mean '{closest}'?";
        throw new ArgumentException(
            $"Unknown {argumentName} '{name}': {suggestion} Valid names: {string.Join(", ", names)}.", argumentName);
    }

    /// <summary>Checks that <paramref name="index"/> is a valid parameter index of <paramref name="system"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The index is outside 0 … ParameterCount − 1.</exception>
    public static void CheckIndex(IParametricSystem system, int index, string argumentName = "parameterIndex")
    {
        ArgumentNullException.ThrowIfNull(system);
        if (index < 0 || index >= system.ParameterCount)
            throw new ArgumentOutOfRangeException(argumentName, index,
                $"Parameter index {index} is out of range: the system has {system.ParameterCount} parameters (0 … {system.ParameterCount - 1}).");
    }

    /// <summary>
    /// Checks the arguments shared by the transient-run analyses: a valid parameter index, an initial
    /// state of the system's dimension and a full parameter vector. Returns the parameter's name.
    /// </summary>
    public static string CheckRunArguments(IParametricSystem system, int parameterIndex, ReadOnlySpan<double> initialState, ReadOnlySpan<double> parameters)
    {
        CheckIndex(system, parameterIndex);
        int n = system.Dimension;
        if (initialState.Length != n) throw new ArgumentException($"The initial state has {initialState.Length} entries; the system has {n} state variables.", nameof(initialState));
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"Got {parameters.Length} parameter values; the system has {system.ParameterCount} parameters.", nameof(parameters));
        return system.GetParameterName(parameterIndex);
    }
}
