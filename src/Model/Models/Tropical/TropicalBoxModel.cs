using System.Buffers;
using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Orbital;
using Thermostrat.Model.Seawater;
using Thermostrat.Model.Models;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// The tropical ocean–cloud box model: six boxes (warm pool, cold tongue, two ventilation boxes,
/// equatorial thermocline, deep reservoir) whose temperatures and salinities change by the processes of a
/// <see cref="ProcessCatalog"/>, driven by orbital insolation, CO2, sea level and freshwater schedules.
/// </summary>
/// <remarks>
/// <para>State: the six box temperatures (°C), the salinities of the five upper boxes (g/kg), then the
/// state variables of processes (e.g. the prognostic recharge anomaly), then — only when some process adds
/// or removes salt — the mean salinity. The deep reservoir's salinity is diagnosed from the total salt
/// content, S_D = (S̄·ΣV − Σ_{b≠D} V_b S_b)/V_D, which removes the zero eigenvalue total-salt conservation
/// would otherwise put into every Jacobian (steady states and continuation need regular Jacobians).</para>
/// <para>Time is in years since the start of the run (time_yr); the forcing knows the start age.
/// Heat budgets: dT_b/dt = heat_b/(ρ0 c_p V_b); salt: dS_b/dt = salt_b/V_b.</para>
/// <para>Immutable after construction and safe to evaluate from several threads.</para>
/// </remarks>
public sealed class TropicalBoxModel : IParametricSystem, IDescribedModel
{
    /// <summary>Seconds per year used to express rates per year (the 365.2422-day tropical year).</summary>
    public const double SecondsPerYear = SolarCalendar.SecondsPerYear;

    private const int SalinityBoxes = Boxes.Count - 1;

    private readonly IProcess[] _active;
    private readonly ProcessAction<double>?[] _activeDouble;
    private readonly ProcessAction<Dual>?[] _activeDual;
    private readonly double[] _parameters;
    private readonly double[] _initial;
    private readonly double[] _diagnosticFallback;
    private readonly double[] _diagnosticScale;
    private readonly int _rho0, _cp;
    private readonly int[] _area = new int[Boxes.Count], _thickness = new int[Boxes.Count];
    private readonly int _meanSalinityParameter = -1, _meanSalinityState = -1;
    private readonly IEquationOfState _eos;
    private readonly ColumnInfo[] _columns;
    private readonly TropicalModelDescription _description;

