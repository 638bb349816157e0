using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// The tropical ocean–cloud box model (configuration section "Model"): seawater constants, the six
/// boxes, the processes (section "Model:Processes", one subsection per process, keyed by the process
/// name in the <see cref="ProcessCatalog"/>) and the forcing ("Model:Forcing").
/// </summary>
/// <remarks>
/// A plain mutable options class for configuration binding. <see cref="Processes"/> is pre-filled with
/// the default options of every process in the built-in catalog, so a binder that binds into existing
/// dictionary values (Microsoft.Extensions.Configuration does) sees each process's own options type.
/// Use <see cref="CreateDefault"/> for a catalog with added processes.
/// </remarks>
public sealed class TropicalModelOptions : ISelfValidating
{
    /// <summary>Options with the defaults of the built-in processes.</summary>
    public TropicalModelOptions() : this(ProcessCatalog.CreateBuiltIn()) { }

    private TropicalModelOptions(ProcessCatalog catalog) => Processes = catalog.CreateDefaultOptions();

    /// <summary>Options with the defaults of every process in <paramref name="catalog"/>.</summary>
    public static TropicalModelOptions CreateDefault(ProcessCatalog catalog)
    {
        ArgumentNullException.ThrowIfNull(catalog);
        return new TropicalModelOptions(catalog);
    }

    /// <summary>Equation of state used for every density (names as in <see cref="EquationsOfState.Names"/>).</summary>
    [Parameter("", "equation of state: linear | roquet2015 | eos80 | teos10",
        Source = "IOC, SCOR and IAPSO (2010), The international thermodynamic equation of seawater – 2010 (TEOS-10)")]
    public string EquationOfState { get; set; } = EquationsOfState.DefaultName;

    /// <summary>Reference density ρ0 of the Boussinesq budgets (heat capacity per volume ρ0·c_p, Ekman transport).</summary>
    [Parameter("kg m-3", "reference density ρ0 of seawater in the budgets", Source = "common practice (Boussinesq reference density)", Min = 1000, Max = 1060)]
    public double ReferenceDensity_kgm3 { get; set; } = 1025.0;

    /// <summary>Specific heat capacity c_p of seawater.</summary>
    [Parameter("J kg-1 K-1", "specific heat capacity c_p of seawater",
        Source = "TEOS-10 c_p0 = 3991.86795711963 J kg-1 K-1 (IOC, SCOR and IAPSO 2010)", Min = 3000, Max = 4500)]
    public double HeatCapacity_JkgK { get; set; } = 3991.86795711963;

    /// <summary>Reference salinity S0 converting freshwater fluxes into virtual salt fluxes.</summary>
    [Parameter("g kg-1", "reference salinity S0 of the virtual salt flux −S0·F/V", Source = "common practice (Stommel 1961, Tellus 13, 224)", Min = 0, MinExclusive = true, Max = 50)]
    public double ReferenceSalinity_gkg { get; set; } = 35.0;

    /// <summary>The six boxes.</summary>
    public BoxesOptions Boxes { get; set; } = new();

    /// <summary>Per-process options, keyed by process name (case-insensitive).</summary>
    public ProcessOptionsSet Processes { get; set; }

    /// <summary>Orbital, CO2, sea-level and freshwater forcing.</summary>
    public ForcingOptions Forcing { get; set; } = new();

    /// <inheritdoc/>
    public IEnumerable<string> Validate(string path)
    {
        if (!EquationsOfState.Names.Contains(EquationOfState?.Trim().ToLowerInvariant()))
            yield return $"{path}:EquationOfState = '{EquationOfState}' is not known; allowed: {string.Join(", ", EquationsOfState.Names)}";
    }
}

/// <summary>The six boxes (section "Model:Boxes"), each a named subsection.</summary>
public sealed class BoxesOptions
{
    /// <summary>Western equatorial warm pool.</summary>
    public BoxOptions WarmPool { get; set; } = BoxOptions.Defaults(Box.WarmPool);
    /// <summary>Eastern equatorial cold tongue.</summary>
    public BoxOptions ColdTongue { get; set; } = BoxOptions.Defaults(Box.ColdTongue);
    /// <summary>Northern ventilation box.</summary>
    public BoxOptions North { get; set; } = BoxOptions.Defaults(Box.North);
    /// <summary>Southern ventilation box.</summary>
    public BoxOptions South { get; set; } = BoxOptions.Defaults(Box.South);
    /// <summary>Equatorial thermocline box.</summary>
    public BoxOptions Thermocline { get; set; } = BoxOptions.Defaults(Box.Thermocline);
    /// <summary>Deep reservoir.</summary>
    public BoxOptions Deep { get; set; } = BoxOptions.Defaults(Box.Deep);

