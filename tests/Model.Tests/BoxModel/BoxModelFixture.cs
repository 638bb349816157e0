using Thermostrat.Model.Analysis;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>Shared construction of the default tropical model and its equilibria.</summary>
internal static class BoxModelFixture
{
    /// <summary>Present-day orbital elements (Berger 1978: e = 0.016724, ε = 23.446°, ϖ = 102.04° in 1950).</summary>
    public static OrbitalElements Present { get; } = new(0.016724, 23.446, 102.04);

    /// <summary>The default model (or edited options) with the present orbit held fixed, for equilibrium analysis.</summary>
    public static TropicalBoxModel Build(Action<TropicalModelOptions>? edit = null, IOrbitSource? orbit = null, double startAgeKa = 0, double durationYears = 0,
        ProcessCatalog? catalog = null)
    {
        var o = catalog is null ? new TropicalModelOptions() : TropicalModelOptions.CreateDefault(catalog);
        edit?.Invoke(o);
        return TropicalBoxModel.Create(o, new ForcingEnvironment
        {
            Orbit = orbit ?? new ConstantOrbit(Present),
            StartAgeKa = startAgeKa,
            DurationYears = durationYears,
            ParallelPrecompute = false,
        }, catalog);
    }

    /// <summary>The model's parameter vector.</summary>
    public static double[] Parameters(TropicalBoxModel m)
    {
        var p = new double[m.ParameterCount];
        m.GetParameters(p);
        return p;
    }

    /// <summary>Equilibrium by damped Newton with the exact Jacobian, from <paramref name="guess"/> (default: the configured initial state).</summary>
    public static double[] Equilibrium(TropicalBoxModel m, double[]? p = null, double[]? guess = null)
    {
        p ??= Parameters(m);
        var g = guess ?? m.InitialState();
        if (g.Length != m.Dimension)
        {
            var full = m.InitialState();
            Array.Copy(g, full, Math.Min(g.Length, full.Length));
            g = full;
        }
        var r = SteadyState.Solve(m, g, p);
        Assert.True(r.Converged, $"no equilibrium: {r.Failure}, residual {r.Residual}");
        return [.. r.State];
    }

    /// <summary>Diagnostics at (0, y) with parameters p, by name.</summary>
    public static Func<string, double> Diagnostics(TropicalBoxModel m, double[] y, double[]? p = null)
    {
        var d = new double[m.DiagnosticEntries.Count];
        m.EvaluateDiagnostics(0, y, d, p ?? Parameters(m));
        return name => d[m.DiagnosticIndex(name)];
    }

    /// <summary>East–west SST difference T_W − T_E (K).</summary>
    public static double ZonalDifference(double[] y) => y[(int)Box.WarmPool] - y[(int)Box.ColdTongue];
}