    private TropicalBoxModel(TropicalModelOptions options, TropicalForcing forcing, ProcessCatalog catalog, IEquationOfState eos)
    {
        Options = options;
        Forcing = forcing;
        _eos = eos;
        var layout = new LayoutBuilder();

        // Model-level parameters.
        var modelProps = typeof(TropicalModelOptions);
        _rho0 = layout.AddParameter("Model:ReferenceDensity_kgm3", options.ReferenceDensity_kgm3, Attr(modelProps, nameof(options.ReferenceDensity_kgm3)));
        _cp = layout.AddParameter("Model:HeatCapacity_JkgK", options.HeatCapacity_JkgK, Attr(modelProps, nameof(options.HeatCapacity_JkgK)));
        layout.AddParameter("Model:ReferenceSalinity_gkg", options.ReferenceSalinity_gkg, Attr(modelProps, nameof(options.ReferenceSalinity_gkg)));
        foreach (var b in Boxes.All)
        {
            var bo = options.Boxes[b];
            _area[(int)b] = layout.AddParameter($"Model:Boxes:{Boxes.ConfigName(b)}:Area_m2", bo.Area_m2, Attr(typeof(BoxOptions), nameof(bo.Area_m2)));
            _thickness[(int)b] = layout.AddParameter($"Model:Boxes:{Boxes.ConfigName(b)}:Thickness_m", bo.Thickness_m, Attr(typeof(BoxOptions), nameof(bo.Thickness_m)));
        }

        // Core state: temperatures of all boxes, salinities of the upper five.
        foreach (var b in Boxes.All)
        {
            var bo = options.Boxes[b];
            string name = Boxes.IsSurface(b) ? $"sst_{Boxes.ColumnName(b)}_degc" : $"temperature_{Boxes.ColumnName(b)}_degc";
            layout.AddState(new StateEntry(name, "degC", $"temperature of the {Boxes.Label(b)} box", bo.InitialTemperature_degC, "model"));
        }
        for (int i = 0; i < SalinityBoxes; i++)
        {
            var b = (Box)i;
            layout.AddState(new StateEntry($"salinity_{Boxes.ColumnName(b)}_gkg", "g kg-1", $"salinity of the {Boxes.Label(b)} box", options.Boxes[b].InitialSalinity_gkg, "model"));
        }

        // Net surface heat flux slots, filled by the processes through AddSurfaceHeatFlux (slots 0 … 3).
        foreach (var b in Boxes.Surface)
            layout.AddDiagnostic(new DiagnosticEntry(TropicalDiagnostics.NetSurfaceHeatFlux(b), "W m-2", $"net surface heat flux into the {Boxes.Label(b)} (positive downward)", 0.0, "model"));

        // Every process's options become parameters before any process is built (a process may read another's).
        var entries = catalog.Entries.OrderBy(e => e.Order).ToArray();
        foreach (var e in entries) layout.AddOptionParameters(options.Processes[e.Name], "Model:Processes:" + e.Name);

        var active = new List<IProcess>();
        foreach (var e in entries)
        {
            var o = options.Processes[e.Name];
            var context = new ProcessBuildContext(layout, e.Name, o.Enabled, options, eos);
            IProcess process = e.Build(o, context);
            if (o.Enabled) active.Add(process);
        }
        _active = [.. active];
        _activeDouble = _active.Select(ProcessInvoker.TryBind<double>).ToArray();
        _activeDual = _active.Select(ProcessInvoker.TryBind<Dual>).ToArray();

        // Total salt: a fixed parameter, or a state variable when some process changes it.
        double volume = Boxes.All.Sum(b => options.Boxes[b].Volume_m3());
        double meanSalinity = Boxes.All.Sum(b => options.Boxes[b].Volume_m3() * options.Boxes[b].InitialSalinity_gkg) / volume;
        if (layout.SaltSource)
            _meanSalinityState = layout.AddState(new StateEntry("mean_salinity_gkg", "g kg-1", "volume-mean salinity of the model ocean (changes with uncompensated freshwater input)", meanSalinity, "model"));
        else
            _meanSalinityParameter = layout.AddParameter("Model:MeanSalinity_gkg", meanSalinity, null, "derived: the volume mean of the boxes' initial salinities",
                "volume-mean salinity of the model ocean (fixes the total salt; the deep salinity is diagnosed from it)");

        if (layout.Diagnostics.Count + 6 * Boxes.Count > Scratch256<double>.Capacity)
            throw new ConfigurationException($"the model has {layout.Diagnostics.Count} diagnostics; at most {Scratch256<double>.Capacity - 6 * Boxes.Count} are supported");
        _parameters = layout.Parameters.Select(p => p.Value).ToArray();
        ParameterEntries = [.. layout.Parameters];
        StateVariables = [.. layout.States];
        DiagnosticEntries = [.. layout.Diagnostics];
        _initial = StateVariables.Select(s => s.Initial).ToArray();
        _diagnosticFallback = DiagnosticEntries.Select(d => d.Fallback).ToArray();
        _diagnosticScale = DiagnosticEntries.Select(d => d.Scale).ToArray();
        _columns = BuildColumns();
        _description = BuildDescription(catalog, entries);
    }

    private static ParameterAttribute? Attr(Type t, string property) =>
        t.GetProperty(property)?.GetCustomAttributes(typeof(ParameterAttribute), false).OfType<ParameterAttribute>().FirstOrDefault();

