using ScottPlot;
using Thermostrat.Model.Analysis;
using Thermostrat.Runner.Models;

namespace Thermostrat.Runner.Output;

/// <summary>
/// Bifurcation diagram: stable equilibria as solid lines, unstable (and saddle) ones dashed;
/// special points marked with our own symbols and labelled — F fold (filled diamond), H Hopf
/// (open circle), B branch point (cross), C non-smooth corner (filled triangle), S the start
/// (small square).
/// </summary>
internal static class BranchFigure
{
    /// <summary>Labels of the special points (End excluded), numbered within each kind: F1, F2, H1, C1, ...; a point found twice shares its label.</summary>
    public static List<(SpecialPoint Point, string Label)> Labelled(IEnumerable<SpecialPoint> specials)
    {
        var counts = new Dictionary<string, int>();
        var result = new List<(SpecialPoint, string)>();
        foreach (var s in specials.Where(s => s.Kind != SpecialPointKind.End))
        {
            // The same point found twice (from both sides of a turn) keeps one label.
            var twin = result.FirstOrDefault(r => r.Item1.Kind == s.Kind && SamePoint(r.Item1, s));
            if (twin.Item2 is not null) { result.Add((s, twin.Item2)); continue; }
            string prefix = s.Kind switch
            {
                SpecialPointKind.Fold => "F",
                SpecialPointKind.Hopf => "H",
                SpecialPointKind.BranchPoint => "B",
                SpecialPointKind.NonSmoothTurn or SpecialPointKind.NonSmoothKink => "C",
                SpecialPointKind.Cusp => "K",
                SpecialPointKind.BogdanovTakens => "BT",
                _ => "E",
            };
            counts[prefix] = counts.GetValueOrDefault(prefix) + 1;
            result.Add((s, prefix + counts[prefix]));
        }
        return result;
    }

    private static bool SamePoint(SpecialPoint a, SpecialPoint b)
    {
        double scale = Math.Max(1e-300, Math.Max(Math.Abs(a.Parameter), Math.Abs(b.Parameter)));
        if (Math.Abs(a.Parameter - b.Parameter) > 1e-8 * Math.Max(1, scale)) return false;
        if ((a.SecondParameter ?? 0) != (b.SecondParameter ?? 0) && Math.Abs((a.SecondParameter ?? 0) - (b.SecondParameter ?? 0)) > 1e-8) return false;
        for (int i = 0; i < Math.Min(a.State.Length, b.State.Length); i++)
            if (Math.Abs(a.State[i] - b.State[i]) > 1e-6 * Math.Max(1, Math.Abs(a.State[i]))) return false;
        return true;
    }

    private static MarkerShape Symbol(SpecialPointKind k) => k switch
    {
        SpecialPointKind.Fold => MarkerShape.FilledDiamond,
        SpecialPointKind.Hopf => MarkerShape.OpenCircle,
        SpecialPointKind.BranchPoint => MarkerShape.Cross,
        SpecialPointKind.NonSmoothTurn or SpecialPointKind.NonSmoothKink => MarkerShape.FilledTriangleUp,
        SpecialPointKind.Cusp => MarkerShape.FilledSquare,
        _ => MarkerShape.OpenSquare,
    };

    public static void Draw(string path, IModelHost host, Branch branch, double[] parameters, int column, string parameterName)
    {
        var reader = new ColumnReader(host, column, parameters, branch.ParameterIndex);
        double Y(IReadOnlyList<double> state, double param) => reader.Value(state.ToArray(), param);
        var (show, unit) = (reader.Column.Name, reader.Column.Unit);
        var plt = Figures.NewPlot($"{host.Name}: equilibria against {parameterName}", parameterName, string.IsNullOrEmpty(unit) || unit == "1" ? show : $"{show} ({unit})");

        // Split into runs of equal stability; each run drawn solid (stable) or dashed.
        var pts = branch.Points;
        int runStart = 0;
        bool stableLegend = false, unstableLegend = false;
        for (int i = 1; i <= pts.Count; i++)
        {
            bool boundary = i == pts.Count || (pts[i].Stability == StabilityType.Stable) != (pts[i - 1].Stability == StabilityType.Stable);
            if (!boundary) continue;
            int end = Math.Min(i, pts.Count - 1); // share the boundary point so the curve is continuous
            var xs = new double[end - runStart + 1];
            var ys = new double[xs.Length];
            for (int j = runStart; j <= end; j++) { xs[j - runStart] = pts[j].Parameter; ys[j - runStart] = Y(pts[j].State, pts[j].Parameter); }
            bool stable = pts[runStart].Stability == StabilityType.Stable;
            var line = plt.Add.Scatter(xs, ys);
            line.MarkerSize = 0;
            line.LineWidth = stable ? 2.6f : 1.8f;
            line.Color = stable ? Figures.Series(0) : Figures.Series(1);
            line.LinePattern = stable ? LinePattern.Solid : LinePattern.Dashed;
            if (stable && !stableLegend) { line.LegendText = "stable"; stableLegend = true; }
            if (!stable && !unstableLegend) { line.LegendText = "unstable"; unstableLegend = true; }
            runStart = i;
        }
        var placed = new List<(double X, double Y)>();
        double xSpan = Math.Max(1e-300, pts.Max(q => q.Parameter) - pts.Min(q => q.Parameter));
        var drawn = new HashSet<string>();
        foreach (var (s, label) in Labelled(branch.SpecialPoints))
        {
            if (!drawn.Add(label)) continue;
            double y = Y(s.State, s.Parameter);
            plt.Add.Marker(s.Parameter, y, Symbol(s.Kind), 13, Colors.Black);
            var t = plt.Add.Text(label, s.Parameter, y);
            t.LabelFontSize = 14;
            t.LabelBold = true;
            // Labels of points that nearly coincide are stacked instead of overprinted.
            int near = placed.Count(q => Math.Abs(q.X - s.Parameter) < 0.02 * xSpan);
            placed.Add((s.Parameter, y));
            t.OffsetX = 8;
            t.OffsetY = -8 - 21 * near;
        }
        if (branch.StartIndex >= 0 && branch.StartIndex < pts.Count)
        {
            var sp = pts[branch.StartIndex];
            var m = plt.Add.Marker(sp.Parameter, Y(sp.State, sp.Parameter), MarkerShape.FilledSquare, 7, Figures.Series(6));
            m.LegendText = "start";
        }
        plt.ShowLegend(Alignment.UpperRight);
        plt.Legend.FontSize = 13;
        Figures.Save(plt, path);
    }
}
