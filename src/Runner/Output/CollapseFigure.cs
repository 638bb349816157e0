using ScottPlot;
using Thermostrat.Model.Analysis;
using Thermostrat.Runner.Models;

namespace Thermostrat.Runner.Output;

/// <summary>The watched quantity on the branch, the transient runs' outcomes, the threshold bracket and (optionally) a ramp run.</summary>
internal static class CollapseFigure
{
    public static void Draw(string path, IModelHost host, Branch branch, double[] parameters, int column, ThresholdResult result,
        RampTrajectory? ramp, RampComparison? comparison)
    {
        var reader = new ColumnReader(host, column, parameters, branch.ParameterIndex);
        double Y(IReadOnlyList<double> state, double param, double t = 0) => reader.Value(state.ToArray(), param, t);
        var (name, unit) = (reader.Column.Name, reader.Column.Unit);
        var plt = Figures.NewPlot($"{host.Name}: collapse threshold in {branch.ParameterName}", branch.ParameterName,
            string.IsNullOrEmpty(unit) || unit == "1" ? name : $"{name} ({unit})");
        var pts = branch.Points;
        var stable = plt.Add.Scatter(pts.Select(q => q.Parameter).ToArray(), pts.Select(q => Y(q.State, q.Parameter)).ToArray());
        stable.MarkerSize = 0;
        stable.LineWidth = 1.5f;
        stable.Color = Figures.Series(6);
        stable.LegendText = "equilibria (all)";
        var st = pts.Where(q => q.Stability == StabilityType.Stable).ToList();
        var sm = plt.Add.ScatterPoints(st.Select(q => q.Parameter).ToArray(), st.Select(q => Y(q.State, q.Parameter)).ToArray());
        sm.MarkerSize = 4;
        sm.Color = Figures.Series(0);
        sm.LegendText = "stable equilibria";
        if (ramp is not null)
        {
            var rl = plt.Add.Scatter(ramp.ParameterValues.ToArray(), Enumerable.Range(0, ramp.Times.Length).Select(i => Y(ramp.States[i], ramp.ParameterValues[i], ramp.Times[i])).ToArray());
            rl.MarkerSize = 0;
            rl.LineWidth = 2.2f;
            rl.Color = Figures.Series(2);
            rl.LegendText = $"ramp run (rate {ramp.Rate:G3} per time unit)";
        }
        var vl = plt.Add.VerticalLine(result.Threshold);
        vl.Color = Figures.Series(1);
        vl.LineWidth = 2;
        vl.LegendText = $"transient threshold {result.Threshold:G6}";
        if (result.NearestFold is { } f)
        {
            var fl = plt.Add.VerticalLine(f.Parameter);
            fl.Color = Colors.Black;
            fl.LinePattern = LinePattern.Dotted;
            fl.LegendText = $"nearest fold {f.Parameter:G6}";
        }
        foreach (var r in result.Runs)
        {
            var m = plt.Add.Marker(r.Parameter, r.FinalDiagnostic, r.Collapsed ? MarkerShape.Cross : MarkerShape.OpenCircle, 9, r.Collapsed ? Figures.Series(1) : Figures.Series(0));
        }
        plt.ShowLegend(Alignment.UpperRight);
        plt.Legend.FontSize = 12;
        Figures.Save(plt, path);
    }
}
