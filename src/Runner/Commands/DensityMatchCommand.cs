using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.IO;
using Thermostrat.Model.Seawater;
using Thermostrat.Runner.Configuration;
using Thermostrat.Runner.Output;

namespace Thermostrat.Runner.Commands;

/// <summary>
/// <c>thermostrat density-match</c>: how much must water mass A freshen (or warm) to become as
/// light as water mass B — under every equation of state side by side.
/// </summary>
public sealed class DensityMatchCommand : IRunnerCommand
{
    private readonly CommonOptions _common = new("out/density-match");
    private readonly Option<string> _a = new("--water-a")
    {
        Description = "The water mass that changes, as 'S=36.2,T=18' (salinity g/kg, temperature °C), optionally with depth 'z=150' (m) or pressure 'p=150' (dbar).",
        Required = true,
    };
    private readonly Option<string> _b = new("--water-b")
    {
        Description = "The water mass whose density is the target, same form as --water-a.",
        Required = true,
    };
    private readonly Option<double> _layer = new("--layer-m") { Description = "Thickness of water mass A's layer, m, for the freshwater equivalent (default 100).", DefaultValueFactory = _ => 100 };
    private readonly Option<string> _eos = new("--eos") { Description = "Equation of state: all (side by side, default), " + string.Join(", ", EquationsOfState.Names) + ".", DefaultValueFactory = _ => "all" };
    private readonly Option<double?> _ref = new("--reference-dbar") { Description = "Compare potential densities referred to this pressure (dbar) instead of in-situ densities." };
    private readonly Option<bool> _json = new("--json") { Description = "Print the results as JSON on stdout instead of a table." };

    /// <inheritdoc />
    public Command Build(TextWriter stdout, TextWriter stderr)
    {
        var cmd = new Command("density-match",
            "Densities of two water masses, their density ratio R = αΔT/(βΔS), and the salinity change of A (at its own temperature) " +
            "that makes A as dense as B, with its freshwater equivalent in metres and the temperature change that would do the same; " +
            "under every equation of state side by side. Writes density_match.parquet, a T–S figure with isopycnals and run.json.\n" +
            "Salinity is in g/kg (Absolute Salinity for TEOS-10; converted to practical salinity for EOS-80), temperature in °C.\n\n" +
            "Examples:\n" +
            "  thermostrat density-match --water-a S=35.6,T=19 --water-b S=34.9,T=27\n" +
            "  thermostrat density-match --water-a S=36.0,T=16,z=120 --water-b S=35,T=25 --layer-m 150 --json");
        foreach (var o in new Option[] { _a, _b, _layer, _eos, _ref, _json }) cmd.Options.Add(o);
        _common.AddTo(cmd);
        cmd.SetAction(pr => Cli.Guard(stderr, () => Execute(pr, stdout)));
        return cmd;
    }

