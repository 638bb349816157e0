using ScottPlot;
using Thermostrat.Model.Orbital;
using Thermostrat.Runner.Commands;

namespace Thermostrat.Runner.Output;

/// <summary>Figures of the insolation command.</summary>
internal static class InsolationFigures
{
    /// <summary>Latitude × age map of the tabulated quantity (June for monthly tables); a line plot for a single latitude or band.</summary>
    public static void AgeLatitudeMap(string path, InsolationPlan plan, string column, double[] values, int[]? months)
    {
        double[] ages = plan.AgesKa;
        double[] lats = plan.Latitudes;
        InsolationQuantity q = plan.Quantity;
        string unit = column.EndsWith("gjm2") ? "GJ m⁻²" : "W m⁻²";
        string what = InsolationCommand.QuantityName(q) + (months is not null ? " (June)" : "");
        bool band = q == InsolationQuantity.Band;
        int nL = band ? 1 : lats.Length, per = months is null ? 1 : 12, pick = months is null ? 0 : 5;
        if (nL == 1 || ages.Length == 1)
        {
            var plt = Figures.NewPlot($"Insolation: {what}", nL == 1 ? "age (ka before 1950)" : "latitude (°N)", $"{what} ({unit})");
            if (nL == 1)
            {
                var y = Enumerable.Range(0, ages.Length).Select(i => values[i * per + pick]).ToArray();
                var s = plt.Add.Scatter(ages, y);
                s.MarkerSize = ages.Length > 60 ? 0 : 5;
                s.Color = Figures.Series(0);
                s.LineWidth = 2;
            }
            else
            {
                var y = Enumerable.Range(0, nL).Select(j => values[j * per + pick]).ToArray();
                var s = plt.Add.Scatter(lats, y);
                s.Color = Figures.Series(0);
                s.LineWidth = 2;
            }
            Figures.Save(plt, path);
            return;
        }
        // Rows run north (top) to south; columns young (left) to old. The map shows the anomaly
        // from each latitude's mean over the ages, since the latitude profile would otherwise hide
        // the orbital signal; a diverging colour scale centred on zero.
        var order = Enumerable.Range(0, nL).OrderByDescending(j => lats[j]).ToArray();
        var grid = new double[nL, ages.Length];
        double maxAbs = 0;
        for (int r = 0; r < nL; r++)
        {
            double mean = 0;
            for (int i = 0; i < ages.Length; i++) mean += values[(i * nL + order[r]) * per + pick];
            mean /= ages.Length;
            for (int i = 0; i < ages.Length; i++)
            {
                grid[r, i] = values[(i * nL + order[r]) * per + pick] - mean;
                maxAbs = Math.Max(maxAbs, Math.Abs(grid[r, i]));
            }
        }
        var map = Figures.NewPlot($"Insolation: {what}, anomaly from each latitude's mean over {ages[0]:G6}–{ages[^1]:G6} ka", "age (ka before 1950)", "latitude (°N)");
        var hm = map.Add.Heatmap(grid);
        hm.Colormap = Diverging;
        hm.ManualRange = new ScottPlot.Range(-Math.Max(maxAbs, 1e-12), Math.Max(maxAbs, 1e-12));
        double dA = ages.Length > 1 ? (ages[^1] - ages[0]) / (ages.Length - 1) : 1, dL = (lats.Max() - lats.Min()) / Math.Max(1, nL - 1);
        hm.Extent = new CoordinateRect(ages[0] - dA / 2, ages[^1] + dA / 2, lats.Min() - dL / 2, lats.Max() + dL / 2);
        map.Axes.SetLimits(ages[0] - dA / 2, ages[^1] + dA / 2, lats.Min() - dL / 2, lats.Max() + dL / 2);
        var bar = map.Add.ColorBar(hm);
        bar.Label = $"{what} anomaly ({unit})";
        bar.LabelStyle.FontSize = 14;
        Figures.Save(map, path);
    }

    /// <summary>Blue–white–red, for anomalies.</summary>
    private static readonly IColormap Diverging = new ScottPlot.Colormaps.CustomInterpolated(
    [
        Color.FromHex("#1b4f72"), Color.FromHex("#5dade2"), Color.FromHex("#f8f9f9"), Color.FromHex("#ec7063"), Color.FromHex("#922b21"),
    ]);

    /// <summary>Latitude × day-of-year map at one epoch.</summary>
    public static void SeasonMap(string path, double[] lats, double[] days, double[,] values, double ageKa)
    {
        int nL = lats.Length, nD = days.Length;
        var grid = new double[nL, nD];
        for (int r = 0; r < nL; r++)
            for (int d = 0; d < nD; d++)
                grid[r, d] = values[nL - 1 - r, d];
        var plt = Figures.NewPlot($"Daily-mean insolation at {InsolationCommand.Fmt(ageKa)} ka", "day of year (vernal equinox on 21 March = day 80)", "latitude (°N)");
        var hm = plt.Add.Heatmap(grid);
        hm.Colormap = new ScottPlot.Colormaps.Viridis();
        hm.Extent = new CoordinateRect(days[0] - 0.5, days[^1] + 0.5, lats[0] - 0.5, lats[^1] + 0.5);
        plt.Axes.SetLimits(days[0] - 0.5, days[^1] + 0.5, lats[0] - 0.5, lats[^1] + 0.5);
        var bar = plt.Add.ColorBar(hm);
        bar.Label = "insolation (W m⁻²)";
        bar.LabelStyle.FontSize = 14;
        Figures.Save(plt, path);
    }

    /// <summary>Eccentricity, obliquity and climatic precession against age, stacked.</summary>
    public static void Elements(string path, double[] ages, OrbitalElements[] el)
    {
        var mp = new Multiplot();
        mp.AddPlots(3);
        var series = new (string Title, string Y, Func<OrbitalElements, double> F)[]
        {
            ("Eccentricity", "e", x => x.Eccentricity),
            ("Obliquity", "ε (°)", x => x.ObliquityDeg),
            ("Climatic precession", "e·sin ϖ", x => x.ClimaticPrecession),
        };
        lock (typeof(Figures)) Fonts.Default = "DejaVu Sans";
        for (int k = 0; k < 3; k++)
        {
            var p = mp.GetPlot(k);
            Figures.Style(p, series[k].Title, k == 2 ? "age (ka before 1950)" : "", series[k].Y);
            var s = p.Add.Scatter(ages, el.Select(series[k].F).ToArray());
            s.MarkerSize = ages.Length > 60 ? 0 : 4;
            s.LineWidth = 1.8f;
            s.Color = Figures.Series(k);
            p.Axes.SetLimitsX(ages.Min(), ages.Max() + (ages.Length == 1 ? 1 : 0));
        }
        var tmp = path + ".partial.png";
        mp.SavePng(tmp, Figures.Width, 900);
        File.Move(tmp, path, overwrite: true);
    }
}