    /// <summary>The options of box <paramref name="box"/>.</summary>
    public BoxOptions this[Box box] => box switch
    {
        Box.WarmPool => WarmPool,
        Box.ColdTongue => ColdTongue,
        Box.North => North,
        Box.South => South,
        Box.Thermocline => Thermocline,
        Box.Deep => Deep,
        _ => throw new ArgumentOutOfRangeException(nameof(box), box, "not a box of the tropical model"),
    };
}

/// <summary>
/// One box: its latitude band (for insolation), horizontal area, thickness and initial state.
/// </summary>
/// <remarks>
/// The default basin is an idealized one of our own: band areas are 2πR²(sin φN − sin φS) times the
/// fraction of the circle the box spans in longitude (R = 6371 km), rounded.
/// </remarks>
public sealed class BoxOptions : ISelfValidating
{
    /// <summary>Southern edge of the latitude band, degrees north (−90 … 90).</summary>
    [Parameter("deg", "southern edge of the box's latitude band", Source = "idealized basin of our own", Min = -90, Max = 90)]
    public double SouthDeg { get; set; }

    /// <summary>Northern edge of the latitude band, degrees north (−90 … 90), not south of <see cref="SouthDeg"/>.</summary>
    [Parameter("deg", "northern edge of the box's latitude band", Source = "idealized basin of our own", Min = -90, Max = 90)]
    public double NorthDeg { get; set; }

    /// <summary>Horizontal area A.</summary>
    [Parameter("m2", "horizontal area of the box", Source = "idealized basin of our own (band area × longitude fraction)", Min = 0, MinExclusive = true)]
    public double Area_m2 { get; set; }

    /// <summary>Thickness H (for a surface box, the depth of the layer whose temperature it carries).</summary>
    [Parameter("m", "thickness of the box", Source = "common practice", Min = 0, MinExclusive = true, Max = 6000)]
    public double Thickness_m { get; set; }

    /// <summary>Initial temperature (Conservative Temperature with TEOS-10).</summary>
    [Parameter("degC", "initial temperature", Source = "tuned: close to the default equilibrium (shortens spin-up)", Min = -2, Max = 40)]
    public double InitialTemperature_degC { get; set; }

    /// <summary>Initial salinity (Absolute Salinity with TEOS-10).</summary>
    [Parameter("g kg-1", "initial salinity", Source = "tuned: close to the default equilibrium (shortens spin-up)", Min = 0, Max = 42)]
    public double InitialSalinity_gkg { get; set; }

    /// <summary>Volume A·H in m³.</summary>
    public double Volume_m3() => Area_m2 * Thickness_m;

    /// <inheritdoc/>
    public IEnumerable<string> Validate(string path)
    {
        if (NorthDeg < SouthDeg)
            yield return $"{path}:NorthDeg = {NorthDeg} is south of {path}:SouthDeg = {SouthDeg}; the northern edge must not be south of the southern edge";
    }

    /// <summary>The default geometry and initial state of <paramref name="box"/>.</summary>
    public static BoxOptions Defaults(Box box) => box switch
    {
        // 5°S–5°N over 80° of longitude: 4.45e13 m² × 80/360.
        Box.WarmPool => new() { SouthDeg = -5, NorthDeg = 5, Area_m2 = 1.0e13, Thickness_m = 75, InitialTemperature_degC = 29.5, InitialSalinity_gkg = 34.37 },
        // 3°S–3°N over 80° of longitude: 2.67e13 m² × 80/360.
        Box.ColdTongue => new() { SouthDeg = -3, NorthDeg = 3, Area_m2 = 6.0e12, Thickness_m = 75, InitialTemperature_degC = 24.8, InitialSalinity_gkg = 34.95 },
        // 35°N–60°N over 150° of longitude: 7.46e13 m² × 150/360.
        Box.North => new() { SouthDeg = 35, NorthDeg = 60, Area_m2 = 3.1e13, Thickness_m = 100, InitialTemperature_degC = 18, InitialSalinity_gkg = 35.0 },
        Box.South => new() { SouthDeg = -60, NorthDeg = -35, Area_m2 = 3.1e13, Thickness_m = 100, InitialTemperature_degC = 18, InitialSalinity_gkg = 35.0 },
        // 10°S–10°N over 160° of longitude, from the base of the surface layer (75 m) to 325 m.
        Box.Thermocline => new() { SouthDeg = -10, NorthDeg = 10, Area_m2 = 3.9e13, Thickness_m = 250, InitialTemperature_degC = 16.4, InitialSalinity_gkg = 35.0 },
        // 60°S–60°N over 160° of longitude, 325 m to about 3300 m.
        Box.Deep => new() { SouthDeg = -60, NorthDeg = 60, Area_m2 = 2.0e14, Thickness_m = 3000, InitialTemperature_degC = 16.4, InitialSalinity_gkg = 35.0 },
        _ => throw new ArgumentOutOfRangeException(nameof(box), box, "not a box of the tropical model"),
    };
}
