using ScottPlot;

namespace Thermostrat.Runner.Output;

/// <summary>
/// Our figure style: sans-serif type large enough to read in a paper draft, light grid,
/// labelled axes with units, and a fixed qualitative palette chosen for contrast on white.
/// </summary>
public static class Figures
{
    /// <summary>Default figure size in pixels.</summary>
    public const int Width = 1100, Height = 650;

    /// <summary>The qualitative palette (hex), in the order series are drawn.</summary>
    public static readonly string[] Palette = ["#1b4f72", "#c0392b", "#1e8449", "#b9770e", "#6c3483", "#117a65", "#7b7d7d", "#d35400"];

    private static readonly object FontLock = new();

    /// <summary>Colour of series <paramref name="i"/>.</summary>
    public static Color Series(int i) => Color.FromHex(Palette[i % Palette.Length]);

    /// <summary>A new plot in our style.</summary>
    public static Plot NewPlot(string title, string xLabel, string yLabel)
    {
        lock (FontLock) Fonts.Default = "DejaVu Sans";
        var plt = new Plot();
        Style(plt, title, xLabel, yLabel);
        return plt;
    }

    /// <summary>Applies our style to a plot (also used for subplots of a multiplot).</summary>
    public static void Style(Plot plt, string title, string xLabel, string yLabel)
    {
        plt.Title(title, size: 18);
        plt.XLabel(xLabel, size: 15);
        plt.YLabel(yLabel, size: 15);
        plt.Axes.Title.Label.FontName = "DejaVu Sans";
        plt.Axes.Bottom.Label.FontName = "DejaVu Sans";
        plt.Axes.Left.Label.FontName = "DejaVu Sans";
        plt.Axes.Bottom.TickLabelStyle.FontSize = 13;
        plt.Axes.Left.TickLabelStyle.FontSize = 13;
        plt.Grid.MajorLineColor = Color.FromHex("#e5e8e8");
        plt.FigureBackground.Color = Colors.White;
        plt.DataBackground.Color = Colors.White;
    }

    /// <summary>Saves a plot as PNG to <paramref name="path"/> (through a temporary name).</summary>
    public static void Save(Plot plt, string path, int width = Width, int height = Height)
    {
        var tmp = path + ".partial.png";
        plt.SavePng(tmp, width, height);
        File.Move(tmp, path, overwrite: true);
    }
}
