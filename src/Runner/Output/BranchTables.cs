using Thermostrat.Model.Analysis;
using Thermostrat.Model.IO;
using Thermostrat.Runner.Models;

namespace Thermostrat.Runner.Output;

/// <summary>Parquet tables of continuation results.</summary>
internal static class BranchTables
{
    public static void WriteBranch(string path, IModelHost host, Branch branch, double[] parameters, Dictionary<string, string> meta)
    {
        var cols = new List<ColumnSpec>
        {
            new("point_index", "1", "point number along the branch (arclength order)", ColumnKind.Int64),
            new("parameter_value", "", $"value of {branch.ParameterName}"),
            new("arclength", "1", "scaled arclength from the start"),
        };
        cols.AddRange(host.StateColumns);
        cols.AddRange(host.DiagnosticColumns);
        cols.Add(new("stability", "", "stable | unstable | saddle | non-hyperbolic", ColumnKind.Text));
        cols.Add(new("unstable_eigenvalues", "1", "number of eigenvalues with positive real part", ColumnKind.Int64));
        cols.Add(new("leading_eigenvalue_re", "1/time", "real part of the leading eigenvalue (per model time unit)"));
        cols.Add(new("leading_eigenvalue_im", "1/time", "imaginary part of the leading eigenvalue"));
        cols.Add(new("efolding_time", "time", "1/|Re λ| of the leading eigenvalue"));
        cols.Add(new("point_type", "", "regular | start | end | fold | hopf | branch-point | corner-turn | corner-kink", ColumnKind.Text));
        cols.Add(new("special_point", "1", "index into special_points.parquet, or -1", ColumnKind.Int64));
        using var w = ParquetTableWriter.Create(path, cols, meta);
        var p = (double[])parameters.Clone();
        var diag = new double[host.DiagnosticColumns.Count];
        for (int i = 0; i < branch.Points.Count; i++)
        {
            var pt = branch.Points[i];
            p[branch.ParameterIndex] = pt.Parameter;
            host.Diagnostics(0, pt.State.AsSpan(), p, diag);
            int c = 0;
            w.Set(c++, (long)i);
            w.Set(c++, pt.Parameter);
            w.Set(c++, pt.Arclength);
            foreach (var v in pt.State) w.Set(c++, v);
            foreach (var v in diag) w.Set(c++, v);
            w.Set(c++, StabilityName(pt.Stability));
            w.Set(c++, (long)pt.UnstableCount);
            w.Set(c++, pt.LeadingEigenvalue.Real);
            w.Set(c++, pt.LeadingEigenvalue.Imaginary);
            w.Set(c++, pt.LeadingEigenvalue.Real == 0 ? double.PositiveInfinity : 1 / Math.Abs(pt.LeadingEigenvalue.Real));
            w.Set(c++, TypeName(pt.Type));
            w.Set(c, (long)pt.SpecialPointIndex);
            w.EndRow();
        }
        w.Complete();
    }

    public static void WriteSpecialPoints(string path, IModelHost host, IReadOnlyList<SpecialPoint> specials, double[] parameters, int parameterIndex, Dictionary<string, string> meta)
    {
        var cols = new List<ColumnSpec>
        {
            new("special_point", "1", "index", ColumnKind.Int64),
            new("label", "", "label in the figures (F fold, H Hopf, B branch point, C corner, K cusp, BT Bogdanov–Takens; E end)", ColumnKind.Text),
            new("kind", "", "fold | hopf | branch-point | corner-turn | corner-kink | cusp | bogdanov-takens | end", ColumnKind.Text),
            new("parameter_value", "", "value of the continuation parameter"),
            new("second_parameter_value", "", "value of the second parameter (two-parameter curves; NaN otherwise)"),
            new("located", "1", "1 if located by Newton on the defining system, 0 if only bracketed", ColumnKind.Int64),
            new("residual", "1", "residual of the defining system at the located point"),
            new("iterations", "1", "Newton iterations of the location", ColumnKind.Int64),
            new("period", "time", "oscillation period 2π/ω at a Hopf point (NaN otherwise)"),
            new("description", "", "what the point is and how it was found", ColumnKind.Text),
        };
        cols.AddRange(host.StateColumns);
        cols.AddRange(host.DiagnosticColumns);
        using var w = ParquetTableWriter.Create(path, cols, meta);
        var p = (double[])parameters.Clone();
        var diag = new double[host.DiagnosticColumns.Count];
        var labels = new Dictionary<SpecialPoint, string>(ReferenceEqualityComparer.Instance);
        foreach (var (pt, lab) in BranchFigure.Labelled(specials)) labels[pt] = lab;
        for (int i = 0; i < specials.Count; i++)
        {
            var s = specials[i];
            p[parameterIndex] = s.Parameter;
            host.Diagnostics(0, s.State.AsSpan(), p, diag);
            int c = 0;
            w.Set(c++, (long)i);
            w.Set(c++, labels.TryGetValue(s, out var lab) ? lab : "E");
            w.Set(c++, KindName(s.Kind));
            w.Set(c++, s.Parameter);
            w.Set(c++, s.SecondParameter ?? double.NaN);
            w.Set(c++, s.Located ? 1L : 0L);
            w.Set(c++, s.Residual);
            w.Set(c++, (long)s.Iterations);
            w.Set(c++, s.Period ?? double.NaN);
            w.Set(c++, s.Description);
            foreach (var v in s.State) w.Set(c++, v);
            foreach (var v in diag) w.Set(c++, v);
            w.EndRow();
        }
        w.Complete();
    }

    public static string StabilityName(StabilityType t) => t switch
    {
        StabilityType.Stable => "stable",
        StabilityType.Unstable => "unstable",
        StabilityType.Saddle => "saddle",
        StabilityType.NonHyperbolic => "non-hyperbolic",
        _ => "unknown",
    };

    public static string TypeName(BranchPointType t) => t switch
    {
        BranchPointType.BranchPoint => "branch-point",
        BranchPointType.NonSmoothTurn => "corner-turn",
        BranchPointType.NonSmoothKink => "corner-kink",
        BranchPointType.BogdanovTakens => "bogdanov-takens",
        _ => t.ToString().ToLowerInvariant(),
    };

    public static string KindName(SpecialPointKind k) => k switch
    {
        SpecialPointKind.BranchPoint => "branch-point",
        SpecialPointKind.NonSmoothTurn => "corner-turn",
        SpecialPointKind.NonSmoothKink => "corner-kink",
        SpecialPointKind.BogdanovTakens => "bogdanov-takens",
        _ => k.ToString().ToLowerInvariant(),
    };
}
