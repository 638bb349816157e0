using ScottPlot;
using Thermostrat.Model.Analysis;

namespace Thermostrat.Runner.Output;

/// <summary>Two-parameter diagram: fold curves (solid), Hopf curves (dash-dot), the bistable region shaded, cusps and Bogdanov–Takens points marked.</summary>
internal static class BoundaryFigure
{
    public static void Draw(string path, string model, string first, string second, List<Curve> curves, double[] cuts,
        List<IReadOnlyList<BistableInterval>> bistable, (double From, double To, double SFrom, double STo) box, (double X, double Y) start)
    {
        var plt = Figures.NewPlot($"{model}: folds and Hopf points in ({first}, {second})", first, second);
        foreach (var map in bistable)
        {
            // Shade each contiguous run of second-parameter values that has a bistable interval.
            var run = new List<BistableInterval>();
            void Flush()
            {
                if (run.Count >= 2)
                {
                    var poly = run.Select(b => new Coordinates(b.Lower, b.SecondParameter))
                        .Concat(run.AsEnumerable().Reverse().Select(b => new Coordinates(b.Upper, b.SecondParameter))).ToArray();
                    var pg = plt.Add.Polygon(poly);
                    pg.FillColor = Figures.Series(0).WithAlpha(0.18);
                    pg.LineColor = Colors.Transparent;
                }
                run.Clear();
            }
            foreach (var b in map) { if (b.IsBistable) run.Add(b); else Flush(); }
            Flush();
        }
        bool foldLegend = false, hopfLegend = false, shadeLegend = bistable.Any(m => m.Any(b => b.IsBistable));
        foreach (var c in curves)
        {
            var line = plt.Add.Scatter(c.Points.Select(q => q.FirstParameter).ToArray(), c.Points.Select(q => q.SecondParameter).ToArray());
            line.MarkerSize = 0;
            bool fold = c.Kind == CurveKind.Fold;
            line.LineWidth = 2.4f;
            line.Color = fold ? Figures.Series(0) : Figures.Series(1);
            line.LinePattern = fold ? LinePattern.Solid : LinePattern.DenselyDashed;
            if (fold && !foldLegend) { line.LegendText = "fold curve"; foldLegend = true; }
            if (!fold && !hopfLegend) { line.LegendText = "Hopf curve"; hopfLegend = true; }
            foreach (var (s, label) in BranchFigure.Labelled(c.SpecialPoints))
            {
                double y = s.SecondParameter ?? double.NaN;
                plt.Add.Marker(s.Parameter, y, s.Kind == SpecialPointKind.Cusp ? MarkerShape.FilledSquare : MarkerShape.FilledDiamond, 12, Colors.Black);
                var t = plt.Add.Text(label, s.Parameter, y);
                t.LabelFontSize = 14;
                t.LabelBold = true;
                t.OffsetX = 8;
                t.OffsetY = -8;
            }
        }
        if (shadeLegend)
        {
            var legendPatch = plt.Add.Marker(double.NaN, double.NaN, MarkerShape.FilledSquare, 12, Figures.Series(0).WithAlpha(0.35));
            legendPatch.LegendText = "bistable: two stable states coexist";
        }
        var st = plt.Add.Marker(start.X, start.Y, MarkerShape.OpenSquare, 9, Figures.Series(6));
        st.LegendText = "start of the branch";
        plt.Axes.SetLimits(box.From, box.To, box.SFrom, box.STo);
        plt.ShowLegend(Alignment.UpperRight);
        plt.Legend.FontSize = 13;
        Figures.Save(plt, path);
    }
}
