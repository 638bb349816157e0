namespace Thermostrat.Model.Models.Tropical;

/// <summary>A process as the <c>describe</c> command lists it.</summary>
/// <param name="Name">Configuration key.</param>
/// <param name="Role">One-line role.</param>
/// <param name="Equation">Equations in plain Unicode.</param>
/// <param name="References">Published sources.</param>
/// <param name="Enabled">Whether it takes part in this model.</param>
/// <param name="Section">Its configuration section ("Model:Processes:&lt;Name&gt;").</param>
/// <param name="Order">Evaluation order.</param>
public sealed record ProcessInfo(string Name, string Role, string Equation, IReadOnlyList<string> References, bool Enabled, string Section, double Order);

/// <summary>One configuration option (numeric parameter, flag or name) with its resolved value.</summary>
/// <param name="Key">Configuration path.</param>
/// <param name="Value">Value as text (invariant culture; numbers round-trip).</param>
/// <param name="Unit">Unit ("" for text and flags, "1" for dimensionless).</param>
/// <param name="Meaning">One-line meaning.</param>
/// <param name="Source">Citation, "common practice", or "tuned: &lt;calibration target&gt;".</param>
/// <param name="IsParameter">True when it is a parameter of the ODE system (analysis may vary it).</param>
public sealed record OptionInfo(string Key, string Value, string Unit, string Meaning, string Source, bool IsParameter);

/// <summary>An output column.</summary>
/// <param name="Name">snake_case name with a unit suffix, e.g. "sst_warm_pool_degc".</param>
/// <param name="Unit">Unit.</param>
/// <param name="Meaning">One-line meaning.</param>
/// <param name="Kind">"time", "state", "diagnostic" or "forcing".</param>
public sealed record ColumnInfo(string Name, string Unit, string Meaning, string Kind);

/// <summary>Everything needed to document a built model: processes, state, options and output columns.</summary>
/// <param name="Processes">Every process of the catalog, enabled or not, in evaluation order.</param>
/// <param name="StateVariables">The state vector, in order.</param>
/// <param name="Options">Every option with its value, unit, meaning and source.</param>
/// <param name="Columns">The output columns of a run, in order.</param>
/// <param name="Forcing">One line per forcing input (what the run is driven by).</param>
public sealed record TropicalModelDescription(
    IReadOnlyList<ProcessInfo> Processes,
    IReadOnlyList<StateEntry> StateVariables,
    IReadOnlyList<OptionInfo> Options,
    IReadOnlyList<ColumnInfo> Columns,
    IReadOnlyList<string> Forcing);