    private int Execute(ParseResult pr, TextWriter stdout)
    {
        var settings = ConfigLoader.Load<Settings>(_common.Request(pr));
        var a = ParseWater("--water-a", pr.GetValue(_a)!);
        var b = ParseWater("--water-b", pr.GetValue(_b)!);
        double layer = pr.GetValue(_layer);
        if (!double.IsFinite(layer) || layer <= 0)
            throw new ConfigurationException($"--layer-m = {Fmt(layer)}: the layer thickness must be a finite number > 0 m");
        var eosName = (pr.GetValue(_eos) ?? "all").Trim().ToLowerInvariant();
        IReadOnlyList<string> names = eosName == "all" ? EquationsOfState.Names
            : EquationsOfState.Names.Contains(eosName) ? [eosName]
            : throw new ConfigurationException($"--eos '{eosName}' is not known; allowed: all, {string.Join(", ", EquationsOfState.Names)}");
        double? refP = pr.GetValue(_ref);
        if (refP is { } rp && (!double.IsFinite(rp) || rp < 0 || rp > 8000))
            throw new ConfigurationException($"--reference-dbar = {Fmt(rp)}: allowed 0 to 8000 dbar");
        var options = new DensityThresholdOptions { ReferencePressure_dbar = refP };
        var results = DensityThreshold.SolveAll(names.Select(n => EquationsOfState.Create(n)), a, b, layer, options);

        using var output = OutputFolder.Begin(pr.GetValue(_common.Out)!, pr.GetValue(_common.Replace));
        WriteTable(output.File_("density_match.parquet"), results, ResolvedConfig.Metadata(settings, "density-match", new Dictionary<string, string>
        {
            ["thermostrat.water_a"] = pr.GetValue(_a)!,
            ["thermostrat.water_b"] = pr.GetValue(_b)!,
        }));
        var figureEos = names.Contains(EquationsOfState.DefaultName) ? EquationsOfState.DefaultName : names[0];
        DensityFigure.Draw(output.File_("ts_diagram.png"), EquationsOfState.Create(figureEos), a, b,
            results.First(r => r.EquationOfState == figureEos), refP);
        output.WriteRunRecord("density-match", Environment.GetCommandLineArgs().Skip(1).ToList(), settings,
            new Dictionary<string, object?> { ["results"] = results.Select(ToJson).ToList() });
        output.Commit();

        if (pr.GetValue(_json))
        {
            stdout.WriteLine(JsonSerializer.Serialize(results.Select(ToJson).ToList(), ConfigLoader.ResolvedJson));
            return Cli.Ok;
        }
        var rows = new List<string[]> { new[] { "equation of state", "ρ_A kg/m³", "ρ_B kg/m³", "ρ_A−ρ_B", "R", "ΔS_A g/kg", "fresh water m", "ΔT_A K" } };
        foreach (var r in results)
            rows.Add([r.EquationOfState, F(r.DensityFirst_kgm3, 4), F(r.DensitySecond_kgm3, 4), F(r.DensityDifference_kgm3, 4), F(r.DensityRatio, 3),
                Change(r.SalinityChange_gkg, 4), Change(r.FreshwaterInput_m, 3), Change(r.TemperatureChange_K, 3)]);
        stdout.WriteLine($"A: S = {Fmt(a.Salinity)} g/kg, T = {Fmt(a.Temperature)} °C, p = {Fmt(a.Pressure_dbar)} dbar;  " +
                         $"B: S = {Fmt(b.Salinity)} g/kg, T = {Fmt(b.Temperature)} °C, p = {Fmt(b.Pressure_dbar)} dbar;  layer {Fmt(layer)} m" +
                         (refP is { } r0 ? $";  densities referred to {Fmt(r0)} dbar" : ""));
        TextTable.Write(stdout, rows);
        foreach (var r in results)
        {
            foreach (var (what, c) in new[] { ("salinity change", r.SalinityChange_gkg), ("temperature change", r.TemperatureChange_K) })
                if (!c.Found) stdout.WriteLine($"  {r.EquationOfState}: no {what} in range: {c.NoSolutionReason?.Replace("the first water mass", "A").Replace("as the second", "as B")}");
        }
        stdout.WriteLine($"wrote {output.FinalPath}: density_match.parquet, ts_diagram.png ({figureEos}), run.json");
        return Cli.Ok;
    }

    private static string Change(ThresholdChange c, int digits) => c.Found ? F(c.Value, digits) : "no solution";

    private static string F(double v, int digits) => double.IsFinite(v) ? v.ToString("F" + digits, CultureInfo.InvariantCulture) : v.ToString(CultureInfo.InvariantCulture);

    private static string Fmt(double v) => v.ToString("G6", CultureInfo.InvariantCulture);

    private static Dictionary<string, object?> ToJson(DensityThresholdResult r) => new()
    {
        ["equation_of_state"] = r.EquationOfState,
        ["density_a_kgm3"] = r.DensityFirst_kgm3,
        ["density_b_kgm3"] = r.DensitySecond_kgm3,
        ["density_difference_kgm3"] = r.DensityDifference_kgm3,
        ["pressure_a_dbar"] = r.PressureFirst_dbar,
        ["pressure_b_dbar"] = r.PressureSecond_dbar,
        ["thermal_expansion_per_k"] = r.ThermalExpansion_perK,
        ["haline_contraction_kg_per_g"] = r.HalineContraction_perGkg,
        ["density_ratio"] = double.IsFinite(r.DensityRatio) ? r.DensityRatio : null,
        ["salinity_change_gkg"] = r.SalinityChange_gkg.Found ? r.SalinityChange_gkg.Value : null,
        ["freshwater_input_m"] = r.FreshwaterInput_m.Found ? r.FreshwaterInput_m.Value : null,
        ["temperature_change_k"] = r.TemperatureChange_K.Found ? r.TemperatureChange_K.Value : null,
        ["no_solution"] = new[] { r.SalinityChange_gkg, r.FreshwaterInput_m, r.TemperatureChange_K }.Where(c => !c.Found).Select(c => c.NoSolutionReason).Distinct().ToList() is { Count: > 0 } l ? l : null,
    };

