namespace Thermostrat.Model.Configuration;

/// <summary>
/// Describes a configurable option for people: its unit, what it means and where its default
/// comes from (a published source, or the calibration target it was tuned to). The
/// <c>describe</c> command and the generated model documentation read these.
/// </summary>
[AttributeUsage(AttributeTargets.Property, AllowMultiple = false)]
public sealed class ParameterAttribute(string unit, string meaning) : Attribute
{
    /// <summary>Unit of the value ("K", "Sv", "W m-2 K-1", "1" for dimensionless, "" for text).</summary>
    public string Unit { get; } = unit;

    /// <summary>One-line meaning.</summary>
    public string Meaning { get; } = meaning;

    /// <summary>Where the default comes from: a citation, "common practice", or "tuned: &lt;target&gt;".</summary>
    public string Source { get; init; } = "";

    /// <summary>Inclusive lower bound (NaN: none). Values outside [Min, Max] are configuration errors.</summary>
    public double Min { get; init; } = double.NaN;

    /// <summary>Inclusive upper bound (NaN: none).</summary>
    public double Max { get; init; } = double.NaN;

    /// <summary>True if the lower bound itself is not allowed (e.g. an area must be &gt; 0).</summary>
    public bool MinExclusive { get; init; }
}

/// <summary>Options that check relations between their own values (e.g. south edge below north edge).</summary>
public interface ISelfValidating
{
    /// <summary>Returns one message per problem; each names the key(s), the value(s) and what is allowed.</summary>
    /// <param name="path">Configuration path of this object (e.g. "Model:Boxes:0").</param>
    IEnumerable<string> Validate(string path);
}
