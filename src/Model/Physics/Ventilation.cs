using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Ventilation of the equatorial thermocline by subduction in the two ventilation boxes, and the closed
/// shallow overturning loop it drives:
/// <code>
/// Δρ_N = ρ(S_N·f_ice, T_N, p_ref) − ρ(S_W·f_ice, T_W, p_ref)                   (same for S)
/// ψ_N = M · Ramp(Δρ_N, δ)/Δρ_ref,   ψ_S = M · Ramp(Δρ_S, δ)/Δρ_ref,   ψ = ψ_N + ψ_S
/// loop: N →ψ_N→ U,  S →ψ_S→ U,  U →ψ→ E (at T_up),  E →ψ→ W,  W →ψ_N→ N,  W →ψ_S→ S
/// </code>
/// Of the poleward Ekman transport M (per hemisphere) the part that returns through the thermocline is
/// the water dense enough to pass beneath the equatorial surface water: the subducted transport grows with
/// the density excess of the ventilation box over the warm pool and falls to zero as it vanishes (a smooth
/// ramp of width δ; the subtropical-cell picture of McCreary and Lu 1994). Because a weaker flow leaves a
/// freshened box fresher and lighter, freshwater input has a threshold and hysteresis (the salt-advection
/// feedback of Stommel 1961). Densities come from the model's equation of state at p_ref, with salinities
/// scaled by the ice-volume factor f_ice. Volume is conserved in every box; heat and salt are only moved.
/// Disabled: no overturning (ψ = 0).
/// </summary>
public sealed class Ventilation : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "Ventilation";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<VentilationOptions>(
        ProcessName,
        "subduction of ventilation-box water into the equatorial thermocline where it is denser than the warm pool; the closed shallow overturning loop",
        "ψ_N = M·Ramp(ρ_N − ρ_W)/Δρ_ref, ψ_S likewise, ψ = ψ_N + ψ_S; N,S → U → E (at T_up) → W → N,S",
        ["McCreary, J. P., and P. Lu (1994), Interaction between the subtropical and equatorial ocean circulations: the subtropical cell, J. Phys. Oceanogr. 24, 466–497",
         "Stommel, H. (1961), Thermohaline convection with two stable regimes of flow, Tellus 13, 224–230",
         "Liu, Z. (1994), A simple model of the mass exchange between the subtropical and tropical ocean, J. Phys. Oceanogr. 24, 1153–1165"],
        order: 50,
        (o, c) => new Ventilation(o, c));

    private readonly DensityFunction _density;
    private readonly int _reference, _width, _pressure;
    private readonly int _ekman, _tup, _salinityFactor;
    private readonly int _psiN, _psiS, _psi, _contrastN, _contrastS;

    private Ventilation(VentilationOptions o, ProcessBuildContext c)
    {
        _density = new DensityFunction(c.EquationOfState);
        _reference = c.Parameter(nameof(o.ReferenceContrast_kgm3));
        _width = c.Parameter(nameof(o.RampWidth_kgm3));
        _pressure = c.Parameter(nameof(o.ReferencePressure_dbar));
        _ekman = c.Diagnostic(TropicalDiagnostics.EkmanTransport);
        _tup = c.Diagnostic(TropicalDiagnostics.UpwelledTemperature);
        _salinityFactor = c.Diagnostic(TropicalDiagnostics.IceVolumeSalinityFactor);
        _psiN = c.ProvideDiagnostic(TropicalDiagnostics.VentilationNorth, "Sv", "subduction from the northern ventilation box into the thermocline ψ_N", 0.0, 1e-6);
        _psiS = c.ProvideDiagnostic(TropicalDiagnostics.VentilationSouth, "Sv", "subduction from the southern ventilation box into the thermocline ψ_S", 0.0, 1e-6);
        _psi = c.ProvideDiagnostic(TropicalDiagnostics.Upwelling, "Sv", "equatorial upwelling into the cold tongue ψ = ψ_N + ψ_S", 0.0, 1e-6);
        _contrastN = c.ProvideDiagnostic(TropicalDiagnostics.DensityContrast(Box.North), "kg m-3", "density of the northern ventilation box minus the warm pool's, at the reference pressure", 0.0);
        _contrastS = c.ProvideDiagnostic(TropicalDiagnostics.DensityContrast(Box.South), "kg m-3", "density of the southern ventilation box minus the warm pool's, at the reference pressure", 0.0);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T f = c.Diagnostics[_salinityFactor], p = c.P(_pressure);
        T rhoW = _density.Of(c.SalinityOf(Box.WarmPool) * f, c.TemperatureOf(Box.WarmPool), p);
        T contrastN = _density.Of(c.SalinityOf(Box.North) * f, c.TemperatureOf(Box.North), p) - rhoW;
        T contrastS = _density.Of(c.SalinityOf(Box.South) * f, c.TemperatureOf(Box.South), p) - rhoW;

        T perContrast = c.Diagnostics[_ekman] / c.P(_reference), width = c.P(_width);
        T psiN = perContrast * SmoothFunctions.Ramp(contrastN, width);
        T psiS = perContrast * SmoothFunctions.Ramp(contrastS, width);
        T psi = psiN + psiS;
        c.Diagnostics[_contrastN] = contrastN;
        c.Diagnostics[_contrastS] = contrastS;
        c.Diagnostics[_psiN] = psiN;
        c.Diagnostics[_psiS] = psiS;
        c.Diagnostics[_psi] = psi;

        c.Transfer(Box.North, Box.Thermocline, psiN);
        c.Transfer(Box.South, Box.Thermocline, psiS);
        c.Transfer(Box.Thermocline, Box.ColdTongue, psi, c.Diagnostics[_tup], c.SalinityOf(Box.Thermocline));
        c.Transfer(Box.ColdTongue, Box.WarmPool, psi);
        c.Transfer(Box.WarmPool, Box.North, psiN);
        c.Transfer(Box.WarmPool, Box.South, psiS);
    }
}

/// <summary>Options of <see cref="Ventilation"/> ("Model:Processes:Ventilation").</summary>
public sealed class VentilationOptions : ProcessOptions
{
    /// <summary>Density excess Δρ_ref at which the whole Ekman transport is subducted.</summary>
    [Parameter("kg m-3", "density excess over the warm pool at which the whole poleward Ekman transport subducts (Δρ_ref)", Source = "tuned: ψ = 30 Sv in the default equilibrium (common practice: subtropical cells 20–40 Sv in total)", Min = 0, MinExclusive = true, Max = 100)]
    public double ReferenceContrast_kgm3 { get; set; } = 8.92;

    /// <summary>Width δ of the smooth ramp near zero density excess.</summary>
    [Parameter("kg m-3", "width of the smooth ramp at zero density excess (δ)", Source = "common practice (small against the ≈ 4 kg m-3 present contrast; keeps the Jacobian smooth)", Min = 0, MinExclusive = true, Max = 10)]
    public double RampWidth_kgm3 { get; set; } = 0.2;

    /// <summary>Pressure at which densities are compared (0: potential density referenced to the surface).</summary>
    [Parameter("dbar", "sea pressure at which the densities are compared", Source = "common practice (surface-referenced potential density σ0)", Min = 0, Max = 1000)]
    public double ReferencePressure_dbar { get; set; }
}
