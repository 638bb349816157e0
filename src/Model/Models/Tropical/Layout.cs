using System.Globalization;
using System.Reflection;
using Thermostrat.Model.Configuration;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>A parameter of the model: its configuration key, value and description.</summary>
/// <param name="Key">Configuration path, e.g. "Model:Processes:Ventilation:ReferenceContrast_kgm3".</param>
/// <param name="Value">Value the model was built with.</param>
/// <param name="Attribute">Unit, meaning, source and bounds (null for derived parameters described by <paramref name="Meaning"/>).</param>
/// <param name="SourceOverride">Source of this instance's default when it differs from the attribute's (see <see cref="IParameterSources"/>), else null.</param>
/// <param name="Meaning">Meaning when there is no attribute.</param>
public sealed record ParameterEntry(string Key, double Value, ParameterAttribute? Attribute, string? SourceOverride = null, string? Meaning = null)
{
    /// <summary>Where the default comes from.</summary>
    public string Source => SourceOverride ?? Attribute?.Source ?? "";
}

/// <summary>A diagnostic quantity computed during each evaluation.</summary>
/// <param name="Name">snake_case name with unit suffix (an output column), e.g. "ventilation_north_sv".</param>
/// <param name="Unit">Unit.</param>
/// <param name="Meaning">One-line meaning.</param>
/// <param name="Fallback">Value when the process that provides it is disabled.</param>
/// <param name="Owner">Process (or "model") that provides it.</param>
/// <param name="Scale">Factor from the internal SI value to the reported value (e.g. 1e-6 for m³/s → Sv).</param>
public sealed record DiagnosticEntry(string Name, string Unit, string Meaning, double Fallback, string Owner, double Scale = 1.0);

/// <summary>A state variable.</summary>
/// <param name="Name">snake_case name with unit suffix (an output column).</param>
/// <param name="Unit">Unit.</param>
/// <param name="Meaning">One-line meaning.</param>
/// <param name="Initial">Initial value.</param>
/// <param name="Owner">Process (or "model") that owns it.</param>
public sealed record StateEntry(string Name, string Unit, string Meaning, double Initial, string Owner);

/// <summary>Collects parameters, diagnostics and state variables while a model is built.</summary>
internal sealed class LayoutBuilder
{
    public List<ParameterEntry> Parameters { get; } = [];
    public List<DiagnosticEntry> Diagnostics { get; } = [];
    public List<StateEntry> States { get; } = [];

    /// <summary>Set when some process changes the total salt content (the mean salinity then becomes a state variable).</summary>
    public bool SaltSource { get; set; }

    private readonly Dictionary<string, int> _parameterIndex = new(StringComparer.OrdinalIgnoreCase);
    private readonly Dictionary<string, int> _diagnosticIndex = new(StringComparer.Ordinal);

    public int AddParameter(string key, double value, ParameterAttribute? attribute, string? sourceOverride = null, string? meaning = null)
    {
        if (_parameterIndex.ContainsKey(key)) throw new InvalidOperationException($"Parameter '{key}' is registered twice.");
        _parameterIndex[key] = Parameters.Count;
        Parameters.Add(new ParameterEntry(key, value, attribute, sourceOverride, meaning));
        return Parameters.Count - 1;
    }

    public int ParameterIndex(string key, string requester) =>
        _parameterIndex.TryGetValue(key, out int i) ? i
        : throw new ConfigurationException($"{requester} needs the parameter '{key}', which the model does not have; parameters are named by configuration path, e.g. '{Parameters.FirstOrDefault()?.Key}'");

    public int AddDiagnostic(DiagnosticEntry entry)
    {
        if (_diagnosticIndex.ContainsKey(entry.Name))
            throw new ConfigurationException($"Diagnostic '{entry.Name}' is provided by both '{Diagnostics[_diagnosticIndex[entry.Name]].Owner}' and '{entry.Owner}'.");
        _diagnosticIndex[entry.Name] = Diagnostics.Count;
        Diagnostics.Add(entry);
        return Diagnostics.Count - 1;
    }

    public int DiagnosticIndex(string name, string requester) =>
        _diagnosticIndex.TryGetValue(name, out int i) ? i
        : throw new ConfigurationException($"Process '{requester}' reads the diagnostic '{name}', which no process with a smaller evaluation order provides; provided so far: {string.Join(", ", Diagnostics.Select(d => d.Name))}");

    public int AddState(StateEntry entry)
    {
        if (States.Any(s => s.Name == entry.Name)) throw new ConfigurationException($"State variable '{entry.Name}' is registered twice (second by '{entry.Owner}').");
        States.Add(entry);
        return States.Count - 1;
    }

    /// <summary>Registers every double property with a <see cref="ParameterAttribute"/> of <paramref name="options"/> (recursing into nested option objects) as a parameter named by its path.</summary>
    public void AddOptionParameters(object options, string path)
    {
        foreach (var prop in options.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (prop.GetIndexParameters().Length > 0 || !prop.CanRead) continue;
            var t = prop.PropertyType;
            string key = path + ":" + prop.Name;
            if (t == typeof(double))
            {
                var attr = prop.GetCustomAttribute<ParameterAttribute>();
                if (attr is not null) AddParameter(key, (double)prop.GetValue(options)!, attr, SourceOverride(options, prop.Name));
            }
            else if (t.IsClass && t != typeof(string) && !typeof(System.Collections.IEnumerable).IsAssignableFrom(t) && prop.GetValue(options) is { } child)
            {
                AddOptionParameters(child, key);
            }
        }
    }

    private static string? SourceOverride(object options, string property) => (options as IParameterSources)?.SourceOf(property);

    /// <summary>Every option of <paramref name="options"/> (numbers, flags, names), for the model description.</summary>
    public static void CollectOptions(object options, string path, List<OptionInfo> into, ISet<string> parameterKeys)
    {
        foreach (var prop in options.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (prop.GetIndexParameters().Length > 0 || !prop.CanRead) continue;
            var t = prop.PropertyType;
            string key = path + ":" + prop.Name;
            object? v = prop.GetValue(options);
            var attr = prop.GetCustomAttribute<ParameterAttribute>();
            var under = Nullable.GetUnderlyingType(t) ?? t;
            if (under.IsPrimitive || under.IsEnum || under == typeof(string))
            {
                string text = v switch
                {
                    null => "",
                    double d => d.ToString("R", CultureInfo.InvariantCulture),
                    bool b => b ? "true" : "false",
                    IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
                    _ => v.ToString() ?? "",
                };
                into.Add(new OptionInfo(key, text, attr?.Unit ?? "", attr?.Meaning ?? "", SourceOverride(options, prop.Name) ?? attr?.Source ?? "", parameterKeys.Contains(key)));
            }
            else if (v is System.Collections.IDictionary dictionary)
            {
                foreach (System.Collections.DictionaryEntry e in dictionary)
                    if (e.Value is { } item) CollectOptions(item, key + ":" + e.Key, into, parameterKeys);
            }
            else if (v is System.Collections.IList list)
            {
                for (int i = 0; i < list.Count; i++)
                    if (list[i] is { } item) CollectOptions(item, key + ":" + i.ToString(CultureInfo.InvariantCulture), into, parameterKeys);
            }
            else if (v is not null && t.IsClass)
            {
                CollectOptions(v, key, into, parameterKeys);
            }
        }
    }
}
