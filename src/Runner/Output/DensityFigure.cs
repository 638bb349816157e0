using ScottPlot;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Runner.Output;

/// <summary>The T–S plane with isopycnals and the two water masses of a density-match.</summary>
internal static class DensityFigure
{
    public static void Draw(string path, IEquationOfState eos, WaterMass a, WaterMass b, DensityThresholdResult r, double? referenceDbar)
    {
        double p = referenceDbar ?? a.Pressure_dbar;
        double sLo = Math.Max(0, Math.Min(a.Salinity, b.Salinity) - 1.5), sHi = Math.Min(42, Math.Max(a.Salinity, b.Salinity) + 1.5);
        if (r.SalinityChange_gkg.Found) { sLo = Math.Max(0, Math.Min(sLo, a.Salinity + r.SalinityChange_gkg.Value - 0.5)); }
        double tLo = Math.Max(-2, Math.Min(a.Temperature, b.Temperature) - 4), tHi = Math.Min(40, Math.Max(a.Temperature, b.Temperature) + 4);
        string pressure = referenceDbar is { } rp ? $"σ referred to {rp:G4} dbar" : $"at {p:G4} dbar";
        var plt = Figures.NewPlot($"T–S plane, {eos.Name} ({pressure}); isopycnals labelled σ = ρ − 1000 kg/m³", "salinity (g/kg)", "temperature (°C)");

        // Isopycnals: for each density level and temperature, the salinity with that density
        // (density rises monotonically with salinity), found by bisection.
        double rhoMin = new[] { (sLo, tLo), (sLo, tHi), (sHi, tLo), (sHi, tHi) }.Min(c => eos.Density(c.Item1, c.Item2, p));
        double rhoMax = new[] { (sLo, tLo), (sLo, tHi), (sHi, tLo), (sHi, tHi) }.Max(c => eos.Density(c.Item1, c.Item2, p));
        double spacing = NiceStep((rhoMax - rhoMin) / 10);
        var temps = Enumerable.Range(0, 81).Select(i => tLo + (tHi - tLo) * i / 80).ToArray();
        for (double level = Math.Ceiling(rhoMin / spacing) * spacing; level <= rhoMax; level += spacing)
        {
            var xs = new List<double>(); var ys = new List<double>();
            foreach (var t in temps)
            {
                if (SalinityAt(eos, level, t, p, sLo, sHi) is { } s) { xs.Add(s); ys.Add(t); }
            }
            if (xs.Count < 2) continue;
            var line = plt.Add.Scatter(xs.ToArray(), ys.ToArray());
            line.MarkerSize = 0;
            line.LineWidth = 1.2f;
            line.Color = Color.FromHex("#95a5a6");
            var label = plt.Add.Text($"{level - 1000:0.##}", xs[^1], ys[^1]);
            label.LabelFontSize = 11;
            label.LabelFontColor = Color.FromHex("#566573");
        }
        // The isopycnal through B: the density A must reach.
        var bx = new List<double>(); var by = new List<double>();
        foreach (var t in temps)
            if (SalinityAt(eos, r.DensitySecond_kgm3, t, p, sLo, sHi) is { } s) { bx.Add(s); by.Add(t); }
        if (bx.Count > 1)
        {
            var target = plt.Add.Scatter(bx.ToArray(), by.ToArray());
            target.MarkerSize = 0;
            target.LineWidth = 2.2f;
            target.LinePattern = LinePattern.Dashed;
            target.Color = Figures.Series(1);
            target.LegendText = $"isopycnal of B (σ = {r.DensitySecond_kgm3 - 1000:F3} kg/m³)";
        }
        Mark(plt, a.Salinity, a.Temperature, "A", Figures.Series(0), MarkerShape.FilledCircle);
        Mark(plt, b.Salinity, b.Temperature, "B", Figures.Series(1), MarkerShape.FilledSquare);
        if (r.SalinityChange_gkg.Found)
        {
            double s2 = a.Salinity + r.SalinityChange_gkg.Value;
            var arrow = plt.Add.Arrow(new Coordinates(a.Salinity, a.Temperature), new Coordinates(s2, a.Temperature));
            arrow.ArrowLineColor = Figures.Series(0);
            arrow.ArrowFillColor = Figures.Series(0);
            arrow.ArrowWidth = 3;
            arrow.ArrowheadWidth = 14;
            arrow.LegendText = $"ΔS = {r.SalinityChange_gkg.Value:F3} g/kg ({r.FreshwaterInput_m.Value:F2} m fresh water)";
        }
        plt.Axes.SetLimits(sLo, sHi + (sHi - sLo) * 0.06, tLo, tHi);
        plt.ShowLegend(Alignment.UpperLeft);
        plt.Legend.FontSize = 13;
        Figures.Save(plt, path);
    }

    private static void Mark(Plot plt, double s, double t, string name, Color color, MarkerShape shape)
    {
        var m = plt.Add.Marker(s, t, shape, 14, color);
        m.LegendText = $"{name}: {s:G5} g/kg, {t:G4} °C";
        var l = plt.Add.Text(name, s, t);
        l.LabelFontSize = 16;
        l.LabelBold = true;
        l.LabelFontColor = color;
        l.OffsetX = 10;
        l.OffsetY = -10;
    }

    private static double? SalinityAt(IEquationOfState eos, double rho, double t, double p, double sLo, double sHi)
    {
        double fLo = eos.Density(sLo, t, p) - rho, fHi = eos.Density(sHi, t, p) - rho;
        if (fLo * fHi > 0) return null;
        for (int k = 0; k < 50; k++)
        {
            double m = 0.5 * (sLo + sHi), fm = eos.Density(m, t, p) - rho;
            if (fm * fLo <= 0) { sHi = m; } else { sLo = m; fLo = fm; }
        }
        return 0.5 * (sLo + sHi);
    }

    private static double NiceStep(double raw)
    {
        double mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double f = raw / mag;
        return (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10) * mag;
    }
}