    /// <summary>
    /// Builds the model from its options, after validating them (bounds, finiteness, cross-field rules,
    /// process names) and building the forcing over the run given by <paramref name="environment"/>.
    /// </summary>
    /// <param name="options">Model configuration (section "Model").</param>
    /// <param name="environment">Orbit, solar constant, run span and file base directory.</param>
    /// <param name="catalog">Processes to build from; the built-in catalog when null.</param>
    /// <remarks>Entries of the catalog missing from <c>options.Processes</c> are added with their defaults (the options object is completed in place).</remarks>
    /// <exception cref="ConfigurationException">Any problem with the configuration or the forcing, naming the key, the value and what is allowed.</exception>
    public static TropicalBoxModel Create(TropicalModelOptions options, ForcingEnvironment environment, ProcessCatalog? catalog = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(environment);
        catalog ??= ProcessCatalog.CreateBuiltIn();
        options.Processes ??= catalog.CreateDefaultOptions();
        var problems = OptionsValidator.Validate(options, "Model");
        foreach (var (name, o) in options.Processes)
        {
            var d = catalog.Find(name);
            if (d is null)
                problems.Add($"Model:Processes:{name} is not a known process; allowed: {string.Join(", ", catalog.Names)}");
            else if (!d.OptionsType.IsInstanceOfType(o))
                problems.Add($"Model:Processes:{name} holds options of type {o?.GetType().Name ?? "null"}; the process '{d.Name}' needs {d.OptionsType.Name}");
        }
        if (problems.Count > 0) throw new ConfigurationException(problems);
        foreach (var d in catalog.Entries)
            if (!options.Processes.ContainsKey(d.Name)) options.Processes[d.Name] = d.CreateDefaultOptions();

        IEquationOfState eos;
        try
        {
            eos = EquationsOfState.Create(options.EquationOfState);
        }
        catch (ArgumentException e)
        {
            throw new ConfigurationException($"Model:EquationOfState: {e.Message}", e);
        }
        var forcing = TropicalForcing.Create(options, environment);
        return new TropicalBoxModel(options, forcing, catalog, eos);
    }

    /// <summary>The options the model was built from.</summary>
    public TropicalModelOptions Options { get; }

    /// <summary>The precomputed forcing.</summary>
    public TropicalForcing Forcing { get; }

    /// <summary>The equation of state.</summary>
    public IEquationOfState EquationOfState => _eos;

    /// <summary>Age at model time 0 (ka).</summary>
    public double StartAgeKa => Forcing.Environment.StartAgeKa;

    /// <summary>Parameters with their keys, values and descriptions, in index order.</summary>
    public IReadOnlyList<ParameterEntry> ParameterEntries { get; }

    /// <summary>State variables, in order.</summary>
    public IReadOnlyList<StateEntry> StateVariables { get; }

    /// <summary>Diagnostics computed in every evaluation, in slot order.</summary>
    public IReadOnlyList<DiagnosticEntry> DiagnosticEntries { get; }

    /// <summary>Names of the enabled processes, in evaluation order.</summary>
    public IReadOnlyList<string> ActiveProcesses => _active.Select(p => p.Name).ToArray();

    /// <inheritdoc/>
    public int Dimension => _initial.Length;

    /// <inheritdoc/>
    public int ParameterCount => _parameters.Length;

    /// <inheritdoc/>
    public string GetParameterName(int index) => ParameterEntries[index].Key;

    /// <inheritdoc/>
    public void GetParameters(Span<double> destination) => _parameters.CopyTo(destination);

