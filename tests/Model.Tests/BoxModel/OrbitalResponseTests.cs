using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Thermostrat.Model.Orbital;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>Orbital forcing of the boxes and the model's response at the orbital periods.</summary>
public class OrbitalResponseTests
{
    private static double[] Insolation(TropicalBoxModel m)
    {
        var f = new double[ForcingChannel.Count];
        m.Forcing.At(0, f);
        return f[..Boxes.SurfaceCount];
    }

    [Fact]
    public void HigherObliquityRaisesExtratropicalAndLowersEquatorialAnnualInsolation()
    {
        // Orbital geometry (Berger 1978; common practice): annual-mean insolation falls with obliquity
        // equatorward of ≈ 44° and rises poleward of it; the ventilation boxes (35–60°) gain, the equatorial boxes lose.
        var low = Insolation(Build(orbit: new ConstantOrbit(new OrbitalElements(0.0167, 22.0, 102))));
        var high = Insolation(Build(orbit: new ConstantOrbit(new OrbitalElements(0.0167, 24.5, 102))));
        Assert.True(high[(int)Box.North] > low[(int)Box.North] + 0.3, $"north {low[2]:F3} → {high[2]:F3} W/m²");
        Assert.True(high[(int)Box.South] > low[(int)Box.South] + 0.3, $"south {low[3]:F3} → {high[3]:F3} W/m²");
        Assert.True(high[(int)Box.WarmPool] < low[(int)Box.WarmPool] - 2.0, $"warm pool {low[0]:F3} → {high[0]:F3} W/m²");
        Assert.True(high[(int)Box.ColdTongue] < low[(int)Box.ColdTongue] - 2.0, $"cold tongue {low[1]:F3} → {high[1]:F3} W/m²");
        // Annual means are symmetric between hemispheres (exact property of the geometry).
        Assert.Equal(high[(int)Box.North], high[(int)Box.South], 1e-9);
    }

    [Fact]
    public void ObliquityForcingGivesA41KyrSignal()
    {
        // Berger (1978) obliquity with e and ϖ held at present values: the dominant obliquity period is 41 kyr
        // (Berger 1978; Hays, Imbrie and Shackleton 1976). The run's zonal SST difference must peak there.
        var orbit = new IdealizedOrbit(Berger1978Orbit.Shared, fixedEccentricity: Present.Eccentricity, fixedPerihelionDeg: Present.PerihelionDeg);
        const double duration = 400000;
        var m = Build(orbit: orbit, startAgeKa: 400, durationYears: duration);
        var y0 = Equilibrium(Build());
        var sink = new RecordingSink();
        OdeSolver.Solve(m, 0, y0, duration, new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-8, MaxStep = 500, Output = OutputTimes.Uniform(500) }, sink);
        var t = sink.Times.ToArray();
        var dT = sink.States.Select(ZonalDifference).ToArray();
        var (period, amplitude) = Spectrum.DominantPeriod(t, dT, 15000, 120000, skipBefore: 20000);
        Assert.InRange(period, 38000, 44000);
        Assert.True(amplitude > 1e-3, $"amplitude {amplitude} K at {period} yr");
    }

    [Fact]
    public void PrecessionGivesA19To23KyrSignalThroughTheSeasonalCycle()
    {
        // Berger (1978) eccentricity and precession with obliquity fixed. Annual-mean insolation does not depend on
        // ϖ and is symmetric between hemispheres (exact geometry), so with annual-mean forcing the two ventilation
        // boxes stay identical; with the seasonal cycle the hemispheres answer precession with opposite phase
        // through the model's nonlinearity. The annual-mean north–south SST difference must peak at 19–23 kyr
        // (periods searched up to 40 kyr, shorter than the 50-kyr record).
        var orbit = new IdealizedOrbit(Berger1978Orbit.Shared, fixedObliquityDeg: Present.ObliquityDeg);
        const double duration = 50000;
        var y0 = Equilibrium(Build());
        (double[] T, double[] NorthMinusSouth) Run(bool seasonal)
        {
            var m = Build(o => o.Forcing.SeasonalCycle = seasonal, orbit: orbit, startAgeKa: 50, durationYears: duration);
            var sink = new BinnedAnnualMeans(binYears: 500, samplesPerYear: 12);
            OdeSolver.Solve(m, 0, y0, duration, new SolverOptions
            {
                Method = seasonal ? OdeMethod.DormandPrince54 : OdeMethod.Rodas4, RelativeTolerance = 1e-4, AbsoluteTolerance = 1e-6,
                Output = OutputTimes.Uniform(1.0 / 12),
            }, sink);
            return (sink.Times.ToArray(), sink.Means.Select(y => y[(int)Box.North] - y[(int)Box.South]).ToArray());
        }
        var (ts, seasonal) = Run(seasonal: true);
        var (period, amplitude) = Spectrum.DominantPeriod(ts, seasonal, 10000, 40000, skipBefore: 2000);
        Assert.InRange(period, 18500, 24000);
        Assert.True(amplitude > 5e-3, $"north–south amplitude {amplitude} K at {period} yr");
        var (_, annual) = Run(seasonal: false);
        Assert.True(annual.Max(Math.Abs) < 1e-9, $"with annual-mean forcing the hemispheres differ by {annual.Max(Math.Abs)} K");
    }

    /// <summary>Means of the state over consecutive bins of whole years (from output every 1/samplesPerYear years).</summary>
    private sealed class BinnedAnnualMeans(double binYears, int samplesPerYear) : IOutputSink
    {
        private double[]? _sum;
        private int _count;
        private readonly int _perBin = (int)Math.Round(binYears * samplesPerYear);
        public List<double> Times { get; } = [];
        public List<double[]> Means { get; } = [];

        public void Write(double t, ReadOnlySpan<double> y)
        {
            if (t == 0) return; // samples in (t − bin, t]
            _sum ??= new double[y.Length];
            for (int i = 0; i < y.Length; i++) _sum[i] += y[i];
            if (++_count < _perBin) return;
            Times.Add(t - 0.5 * binYears);
            Means.Add(_sum.Select(s => s / _count).ToArray());
            Array.Clear(_sum);
            _count = 0;
        }
    }
}

