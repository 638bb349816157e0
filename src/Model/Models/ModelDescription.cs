namespace Thermostrat.Model.Models;

/// <summary>A state variable of a model: its name, unit and meaning.</summary>
/// <param name="Name">Short identifier (as in the equations).</param>
/// <param name="Unit">Unit, or "1" for nondimensional.</param>
/// <param name="Meaning">One line saying what it is.</param>
public sealed record StateVariableInfo(string Name, string Unit, string Meaning);

/// <summary>A parameter of a model: its name (as exposed for analysis), unit, default value and meaning.</summary>
/// <param name="Name">Name used by <see cref="Numerics.IParametricSystem.GetParameterName"/>.</param>
/// <param name="Unit">Unit, or "1" for nondimensional.</param>
/// <param name="DefaultValue">Default value.</param>
/// <param name="Meaning">One line saying what it is.</param>
public sealed record ParameterInfo(string Name, string Unit, double DefaultValue, string Meaning);

/// <summary>What a model is, in a form a command can print: name, variables with units, equations and sources.</summary>
public sealed record ModelDescription
{
    /// <summary>Identifier used to select the model (lower case, no spaces).</summary>
    public required string Name { get; init; }

    /// <summary>One-line title.</summary>
    public required string Title { get; init; }

    /// <summary>Unit of model time.</summary>
    public required string TimeUnit { get; init; }

    /// <summary>State variables in state-vector order.</summary>
    public required IReadOnlyList<StateVariableInfo> StateVariables { get; init; }

    /// <summary>Parameters in parameter-vector order.</summary>
    public required IReadOnlyList<ParameterInfo> Parameters { get; init; }

    /// <summary>The equations, one per line, in plain text.</summary>
    public required IReadOnlyList<string> Equations { get; init; }

    /// <summary>Published sources, one citation per entry.</summary>
    public required IReadOnlyList<string> References { get; init; }

    /// <summary>Remarks: regimes, known results, where the default values come from.</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];
}

/// <summary>A model that can describe itself (for the command line's describe command and for output metadata).</summary>
public interface IDescribedModel
{
    /// <summary>The model's description.</summary>
    ModelDescription Description { get; }
}