    /// <summary>Index of the parameter with configuration key <paramref name="key"/> (case-insensitive).</summary>
    /// <exception cref="ArgumentException">No such parameter; the message lists close names.</exception>
    public int ParameterIndex(string key)
    {
        for (int i = 0; i < ParameterEntries.Count; i++)
            if (string.Equals(ParameterEntries[i].Key, key, StringComparison.OrdinalIgnoreCase)) return i;
        var near = ParameterEntries.Select(p => p.Key).Where(k => k.Split(':')[^1].Equals(key.Split(':')[^1], StringComparison.OrdinalIgnoreCase)).ToList();
        throw new ArgumentException($"'{key}' is not a parameter of the model" + (near.Count > 0 ? $"; did you mean {string.Join(" or ", near)}?" : "; parameters are named by configuration path, e.g. " + ParameterEntries[^1].Key), nameof(key));
    }

    /// <summary>Index of the state variable <paramref name="name"/>.</summary>
    public int StateIndex(string name)
    {
        for (int i = 0; i < StateVariables.Count; i++) if (StateVariables[i].Name == name) return i;
        throw new ArgumentException($"'{name}' is not a state variable; state: {string.Join(", ", StateVariables.Select(s => s.Name))}", nameof(name));
    }

    /// <summary>Slot of the diagnostic <paramref name="name"/>.</summary>
    public int DiagnosticIndex(string name)
    {
        for (int i = 0; i < DiagnosticEntries.Count; i++) if (DiagnosticEntries[i].Name == name) return i;
        throw new ArgumentException($"'{name}' is not a diagnostic; diagnostics: {string.Join(", ", DiagnosticEntries.Select(s => s.Name))}", nameof(name));
    }

    /// <summary>A copy of the initial state.</summary>
    public double[] InitialState() => (double[])_initial.Clone();

