using System.Numerics;
using MathNet.Numerics.IntegralTransforms;
using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>
/// Spectral content of the Berger (1978) elements over the last 1000 kyr, sampled every 1 kyr:
/// the dominant periods of Berger (1978) and Hays, Imbrie and Shackleton (1976, Science 194, 1121),
/// as listed in data/orbital/README.md and CHECK-VALUES.md (common knowledge of the trade).
/// Periodogram: mean removed, Hann window, zero-padded FFT (MathNet.Numerics), parabolic interpolation of
/// each local maximum; the same answer at two padding lengths shows it does not depend on the grid.
/// </summary>
public class SpectrumTests
{
    private static readonly (double[] Obliquity, double[] Precession, double[] Eccentricity) Series = Sample();

    private static (double[], double[], double[]) Sample()
    {
        int n = 1001;
        var obl = new double[n];
        var prec = new double[n];
        var ecc = new double[n];
        for (int i = 0; i < n; i++)
        {
            OrbitalElements o = Berger1978Orbit.Shared.At(IOrbitSource.YearsFromAgeKa(i));
            obl[i] = o.ObliquityDeg;
            prec[i] = o.ClimaticPrecession;
            ecc[i] = o.Eccentricity;
        }
        return (obl, prec, ecc);
    }

    /// <summary>Periods (kyr) of the <paramref name="count"/> largest local maxima of the periodogram, largest first.</summary>
    internal static double[] LargestPeaks(double[] x, int count, int paddedLength, double sampleKyr = 1.0)
    {
        double mean = x.Average();
        var buffer = new Complex[paddedLength];
        int n = x.Length;
        for (int i = 0; i < n; i++)
        {
            double hann = 0.5 - 0.5 * Math.Cos(2 * Math.PI * i / (n - 1));
            buffer[i] = new Complex((x[i] - mean) * hann, 0);
        }
        Fourier.Forward(buffer, FourierOptions.NoScaling);
        var power = new double[paddedLength / 2 + 1];
        for (int k = 0; k < power.Length; k++) power[k] = buffer[k].Magnitude * buffer[k].Magnitude;
        double df = 1.0 / (paddedLength * sampleKyr);
        var peaks = new List<(double Power, double Period)>();
        for (int k = 1; k < power.Length - 1; k++)
        {
            if (!(power[k] > power[k - 1] && power[k] >= power[k + 1])) continue;
            double a = power[k - 1], b = power[k], c = power[k + 1];
            double shift = 0.5 * (a - c) / (a - 2 * b + c);
            peaks.Add((b - 0.25 * (a - c) * shift, 1.0 / ((k + shift) * df)));
        }
        return peaks.OrderByDescending(p => p.Power).Take(count).Select(p => p.Period).ToArray();
    }

    [Theory]
    [InlineData(1 << 15)]
    [InlineData(1 << 17)]
    public void Obliquity_largest_peak_is_41_kyr(int padded)
    {
        double[] p = LargestPeaks(Series.Obliquity, 1, padded);
        Assert.InRange(p[0], 40.5, 41.5); // 41.0 ± 0.5 kyr (Berger 1978; Hays et al. 1976)
    }

    [Theory]
    [InlineData(1 << 15)]
    [InlineData(1 << 17)]
    public void Climatic_precession_three_largest_peaks_are_23_7_22_4_and_19_kyr(int padded)
    {
        double[] p = LargestPeaks(Series.Precession, 3, padded).Order().ToArray();
        // 19.0, 22.4 and 23.7 kyr ± 0.3 (Berger 1978: the 18 976, 22 428 and 23 716-year terms).
        Assert.InRange(p[0], 18.7, 19.3);
        Assert.InRange(p[1], 22.1, 22.7);
        Assert.InRange(p[2], 23.4, 24.0);
    }

    [Theory]
    [InlineData(1 << 15)]
    [InlineData(1 << 17)]
    public void Eccentricity_three_largest_peaks_are_near_95_125_and_410_kyr(int padded)
    {
        double[] p = LargestPeaks(Series.Eccentricity, 3, padded).Order().ToArray();
        // ~95, ~125 and ~410 kyr ± 5 % (Berger 1978: the 94 945, 123 297 and 412 885-year terms).
        Assert.InRange(p[0], 95 * 0.95, 95 * 1.05);
        Assert.InRange(p[1], 125 * 0.95, 125 * 1.05);
        Assert.InRange(p[2], 410 * 0.95, 410 * 1.05);
    }

    [Fact]
    public void Peak_periods_do_not_depend_on_the_padding()
    {
        double[] a = LargestPeaks(Series.Precession, 3, 1 << 15);
        double[] b = LargestPeaks(Series.Precession, 3, 1 << 17);
        for (int i = 0; i < 3; i++) Assert.Equal(a[i], b[i], 1e-2);
    }

    [Fact]
    public void Periodogram_finds_a_known_sinusoid()
    {
        // Self-check of the helper on an exact sinusoid of period 23.716 kyr.
        double[] x = Enumerable.Range(0, 1001).Select(i => Math.Sin(2 * Math.PI * i / 23.716)).ToArray();
        Assert.Equal(23.716, LargestPeaks(x, 1, 1 << 16)[0], 0.02);
    }
}