/// <summary>Least-squares sinusoid fits over a grid of periods (a Lomb–Scargle-type periodogram; Lomb 1976, Scargle 1982).</summary>
internal static class Spectrum
{
    /// <summary>The period (same unit as <paramref name="t"/>) in [min, max] whose fitted sinusoid (with mean and linear trend) has the largest amplitude.</summary>
    public static (double Period, double Amplitude) DominantPeriod(double[] t, double[] x, double minPeriod, double maxPeriod, double skipBefore = 0)
    {
        var keep = Enumerable.Range(0, t.Length).Where(i => t[i] >= skipBefore).ToArray();
        double best = 0, bestPeriod = double.NaN;
        for (double logP = Math.Log(minPeriod); logP <= Math.Log(maxPeriod); logP += 0.002)
        {
            double p = Math.Exp(logP);
            double a = Amplitude(keep.Select(i => t[i]).ToArray(), keep.Select(i => x[i]).ToArray(), p);
            if (a > best) { best = a; bestPeriod = p; }
        }
        return (bestPeriod, best);
    }

    /// <summary>Amplitude of the least-squares fit x ≈ a + b·t + c·cos(ωt) + d·sin(ωt), ω = 2π/period.</summary>
    public static double Amplitude(double[] t, double[] x, double period)
    {
        double w = 2 * Math.PI / period, t0 = t.Average();
        var m = new double[4, 4];
        var r = new double[4];
        for (int k = 0; k < t.Length; k++)
        {
            double[] f = [1, t[k] - t0, Math.Cos(w * t[k]), Math.Sin(w * t[k])];
            for (int i = 0; i < 4; i++)
            {
                r[i] += f[i] * x[k];
                for (int j = 0; j < 4; j++) m[i, j] += f[i] * f[j];
            }
        }
        var c = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(m).Solve(MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(r));
        return Math.Sqrt(c[2] * c[2] + c[3] * c[3]);
    }
}