    /// <inheritdoc/>
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        if (typeof(T) == typeof(double))
        {
            Core(t, y, MemoryMarshal.CreateReadOnlySpan(ref Unsafe.As<double, T>(ref _parameters[0]), _parameters.Length), dydt, default, default);
            return;
        }
        int n = _parameters.Length;
        T[]? rented = null;
        Scratch128<T> buffer = default;
        Span<T> p = n <= Scratch128<T>.Capacity ? ((Span<T>)buffer)[..n] : (rented = ArrayPool<T>.Shared.Rent(n)).AsSpan(0, n);
        try
        {
            for (int i = 0; i < n; i++) p[i] = T.CreateTruncating(_parameters[i]);
            Core(t, y, p, dydt, default, default);
        }
        finally
        {
            if (rented is not null) ArrayPool<T>.Shared.Return(rented);
        }
    }

    /// <inheritdoc/>
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        if (p.Length != _parameters.Length)
            throw new ArgumentException($"p has length {p.Length}; the model has {_parameters.Length} parameters.", nameof(p));
        Core(t, y, p, dydt, default, default);
    }

    /// <summary>
    /// The right-hand side and, when <paramref name="diagnostics"/> or <paramref name="budgets"/> is non-empty,
    /// the reported diagnostics (scaled to their units) and the per-box heat (W) and salt fluxes (length 12).
    /// </summary>
    [SkipLocalsInit]
    private void Core<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt, Span<double> diagnostics, Span<double> budgets)
        where T : struct, IFloatingPointIeee754<T>
    {
        if (y.Length != _initial.Length) throw new ArgumentException($"y has length {y.Length}; the model has {_initial.Length} state variables.", nameof(y));
        if (dydt.Length != _initial.Length) throw new ArgumentException($"dydt has length {dydt.Length}; the model has {_initial.Length} state variables.", nameof(dydt));
        Span<double> forcing = stackalloc double[ForcingChannel.Count];
        Forcing.At(t, forcing);

        Unsafe.SkipInit(out Scratch256<T> scratch);
        Span<T> s = scratch;
        Span<T> temperature = s[..6], salinity = s.Slice(6, 6), volume = s.Slice(12, 6), area = s.Slice(18, 6),
            heat = s.Slice(24, 6), salt = s.Slice(30, 6), diag = s.Slice(36, _diagnosticFallback.Length);

        T totalVolume = T.Zero, upperSalt = T.Zero;
        for (int i = 0; i < Boxes.Count; i++)
        {
            temperature[i] = y[i];
            area[i] = p[_area[i]];
            volume[i] = area[i] * p[_thickness[i]];
            totalVolume += volume[i];
        }
        for (int i = 0; i < SalinityBoxes; i++)
        {
            salinity[i] = y[Boxes.Count + i];
            upperSalt += volume[i] * salinity[i];
        }
        T meanSalinity = _meanSalinityState >= 0 ? y[_meanSalinityState] : p[_meanSalinityParameter];
        salinity[(int)Box.Deep] = (meanSalinity * totalVolume - upperSalt) / volume[(int)Box.Deep];
        heat.Clear();
        salt.Clear();
        for (int i = 0; i < diag.Length; i++) diag[i] = T.CreateTruncating(_diagnosticFallback[i]);
        dydt.Clear();

        var c = new ProcessContext<T>
        {
            Time = t,
            YearsSince1950 = Forcing.Environment.YearsSince1950(t),
            Temperature = temperature,
            Salinity = salinity,
            Volume = volume,
            Area = area,
            State = y,
            Parameters = p,
            Forcing = forcing,
            Diagnostics = diag,
            Heat = heat,
            Salt = salt,
            Rates = dydt,
            RhoCp = p[_rho0] * p[_cp],
            NetSurfaceFluxSlot = 0,
        };
        if (typeof(T) == typeof(double))
        {
            for (int i = 0; i < _active.Length; i++)
                if (_activeDouble[i] is { } a) Unsafe.As<ProcessAction<T>>(a)(ref c);
                else _active[i].Apply(ref c);
        }
        else if (typeof(T) == typeof(Dual))
        {
            for (int i = 0; i < _active.Length; i++)
                if (_activeDual[i] is { } a) Unsafe.As<ProcessAction<T>>(a)(ref c);
                else _active[i].Apply(ref c);
        }
        else
        {
            foreach (var process in _active) process.Apply(ref c);
        }

        T perYear = T.CreateTruncating(SecondsPerYear);
        for (int i = 0; i < Boxes.Count; i++) dydt[i] = heat[i] / (c.RhoCp * volume[i]) * perYear;
        for (int i = 0; i < SalinityBoxes; i++) dydt[Boxes.Count + i] = salt[i] / volume[i] * perYear;
        if (_meanSalinityState >= 0)
        {
            T net = T.Zero;
            for (int i = 0; i < Boxes.Count; i++) net += salt[i];
            dydt[_meanSalinityState] = net / totalVolume * perYear;
        }

        if (!diagnostics.IsEmpty)
            for (int i = 0; i < diag.Length; i++) diagnostics[i] = double.CreateTruncating(diag[i]) * _diagnosticScale[i];
        if (!budgets.IsEmpty)
            for (int i = 0; i < Boxes.Count; i++)
            {
                budgets[i] = double.CreateTruncating(heat[i]);
                budgets[Boxes.Count + i] = double.CreateTruncating(salt[i]);
            }
    }

    /// <summary>
    /// The diagnostics at (t, y), in slot order and in their reported units (e.g. Sv), into
    /// <paramref name="destination"/> (length ≥ <see cref="DiagnosticEntries"/>.Count).
    /// </summary>
    public void EvaluateDiagnostics(double t, ReadOnlySpan<double> y, Span<double> destination) =>
        EvaluateDiagnostics(t, y, destination, _parameters);

    /// <summary>As <see cref="EvaluateDiagnostics(double, ReadOnlySpan{double}, Span{double})"/> with the parameters taken from <paramref name="parameters"/>.</summary>
    public void EvaluateDiagnostics(double t, ReadOnlySpan<double> y, Span<double> destination, ReadOnlySpan<double> parameters)
    {
        if (parameters.Length != _parameters.Length) throw new ArgumentException($"parameters has length {parameters.Length}; the model has {_parameters.Length}.", nameof(parameters));
        if (destination.Length < DiagnosticEntries.Count) throw new ArgumentException($"destination has length {destination.Length}; {DiagnosticEntries.Count} diagnostics are needed.", nameof(destination));
        Span<double> dydt = stackalloc double[Dimension];
        Core(t, y, parameters, dydt, destination, default);
    }

    /// <summary>One diagnostic at (t, y) by name, in its reported unit (convenience; allocates a little).</summary>
    public double Diagnostic(string name, double t, ReadOnlySpan<double> y)
    {
        var d = new double[DiagnosticEntries.Count];
        EvaluateDiagnostics(t, y, d);
        return d[DiagnosticIndex(name)];
    }

    /// <summary>Heat and salt budgets of every box at (t, y), for conservation checks.</summary>
    public BoxBudgets Budgets(double t, ReadOnlySpan<double> y)
    {
        var dydt = new double[Dimension];
        var diagnostics = new double[DiagnosticEntries.Count];
        var fluxes = new double[2 * Boxes.Count];
        Core(t, y, _parameters, dydt, diagnostics, fluxes);
        var surface = new double[Boxes.Count];
        for (int i = 0; i < Boxes.SurfaceCount; i++) surface[i] = diagnostics[i];
        var volume = new double[Boxes.Count];
        var area = new double[Boxes.Count];
        for (int i = 0; i < Boxes.Count; i++)
        {
            area[i] = _parameters[_area[i]];
            volume[i] = area[i] * _parameters[_thickness[i]];
        }
        return new BoxBudgets(fluxes[..Boxes.Count], fluxes[Boxes.Count..], surface, area, volume, dydt,
            _parameters[_rho0] * _parameters[_cp]);
    }

    /// <summary>Salinity of every box (g/kg) in state <paramref name="y"/>, the deep box's diagnosed from the total salt.</summary>
    public double[] Salinities(ReadOnlySpan<double> y)
    {
        var s = new double[Boxes.Count];
        double total = 0, upper = 0;
        for (int i = 0; i < Boxes.Count; i++) total += _parameters[_area[i]] * _parameters[_thickness[i]];
        for (int i = 0; i < SalinityBoxes; i++)
        {
            s[i] = y[Boxes.Count + i];
            upper += _parameters[_area[i]] * _parameters[_thickness[i]] * s[i];
        }
        double mean = _meanSalinityState >= 0 ? y[_meanSalinityState] : _parameters[_meanSalinityParameter];
        s[(int)Box.Deep] = (mean * total - upper) / (_parameters[_area[(int)Box.Deep]] * _parameters[_thickness[(int)Box.Deep]]);
        return s;
    }

    // ------------------------------------------------------------------ output rows

    /// <summary>
    /// The columns of an output row: time_yr and age_ka, the state, the diagnostics, derived quantities
    /// (east–west SST difference, deep salinity, densities) and the forcing.
    /// </summary>
    public IReadOnlyList<ColumnInfo> Columns => _columns;

    private ColumnInfo[] BuildColumns()
    {
        var cols = new List<ColumnInfo>
        {
            new("time_yr", "yr", "model time since the start of the run", "time"),
            new("age_ka", "ka", "age, thousands of years before 1950 (positive into the past)", "time"),
        };
        cols.AddRange(StateVariables.Select(s => new ColumnInfo(s.Name, s.Unit, s.Meaning, "state")));
        cols.AddRange(DiagnosticEntries.Select(d => new ColumnInfo(d.Name, d.Unit, d.Meaning, "diagnostic")));
        cols.Add(new("east_west_sst_difference_k", "K", "warm-pool minus cold-tongue SST", "diagnostic"));
        cols.Add(new("salinity_deep_gkg", "g kg-1", "salinity of the deep reservoir (diagnosed from the total salt)", "diagnostic"));
        foreach (var b in Boxes.All)
            cols.Add(new($"density_{Boxes.ColumnName(b)}_kgm3", "kg m-3", $"density of the {Boxes.Label(b)} box at the sea surface (equation of state '{_eos.Name}', ice-volume-adjusted salinity)", "diagnostic"));
        foreach (var b in Boxes.Surface)
            cols.Add(new($"insolation_{Boxes.ColumnName(b)}_wm2", "W m-2", $"top-of-atmosphere insolation of the {Boxes.Label(b)}'s latitude band ({(Forcing.Seasonal ? "daily" : "annual")} mean)", "forcing"));
        cols.Add(new("co2_ppm", "ppm", "atmospheric CO2", "forcing"));
        cols.Add(new("sea_level_m", "m", "sea level relative to present", "forcing"));
        foreach (var b in Boxes.Surface)
            cols.Add(new($"hosing_scheduled_{Boxes.ColumnName(b)}_sv", "Sv", $"scheduled freshwater input into the {Boxes.Label(b)}", "forcing"));
        cols.Add(new("eccentricity", "1", "orbital eccentricity", "forcing"));
        cols.Add(new("obliquity_deg", "deg", "obliquity", "forcing"));
        cols.Add(new("perihelion_deg", "deg", "longitude of perihelion from the moving vernal equinox (Berger 1978)", "forcing"));
        cols.Add(new("climatic_precession", "1", "climatic precession index e·sin ϖ", "forcing"));
        return [.. cols];
    }

    /// <summary>Fills one output row (length <see cref="Columns"/>.Count) for model time <paramref name="t"/> and state <paramref name="y"/>. Allocation-free.</summary>
    public void FillRow(double t, ReadOnlySpan<double> y, Span<double> row)
    {
        if (row.Length < _columns.Length) throw new ArgumentException($"row has length {row.Length}; {_columns.Length} columns are needed.", nameof(row));
        int k = 0;
        row[k++] = t;
        row[k++] = StartAgeKa - t / 1000.0;
        y.CopyTo(row.Slice(k, y.Length));
        k += y.Length;
        int nd = DiagnosticEntries.Count;
        Span<double> dydt = stackalloc double[Dimension];
        Core(t, y, _parameters, dydt, row.Slice(k, nd), default);
        double salinityFactor = TryDiagnostic(row.Slice(k, nd), TropicalDiagnostics.IceVolumeSalinityFactor, 1.0);
        k += nd;
        row[k++] = y[(int)Box.WarmPool] - y[(int)Box.ColdTongue];
        Span<double> s = stackalloc double[Boxes.Count];
        {
            double total = 0, upper = 0;
            for (int i = 0; i < Boxes.Count; i++) total += _parameters[_area[i]] * _parameters[_thickness[i]];
            for (int i = 0; i < SalinityBoxes; i++)
            {
                s[i] = y[Boxes.Count + i];
                upper += _parameters[_area[i]] * _parameters[_thickness[i]] * s[i];
            }
            double mean = _meanSalinityState >= 0 ? y[_meanSalinityState] : _parameters[_meanSalinityParameter];
            s[(int)Box.Deep] = (mean * total - upper) / (_parameters[_area[(int)Box.Deep]] * _parameters[_thickness[(int)Box.Deep]]);
        }
        row[k++] = s[(int)Box.Deep];
        for (int i = 0; i < Boxes.Count; i++) row[k++] = _eos.Density(s[i] * salinityFactor, y[i], 0.0);
        Span<double> f = stackalloc double[ForcingChannel.Count];
        Forcing.At(t, f);
        for (int i = 0; i < Boxes.SurfaceCount; i++) row[k++] = f[ForcingChannel.Insolation((Box)i)];
        row[k++] = f[ForcingChannel.Co2];
        row[k++] = f[ForcingChannel.SeaLevel];
        for (int i = 0; i < Boxes.SurfaceCount; i++) row[k++] = f[ForcingChannel.Freshwater((Box)i)] * 1e-6;
        var o = Forcing.ElementsAt(t);
        row[k++] = o.Eccentricity;
        row[k++] = o.ObliquityDeg;
        row[k++] = ((o.PerihelionDeg % 360.0) + 360.0) % 360.0;
        row[k++] = o.ClimaticPrecession;
    }

    private double TryDiagnostic(ReadOnlySpan<double> diagnostics, string name, double fallback)
    {
        for (int i = 0; i < DiagnosticEntries.Count; i++) if (DiagnosticEntries[i].Name == name) return diagnostics[i];
        return fallback;
    }

    // ------------------------------------------------------------------ description

    /// <summary>Processes, state, options (with values, units, meanings and sources) and output columns, for documentation.</summary>
    public TropicalModelDescription Describe() => _description;

    /// <summary>The model in the common form of <see cref="IDescribedModel"/> (state, parameters, equations and references of the enabled processes).</summary>
    public ModelDescription Description => new()
    {
        Name = "tropical",
        Title = "tropical ocean–cloud box model (warm pool, cold tongue, two ventilation boxes, thermocline, deep reservoir)",
        TimeUnit = "yr",
        StateVariables = StateVariables.Select(s => new StateVariableInfo(s.Name, s.Unit, s.Meaning)).ToArray(),
        Parameters = ParameterEntries.Select(p => new ParameterInfo(p.Key, p.Attribute?.Unit ?? "", p.Value, p.Attribute?.Meaning ?? p.Meaning ?? "")).ToArray(),
        Equations = _description.Processes.Where(p => p.Enabled).Select(p => $"{p.Name}: {p.Equation}").ToArray(),
        References = _description.Processes.Where(p => p.Enabled).SelectMany(p => p.References).Distinct().ToArray(),
        Notes = [.. _description.Forcing],
    };

    private TropicalModelDescription BuildDescription(ProcessCatalog catalog, ProcessDescriptor[] ordered)
    {
        var processes = ordered.Select(e => new ProcessInfo(e.Name, e.Role, e.Equation, e.References, Options.Processes[e.Name].Enabled, "Model:Processes:" + e.Name, e.Order)).ToArray();
        var parameterKeys = new HashSet<string>(ParameterEntries.Select(p => p.Key), StringComparer.OrdinalIgnoreCase);
        var options = new List<OptionInfo>();
        LayoutBuilder.CollectOptions(Options, "Model", options, parameterKeys);
        foreach (var p in ParameterEntries.Where(p => p.Attribute is null))
            options.Add(new OptionInfo(p.Key, p.Value.ToString("R", CultureInfo.InvariantCulture), "g kg-1", p.Meaning ?? "", p.Source.Length > 0 ? p.Source : "derived", true));
        return new TropicalModelDescription(processes, StateVariables, options, _columns, Forcing.Describe());
    }
}

/// <summary>Heat and salt fluxes of every box at one instant (for conservation checks), indexed by <see cref="Box"/>.</summary>
/// <param name="Heat_W">Net heat flux into each box (W), surface and transport.</param>
/// <param name="Salt">Net salt flux into each box ((g/kg)·m³/s); the deep box's as its fluxes give it.</param>
/// <param name="SurfaceHeatFlux_Wm2">Net surface heat flux of each surface box (W/m²; 0 for the subsurface boxes).</param>
/// <param name="Area_m2">Areas.</param>
/// <param name="Volume_m3">Volumes.</param>
/// <param name="Rates">The right-hand side dy/dt (per year).</param>
/// <param name="RhoCp">ρ0·c_p (J m⁻³ K⁻¹).</param>
public sealed record BoxBudgets(double[] Heat_W, double[] Salt, double[] SurfaceHeatFlux_Wm2, double[] Area_m2, double[] Volume_m3, double[] Rates, double RhoCp);
