using ScottPlot;
using Thermostrat.Model.IO;

namespace Thermostrat.Runner.Output;

/// <summary>Multi-panel time series of a run: SSTs, thermocline depth, transports, low cloud, salinities.</summary>
internal static class RunFigure
{
    private static readonly (string Title, string YLabel, string[] Columns)[] Panels =
    [
        ("Sea surface temperature", "°C", ["sst_warm_pool_degc", "sst_cold_tongue_degc", "sst_north_degc", "sst_south_degc"]),
        ("Equatorial thermocline depth", "m", ["thermocline_depth_west_m", "thermocline_depth_east_m"]),
        ("Transports", "Sv", ["ventilation_north_sv", "ventilation_south_sv", "upwelling_sv"]),
        ("Low-cloud fraction", "fraction", ["low_cloud_fraction_cold_tongue", "low_cloud_fraction_warm_pool", "low_cloud_fraction_north", "low_cloud_fraction_south"]),
        ("Salinity", "g/kg", ["salinity_warm_pool_gkg", "salinity_cold_tongue_gkg", "salinity_north_gkg", "salinity_south_gkg", "salinity_thermocline_gkg"]),
    ];

    public static void Draw(string path, IReadOnlyList<ColumnSpec> columns, List<double[]> rows, double startAgeKa, string description)
    {
        var names = columns.Select(c => c.Name).ToList();
        bool byAge = startAgeKa > 0;
        int xi = byAge ? names.IndexOf("age_ka") : names.IndexOf("time_yr");
        var x = rows.Select(r => r[xi]).ToArray();
        lock (typeof(Figures)) Fonts.Default = "DejaVu Sans";
        var mp = new Multiplot();
        var panels = Panels.Where(p => p.Columns.Any(names.Contains)).ToList();
        mp.AddPlots(panels.Count);
        for (int k = 0; k < panels.Count; k++)
        {
            var plt = mp.GetPlot(k);
            string title = k == 0 && description.Length > 0 ? $"{panels[k].Title} — {Shorten(description)}" : panels[k].Title;
            Figures.Style(plt, title, k == panels.Count - 1 ? (byAge ? "age (ka before 1950)" : "model time (years)") : "", panels[k].YLabel);
            plt.Axes.Title.Label.FontSize = 15;
            int s = 0;
            foreach (var col in panels[k].Columns)
            {
                int ci = names.IndexOf(col);
                if (ci < 0) continue;
                var line = plt.Add.Scatter(x, rows.Select(r => r[ci]).ToArray());
                line.MarkerSize = 0;
                line.LineWidth = 1.8f;
                line.Color = Figures.Series(s++);
                line.LegendText = Label(col);
            }
            if (byAge) plt.Axes.InvertX();
            plt.ShowLegend(Alignment.UpperRight);
            plt.Legend.FontSize = 11;
        }
        var tmp = path + ".partial.png";
        mp.SavePng(tmp, Figures.Width, 260 * panels.Count);
        File.Move(tmp, path, overwrite: true);
    }

    private static string Label(string col) => col
        .Replace("sst_", "").Replace("low_cloud_fraction_", "").Replace("salinity_", "").Replace("thermocline_depth_", "")
        .Replace("_degc", "").Replace("_gkg", "").Replace("_sv", "").Replace("_m", "").Replace('_', ' ');

    private static string Shorten(string s) => s.Length <= 80 ? s : s[..77] + "...";
}
