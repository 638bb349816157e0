using System.Globalization;
using Thermostrat.Model.Orbital;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// Top-of-atmosphere insolation of several latitude bands, precomputed on an orbital time grid and
/// interpolated cheaply during integration: either the annual mean of each band, or its seasonal cycle as
/// a truncated Fourier series in the time of year whose coefficients are splined in time.
/// </summary>
/// <remarks>
/// <para>Annual mean: Q̄_b(t) from <see cref="Insolation.BandAnnualMean"/> at each node.</para>
/// <para>Seasonal: Q_b(t, x) = c0 + Σ_{k=1..K} [a_k cos 2πkx + b_k sin 2πkx], x = day of year / 365.2422 (day 0
/// at 00:00 on 1 January, <see cref="SolarCalendar"/>), with the coefficients of each node taken from
/// <see cref="Insolation.BandDailyMeanOnDay"/> sampled on 4K + 4 equally spaced days (the discrete Fourier
/// transform of a periodic function, exact for the kept harmonics up to aliasing of higher ones).</para>
/// <para>The orbital elements change on kyr scales, so nodes every few hundred years carry them exactly
/// enough; times outside the precomputed span take the values at its ends.</para>
/// </remarks>
public sealed class OrbitalInsolationForcing
{
    private readonly OrbitalForcingSeries _series;
    private readonly int _bands, _harmonics, _channels;
    private readonly int[] _channelOfBand;

    /// <summary>Precomputes the insolation of <paramref name="bands"/>.</summary>
    /// <param name="orbit">Orbit source (a fast interpolant is best: it is sampled at every node).</param>
    /// <param name="startYears">Start of the span, years relative to 1950.</param>
    /// <param name="endYears">End of the span, years relative to 1950 (after the start).</param>
    /// <param name="spacingYears">Grid spacing, years.</param>
    /// <param name="bands">Latitude bands (south, north edges in degrees).</param>
    /// <param name="seasonal">Resolve the seasonal cycle (else annual means).</param>
    /// <param name="harmonics">Harmonics K kept in the seasonal cycle (≥ 1).</param>
    /// <param name="solarConstantWm2">Solar constant S0.</param>
    /// <param name="parallel">Evaluate nodes in parallel.</param>
    public OrbitalInsolationForcing(IOrbitSource orbit, double startYears, double endYears, double spacingYears,
        IReadOnlyList<(double SouthDeg, double NorthDeg)> bands, bool seasonal, int harmonics, double solarConstantWm2, bool parallel = true)
    {
        ArgumentNullException.ThrowIfNull(bands);
        if (seasonal && harmonics < 1) throw new ArgumentOutOfRangeException(nameof(harmonics), harmonics, "At least one harmonic is needed for the seasonal cycle.");
        _bands = bands.Count;
        _harmonics = seasonal ? harmonics : 0;
        Seasonal = seasonal;
        // Annual means are symmetric between hemispheres (exact geometry): a band and its mirror image share one channel.
        _channelOfBand = new int[_bands];
        var unique = new List<(double SouthDeg, double NorthDeg)>();
        for (int b = 0; b < _bands; b++)
        {
            var (s, n) = bands[b];
            int found = unique.FindIndex(u => (u.SouthDeg == s && u.NorthDeg == n) || (!seasonal && u.SouthDeg == -n && u.NorthDeg == -s));
            if (found < 0) { unique.Add((s, n)); found = unique.Count - 1; }
            _channelOfBand[b] = found;
        }
        _channels = unique.Count;
        var bandArray = unique.ToArray();
        int perBand = 2 * _harmonics + 1;
        var names = new List<string>();
        foreach (var (s, n) in bandArray)
        {
            string band = string.Create(CultureInfo.InvariantCulture, $"{s}°..{n}°");
            if (!seasonal) names.Add($"annual-mean insolation {band}, W/m²");
            else
            {
                names.Add($"insolation {band}: mean, W/m²");
                for (int k = 1; k <= _harmonics; k++)
                {
                    names.Add(string.Create(CultureInfo.InvariantCulture, $"insolation {band}: cos {k}, W/m²"));
                    names.Add(string.Create(CultureInfo.InvariantCulture, $"insolation {band}: sin {k}, W/m²"));
                }
            }
        }
        int samples = 4 * _harmonics + 4;
        _series = new OrbitalForcingSeries(orbit, startYears, endYears, spacingYears, names, (o, d) =>
        {
            Span<double> q = stackalloc double[samples];
            for (int b = 0; b < bandArray.Length; b++)
            {
                var (south, north) = bandArray[b];
                if (!seasonal)
                {
                    d[b] = Insolation.BandAnnualMean(o, south, north, solarConstantWm2);
                    continue;
                }
                for (int j = 0; j < samples; j++)
                    q[j] = Insolation.BandDailyMeanOnDay(o, south, north, SolarCalendar.YearLengthDays * j / samples, solarConstantWm2);
                int c = b * perBand;
                double mean = 0;
                for (int j = 0; j < samples; j++) mean += q[j];
                d[c] = mean / samples;
                for (int k = 1; k <= _harmonics; k++)
                {
                    double ak = 0, bk = 0;
                    for (int j = 0; j < samples; j++)
                    {
                        (double sin, double cos) = Math.SinCos(2.0 * Math.PI * k * j / samples);
                        ak += q[j] * cos;
                        bk += q[j] * sin;
                    }
                    d[c + 2 * k - 1] = 2.0 * ak / samples;
                    d[c + 2 * k] = 2.0 * bk / samples;
                }
            }
        }, parallel);
    }

    /// <summary>True when the seasonal cycle is resolved.</summary>
    public bool Seasonal { get; }

    /// <summary>Start of the precomputed span (years relative to 1950).</summary>
    public double StartYears => _series.StartYears;

    /// <summary>End of the precomputed span (years relative to 1950).</summary>
    public double EndYears => _series.EndYears;

    /// <summary>Warnings of the orbit source for the span.</summary>
    public IReadOnlyList<string> Warnings => _series.Warnings;

    /// <summary>Insolation (W/m²) of every band at <paramref name="yearsSince1950"/> into <paramref name="destination"/>.</summary>
    public void At(double yearsSince1950, Span<double> destination)
    {
        double t = Math.Clamp(yearsSince1950, _series.StartYears, _series.EndYears);
        int perBand = 2 * _harmonics + 1;
        Span<double> c = stackalloc double[_channels * perBand];
        _series.ValuesAt(t, c);
        if (_harmonics == 0)
        {
            for (int b = 0; b < _bands; b++) destination[b] = c[_channelOfBand[b]];
            return;
        }
        double x = yearsSince1950 - Math.Floor(yearsSince1950);
        (double s1, double c1) = Math.SinCos(2.0 * Math.PI * x);
        for (int b = 0; b < _bands; b++)
        {
            int o = _channelOfBand[b] * perBand;
            double q = c[o], sk = 0.0, ck = 1.0;
            for (int k = 1; k <= _harmonics; k++)
            {
                // cos/sin of kθ by the angle-addition recurrence.
                double cNext = ck * c1 - sk * s1;
                sk = sk * c1 + ck * s1;
                ck = cNext;
                q += c[o + 2 * k - 1] * ck + c[o + 2 * k] * sk;
            }
            destination[b] = q;
        }
    }
}
