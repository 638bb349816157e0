using Thermostrat.Model.Analysis;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Bench;

/// <summary>
/// Nanoseconds per evaluation of ρ, α and β for each equation of state (double precision, one
/// core), through the <see cref="IEquationOfState"/> interface (a generic virtual call, as the box
/// model makes it) and, for TEOS-10, directly through <see cref="Teos10"/>. Target: under 30 ns
/// per evaluation for the 75-term polynomial.
/// </summary>
/// <remarks>
/// Each row gives the harness's wall-clock median and, on Linux, the least of this thread's CPU
/// time per operation over the samples (<c>clock_gettime(CLOCK_THREAD_CPUTIME_ID)</c>), which does
/// not count time the thread spent waiting for a core: on a machine shared with other work the
/// second is the better estimate of what one evaluation costs on one core.
/// </remarks>
public static class SeawaterBench
{
    private const int Points = 4096;

    private enum Quantity { Density, ThermalExpansion, HalineContraction }

    public static void Run(BenchContext context)
    {
        var rng = new Random(2015);
        var s = new double[Points];
        var t = new double[Points];
        var p = new double[Points];
        for (int i = 0; i < Points; i++)
        {
            s[i] = 30.0 + 8.0 * rng.NextDouble();
            t[i] = -1.0 + 31.0 * rng.NextDouble();
            p[i] = 6000.0 * rng.NextDouble();
        }
        int repeats = context.Quick ? 10 : 50;
        long ops = (long)Points * repeats;
        double sink = 0;

        // Each row warms its loop up until tiered compilation has finished with it (BenchContext.SteadyNsPerOp).
        foreach (string name in EquationsOfState.Names)
        {
            IEquationOfState eos = EquationsOfState.Create(name);
            string? target = name == EquationsOfState.Teos10Name ? "< 30 ns" : null;
            foreach (Quantity q in Enum.GetValues<Quantity>())
                Both(context, $"{name}: {Label(q)} (interface)", () => sink += ViaInterface(eos, q, s, t, p, repeats), ops, target);
        }
        foreach (Quantity q in Enum.GetValues<Quantity>())
            Both(context, $"teos10: {Label(q)} (Teos10 static, direct)", () => sink += Direct(q, s, t, p, repeats), ops, "< 30 ns");

        var first = new WaterMass(35.3, 3.0);
        var second = new WaterMass(34.9, 4.0);
        var teos = new Teos10EquationOfState();
        context.Report("threshold solve (teos10: densities, salinity and temperature roots)", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 20; i++) sink += DensityThreshold.Solve(teos, first, second, 100.0).SalinityChange_gkg.Value;
        }, 20) / 1000.0, "µs");
        context.Report("allocated per ρ+α+β evaluation (teos10, interface)",
            BenchContext.AllocatedBytes(() => sink += ViaInterface(teos, Quantity.Density, s, t, p, 1)
                + ViaInterface(teos, Quantity.ThermalExpansion, s, t, p, 1) + ViaInterface(teos, Quantity.HalineContraction, s, t, p, 1)) / (double)Points, "B");

        if (double.IsNaN(sink)) context.Out.WriteLine("  (a result was NaN)");
    }

    private static void Both(BenchContext context, string what, Action action, long ops, string? target)
    {
        var (best, median) = context.SteadyNsPerOp(action, ops, warmSeconds: 0.25, samples: 15);
        context.Report(what + ", wall median", median, "ns", target);
        context.Report(what + ", thread CPU best", best, "ns", target);
    }

    private static string Label(Quantity q) => q switch
    {
        Quantity.Density => "density ρ",
        Quantity.ThermalExpansion => "thermal expansion α",
        _ => "haline contraction β",
    };

    private static double ViaInterface(IEquationOfState eos, Quantity q, double[] s, double[] t, double[] p, int repeats)
    {
        double acc = 0;
        for (int r = 0; r < repeats; r++)
        {
            switch (q)
            {
                case Quantity.Density:
                    for (int i = 0; i < s.Length; i++) acc += eos.Density(s[i], t[i], p[i]);
                    break;
                case Quantity.ThermalExpansion:
                    for (int i = 0; i < s.Length; i++) acc += eos.ThermalExpansion(s[i], t[i], p[i]);
                    break;
                default:
                    for (int i = 0; i < s.Length; i++) acc += eos.HalineContraction(s[i], t[i], p[i]);
                    break;
            }
        }
        return acc;
    }

    private static double Direct(Quantity q, double[] s, double[] t, double[] p, int repeats)
    {
        double acc = 0;
        for (int r = 0; r < repeats; r++)
        {
            switch (q)
            {
                case Quantity.Density:
                    for (int i = 0; i < s.Length; i++) acc += Teos10.Density(s[i], t[i], p[i]);
                    break;
                case Quantity.ThermalExpansion:
                    for (int i = 0; i < s.Length; i++) acc += Teos10.ThermalExpansion(s[i], t[i], p[i]);
                    break;
                default:
                    for (int i = 0; i < s.Length; i++) acc += Teos10.HalineContraction(s[i], t[i], p[i]);
                    break;
            }
        }
        return acc;
    }
}
