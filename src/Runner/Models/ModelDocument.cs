using Thermostrat.Model.Models;

namespace Thermostrat.Runner.Models;

/// <summary>One process of a model as a theorist reads it.</summary>
public sealed record ProcessDoc(string Name, string Role, bool Enabled, IReadOnlyList<string> Equations, IReadOnlyList<string> References);

/// <summary>One parameter: configuration key (or analysis name), value, unit, meaning, source of the default.</summary>
public sealed record ParameterDoc(string Key, string Value, string Unit, string Meaning, string Source);

/// <summary>A model's full description: what `describe` prints and docs/model.md holds.</summary>
public sealed record ModelDocument
{
    public required string Name { get; init; }
    public required string Title { get; init; }
    public string Summary { get; init; } = "";
    public required string TimeUnit { get; init; }
    public required IReadOnlyList<StateVariableInfo> StateVariables { get; init; }
    public required IReadOnlyList<ProcessDoc> Processes { get; init; }
    public required IReadOnlyList<ParameterDoc> Parameters { get; init; }
    public IReadOnlyList<(string Name, string Unit, string Meaning)> Diagnostics { get; init; } = [];
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>From a reference model's self-description.</summary>
    public static ModelDocument From(ModelDescription d, IReadOnlyList<(string Name, string Unit, string Meaning)>? diagnostics = null) => new()
    {
        Name = d.Name,
        Title = d.Title,
        TimeUnit = d.TimeUnit,
        StateVariables = d.StateVariables,
        Processes = [new ProcessDoc("equations", "the whole model", true, d.Equations, d.References)],
        Parameters = d.Parameters.Select(p => new ParameterDoc(p.Name, p.DefaultValue.ToString("G6", System.Globalization.CultureInfo.InvariantCulture), p.Unit, p.Meaning, "see references")).ToList(),
        Diagnostics = diagnostics ?? [],
        Notes = d.Notes,
    };
}