    private static void WriteTable(string path, IReadOnlyList<DensityThresholdResult> results, Dictionary<string, string> meta)
    {
        using var w = ParquetTableWriter.Create(path,
        [
            new ColumnSpec("equation_of_state", "", "equation of state", ColumnKind.Text),
            new ColumnSpec("salinity_a_gkg", "g/kg", "salinity of water mass A"),
            new ColumnSpec("temperature_a_degc", "degC", "temperature of water mass A"),
            new ColumnSpec("pressure_a_dbar", "dbar", "pressure at which A is evaluated"),
            new ColumnSpec("salinity_b_gkg", "g/kg", "salinity of water mass B"),
            new ColumnSpec("temperature_b_degc", "degC", "temperature of water mass B"),
            new ColumnSpec("pressure_b_dbar", "dbar", "pressure at which B is evaluated"),
            new ColumnSpec("density_a_kgm3", "kg m-3", "density of A"),
            new ColumnSpec("density_b_kgm3", "kg m-3", "density of B"),
            new ColumnSpec("density_difference_kgm3", "kg m-3", "density of A minus density of B"),
            new ColumnSpec("thermal_expansion_per_k", "K-1", "α at the mid-point of A and B"),
            new ColumnSpec("haline_contraction_kg_per_g", "kg g-1", "β at the mid-point of A and B"),
            new ColumnSpec("density_ratio", "1", "R = αΔT/(βΔS)"),
            new ColumnSpec("salinity_change_gkg", "g/kg", "salinity change of A (own temperature) that equalises the densities; NaN: none in range"),
            new ColumnSpec("freshwater_input_m", "m", "fresh water mixed into A's layer giving that change; NaN: none"),
            new ColumnSpec("temperature_change_k", "K", "temperature change of A (own salinity) that equalises the densities; NaN: none in range"),
            new ColumnSpec("layer_thickness_m", "m", "thickness of A's layer"),
        ], meta);
        foreach (var r in results)
        {
            int c = 0;
            w.Set(c++, r.EquationOfState);
            foreach (var v in new[]
            {
                r.First.Salinity, r.First.Temperature, r.PressureFirst_dbar, r.Second.Salinity, r.Second.Temperature, r.PressureSecond_dbar,
                r.DensityFirst_kgm3, r.DensitySecond_kgm3, r.DensityDifference_kgm3, r.ThermalExpansion_perK, r.HalineContraction_perGkg, r.DensityRatio,
                r.SalinityChange_gkg.Value, r.FreshwaterInput_m.Value, r.TemperatureChange_K.Value, r.LayerThickness_m,
            }) w.Set(c++, v);
            w.EndRow();
        }
        w.Complete();
    }

    /// <summary>Parses 'S=..,T=..[,z=..|p=..]' and checks the ranges.</summary>
    internal static WaterMass ParseWater(string option, string text)
    {
        double? s = null, t = null, z = null, p = null;
        foreach (var part in text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            var kv = part.Split('=', 2, StringSplitOptions.TrimEntries);
            if (kv.Length != 2) throw new ConfigurationException($"{option} '{text}': '{part}' is not key=value; expected S=<g/kg>,T=<°C>[,z=<m>|p=<dbar>]");
            if (!double.TryParse(kv[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var v))
                throw new ConfigurationException($"{option}: {kv[0]} = '{kv[1]}' is not a number");
            switch (kv[0].ToLowerInvariant())
            {
                case "s": s = v; break;
                case "t": t = v; break;
                case "z": z = v; break;
                case "p": p = v; break;
                default: throw new ConfigurationException($"{option}: unknown key '{kv[0]}'; allowed: S (g/kg), T (°C), z (depth, m) or p (pressure, dbar)");
            }
        }
        if (s is null || t is null) throw new ConfigurationException($"{option} '{text}' needs both S=<g/kg> and T=<°C>");
        if (z is not null && p is not null) throw new ConfigurationException($"{option} '{text}': give depth z or pressure p, not both");
        Check(option, "S", s.Value, SeawaterRange.MinSalinity, SeawaterRange.MaxSalinity, "g/kg");
        Check(option, "T", t.Value, SeawaterRange.MinTemperature, SeawaterRange.MaxTemperature, "°C");
        if (z is { } zz) { Check(option, "z", zz, 0, 7800, "m"); return WaterMass.AtDepth(s.Value, t.Value, zz); }
        if (p is { } pp) Check(option, "p", pp, 0, 8000, "dbar");
        return new WaterMass(s.Value, t.Value, p ?? 0);
    }

    private static void Check(string option, string key, double v, double lo, double hi, string unit)
    {
        if (!double.IsFinite(v) || v < lo || v > hi)
            throw new ConfigurationException($"{option}: {key} = {Fmt(v)} is outside the allowed range {Fmt(lo)} to {Fmt(hi)} {unit}");
    }
}
