using Thermostrat.Model.Configuration;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// Base of every process's options (section "Model:Processes:&lt;Name&gt;"). A process's own options
/// class derives from this and adds its parameters, each with a <see cref="ParameterAttribute"/>.
/// </summary>
/// <remarks>
/// Numeric (double) properties with a <see cref="ParameterAttribute"/>, including those of nested option
/// objects, become parameters of the model named by their configuration path, e.g.
/// "Model:Processes:Ventilation:ReferenceContrast_kgm3": analysis code can vary and differentiate them.
/// A plain <see cref="ProcessOptions"/> (not a subclass) in a set means a name the catalog does not know;
/// building the model then fails with a message listing the known names.
/// </remarks>
public class ProcessOptions
{
    /// <summary>Whether the process takes part. A disabled process adds nothing; the diagnostics it provides take their documented fallback values.</summary>
    [Parameter("", "include this process (false: it adds nothing and its diagnostics take their fallback values)")]
    public bool Enabled { get; set; } = true;
}

/// <summary>Process options keyed by process name, case-insensitive (section "Model:Processes").</summary>
public sealed class ProcessOptionsSet : Dictionary<string, ProcessOptions>
{
    /// <summary>An empty set.</summary>
    public ProcessOptionsSet() : base(StringComparer.OrdinalIgnoreCase) { }

    /// <summary>The options of the process called <paramref name="name"/>, typed; throws if absent or of another type.</summary>
    public TOptions Get<TOptions>(string name) where TOptions : ProcessOptions
    {
        if (!TryGetValue(name, out var o))
            throw new KeyNotFoundException($"Model:Processes has no entry '{name}'; entries: {string.Join(", ", Keys)}");
        return o as TOptions ?? throw new InvalidCastException($"Model:Processes:{name} holds {o.GetType().Name}, not {typeof(TOptions).Name}");
    }
}

/// <summary>
/// Options whose parameters' sources differ between instances (e.g. the same regime class used for
/// tropical and extratropical clouds with different published defaults) name them here; the model
/// description prefers these over the attribute's <see cref="ParameterAttribute.Source"/>.
/// </summary>
public interface IParameterSources
{
    /// <summary>The source of the default of property <paramref name="propertyName"/>, or null to use the attribute's.</summary>
    string? SourceOf(string propertyName);
}
