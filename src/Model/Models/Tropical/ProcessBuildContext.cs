using Thermostrat.Model.Configuration;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// What a process's factory may ask for while the model is built: the indices of its parameters, of
/// diagnostics it provides or reads, and of state variables it owns. Processes are built in evaluation
/// order, so a process can read only diagnostics provided by processes with a smaller order (disabled
/// ones included: their diagnostics keep their fallback values).
/// </summary>
public sealed class ProcessBuildContext
{
    private readonly LayoutBuilder _layout;

    internal ProcessBuildContext(LayoutBuilder layout, string name, bool enabled, TropicalModelOptions model, IEquationOfState eos)
    {
        _layout = layout;
        Name = name;
        Enabled = enabled;
        Model = model;
        EquationOfState = eos;
    }

    /// <summary>The process's name.</summary>
    public string Name { get; }

    /// <summary>Configuration path of the process's options, "Model:Processes:&lt;Name&gt;".</summary>
    public string SectionPath => "Model:Processes:" + Name;

    /// <summary>Whether the process is enabled (a disabled process should register its provided diagnostics, with fallbacks, and nothing else).</summary>
    public bool Enabled { get; }

    /// <summary>The whole model configuration (read-only use).</summary>
    public TropicalModelOptions Model { get; }

    /// <summary>The model's equation of state.</summary>
    public IEquationOfState EquationOfState { get; }

    /// <summary>Index of one of this process's own parameters, by its path below the process's section (e.g. "Coupling_NmK" or "Tropical:Slope_perK").</summary>
    public int Parameter(string relativePath) => _layout.ParameterIndex(SectionPath + ":" + relativePath, Name);

    /// <summary>Index of any parameter by its full key (e.g. "Model:Boxes:ColdTongue:Area_m2", "Model:ReferenceSalinity_gkg").</summary>
    public int ModelParameter(string key) => _layout.ParameterIndex(key, Name);

    /// <summary>
    /// Registers a diagnostic this process writes; returns its slot. When the process is disabled the slot
    /// keeps <paramref name="fallback"/> (in internal units).
    /// </summary>
    /// <param name="name">Output column name, snake_case with a unit suffix (e.g. "wind_stress_nm2").</param>
    /// <param name="unit">Unit of the reported value.</param>
    /// <param name="meaning">One-line meaning.</param>
    /// <param name="fallback">Value (internal units) when disabled.</param>
    /// <param name="scale">Reported value = internal value × scale (e.g. 1e-6 to report m³/s in Sv).</param>
    public int ProvideDiagnostic(string name, string unit, string meaning, double fallback, double scale = 1.0)
    {
        if (string.IsNullOrWhiteSpace(name) || name.Any(ch => !(char.IsAsciiLetterLower(ch) || char.IsAsciiDigit(ch) || ch == '_')))
            throw new ArgumentException($"Diagnostic name '{name}' must be snake_case (a–z, 0–9, _).", nameof(name));
        return _layout.AddDiagnostic(new DiagnosticEntry(name, unit, meaning, fallback, Name, scale));
    }

    /// <summary>Slot of a diagnostic provided by an earlier process (or by the model).</summary>
    public int Diagnostic(string name) => _layout.DiagnosticIndex(name, Name);

    /// <summary>
    /// Declares that this process adds or removes salt content (e.g. uncompensated freshwater input as a
    /// virtual salt flux), so that the model carries the mean salinity as a state variable instead of a
    /// fixed parameter. Conservative processes never call this.
    /// </summary>
    public void DeclareSaltSource() => _layout.SaltSource = true;

    /// <summary>Registers a state variable this process owns; returns its index in the state vector. Its rate is written through <see cref="ProcessContext{T}.Rates"/> in units per year.</summary>
    public int AddStateVariable(string name, string unit, string meaning, double initialValue)
    {
        if (!Enabled) throw new InvalidOperationException($"Process '{Name}' is disabled and may not add state variables.");
        if (!double.IsFinite(initialValue)) throw new ConfigurationException($"{SectionPath}: the initial value of state variable '{name}' is {initialValue}; it must be finite");
        return _layout.AddState(new StateEntry(name, unit, meaning, initialValue, Name));
    }
}
