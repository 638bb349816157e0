using Xunit;
using SkiaSharp;
using Thermostrat.Runner.Output;

namespace Thermostrat.Runner.Tests;

/// <summary>
/// ScottPlot writes a valid PNG even when no font is installed, with every label silently missing
/// (seen on this machine kind). These checks make sure text really rendered.
/// </summary>
public sealed class FigureTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("thermostrat-fig-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static int DifferingPixels(string a, string b)
    {
        using var x = SKBitmap.Decode(a);
        using var y = SKBitmap.Decode(b);
        Assert.Equal(x.Width, y.Width);
        Assert.Equal(x.Height, y.Height);
        int n = 0;
        for (int j = 0; j < x.Height; j++)
            for (int i = 0; i < x.Width; i++)
                if (x.GetPixel(i, j) != y.GetPixel(i, j)) n++;
        return n;
    }

    [Fact]
    public void Axis_labels_and_title_render_as_text()
    {
        var with = Path.Combine(_dir, "with.png");
        var without = Path.Combine(_dir, "without.png");
        var p1 = Figures.NewPlot("Title text", "age (ka)", "insolation (W m⁻²)");
        p1.Add.Scatter(new double[] { 0, 1, 2 }, new double[] { 1, 3, 2 });
        Figures.Save(p1, with, 600, 400);
        // The same figure with its title and axis labels painted white: identical layout, so
        // the two images differ exactly where text was drawn. Without fonts they are identical.
        var p2 = Figures.NewPlot("Title text", "age (ka)", "insolation (W m⁻²)");
        p2.Axes.Title.Label.ForeColor = ScottPlot.Colors.White;
        p2.Axes.Bottom.Label.ForeColor = ScottPlot.Colors.White;
        p2.Axes.Left.Label.ForeColor = ScottPlot.Colors.White;
        p2.Add.Scatter(new double[] { 0, 1, 2 }, new double[] { 1, 3, 2 });
        Figures.Save(p2, without, 600, 400);
        int diff = DifferingPixels(with, without);
        Assert.True(diff > 300, $"title and axis labels did not render ({diff} pixels differ); is a font such as fonts-dejavu-core installed?");
    }
}
