using System.Globalization;
using Thermostrat.Model.Orbital;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// Top-of-atmosphere insolation of several latitude bands, precomputed on an orbital time grid and
/// interpolated cheaply during integration: either the annual mean of each band, or its daily mean through
/// the seasonal cycle.
/// </summary>
/// <remarks>
/// <para>Annual mean: Q̄_b(t) from <see cref="Insolation.BandAnnualMean"/> at each node, not-a-knot cubic spline in
/// time. Annual means are symmetric between hemispheres, so a band and its mirror image share one channel.</para>
/// <para>Seasonal cycle: Q_b(t, x) from <see cref="Insolation.BandDailyMeanOnDay"/> on a table of M equally spaced
/// days x_j = j/M of the calendar year (day 0 at 00:00 on 1 January, <see cref="SolarCalendar"/>) at every node;
/// periodic Catmull–Rom cubic interpolation in the day (C¹, exact for cubics) and linear interpolation between
/// nodes (the elements change on kyr scales). A lookup costs a few tens of nanoseconds.</para>
/// <para>Times outside the precomputed span take the values at its ends.</para>
/// </remarks>
public sealed class OrbitalInsolationForcing
{
    private readonly OrbitalForcingSeries? _annual;
    private readonly double[]? _table;
    private readonly int _bands, _channels, _days, _intervals;
    private readonly int[] _channelOfBand;
    private readonly double _start, _end, _spacing;

    /// <summary>Precomputes the insolation of <paramref name="bands"/>.</summary>
    /// <param name="orbit">Orbit source (a fast interpolant is best: it is sampled at every node).</param>
    /// <param name="startYears">Start of the span, years relative to 1950.</param>
    /// <param name="endYears">End of the span, years relative to 1950 (after the start).</param>
    /// <param name="spacingYears">Largest grid spacing, years.</param>
    /// <param name="bands">Latitude bands (south, north edges in degrees).</param>
    /// <param name="seasonal">Resolve the seasonal cycle (else annual means).</param>
    /// <param name="daysPerYear">Table days M per year for the seasonal cycle (≥ 8).</param>
    /// <param name="solarConstantWm2">Solar constant S0.</param>
    /// <param name="parallel">Evaluate nodes in parallel.</param>
    public OrbitalInsolationForcing(IOrbitSource orbit, double startYears, double endYears, double spacingYears,
        IReadOnlyList<(double SouthDeg, double NorthDeg)> bands, bool seasonal, int daysPerYear, double solarConstantWm2, bool parallel = true)
    {
        ArgumentNullException.ThrowIfNull(orbit);
        ArgumentNullException.ThrowIfNull(bands);
        if (seasonal && daysPerYear < 8) throw new ArgumentOutOfRangeException(nameof(daysPerYear), daysPerYear, "The seasonal table needs at least 8 days per year.");
        if (!(endYears > startYears)) throw new ArgumentException($"endYears = {endYears} must be after startYears = {startYears}.", nameof(endYears));
        if (!(spacingYears > 0 && double.IsFinite(spacingYears))) throw new ArgumentOutOfRangeException(nameof(spacingYears), spacingYears, "The grid spacing must be a positive number of years.");
        Seasonal = seasonal;
        _bands = bands.Count;
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
        _start = startYears;
        _end = endYears;

        if (!seasonal)
        {
            var names = bandArray.Select(u => string.Create(CultureInfo.InvariantCulture, $"annual-mean insolation {u.SouthDeg}°..{u.NorthDeg}°, W/m²")).ToArray();
            _annual = new OrbitalForcingSeries(orbit, startYears, endYears, spacingYears, names, (o, d) =>
            {
                for (int c = 0; c < bandArray.Length; c++) d[c] = Insolation.BandAnnualMean(o, bandArray[c].SouthDeg, bandArray[c].NorthDeg, solarConstantWm2);
            }, parallel);
            Warnings = _annual.Warnings;
            _spacing = _annual.SpacingYears;
            return;
        }

        Warnings = orbit.CheckRange(startYears, endYears);
        _days = daysPerYear;
        _intervals = Math.Max(1, (int)Math.Ceiling((endYears - startYears) / spacingYears));
        _spacing = (endYears - startYears) / _intervals;
        var table = new double[(_intervals + 1) * _channels * _days];
        void Node(int k)
        {
            var o = orbit.At(k == _intervals ? endYears : startYears + k * _spacing);
            for (int c = 0; c < _channels; c++)
            {
                int row = (k * _channels + c) * _days;
                for (int j = 0; j < _days; j++)
                    table[row + j] = Insolation.BandDailyMeanOnDay(o, bandArray[c].SouthDeg, bandArray[c].NorthDeg, SolarCalendar.YearLengthDays * j / _days, solarConstantWm2);
            }
        }
        if (parallel) Parallel.For(0, _intervals + 1, Node);
        else for (int k = 0; k <= _intervals; k++) Node(k);
        _table = table;
    }

    /// <summary>True when the seasonal cycle is resolved.</summary>
    public bool Seasonal { get; }

    /// <summary>Start of the precomputed span (years relative to 1950).</summary>
    public double StartYears => _start;

    /// <summary>End of the precomputed span (years relative to 1950).</summary>
    public double EndYears => _end;

    /// <summary>Node spacing used (years).</summary>
    public double SpacingYears => _spacing;

    /// <summary>Warnings of the orbit source for the span.</summary>
    public IReadOnlyList<string> Warnings { get; }

    /// <summary>Insolation (W/m²) of every band at <paramref name="yearsSince1950"/> into <paramref name="destination"/>. Allocation-free.</summary>
    public void At(double yearsSince1950, Span<double> destination)
    {
        double t = Math.Clamp(yearsSince1950, _start, _end);
        if (_annual is not null)
        {
            Span<double> c = stackalloc double[_channels];
            _annual.ValuesAt(t, c);
            for (int b = 0; b < _bands; b++) destination[b] = c[_channelOfBand[b]];
            return;
        }
        var table = _table!;
        double nodes = (t - _start) / _spacing;
        int k = Math.Min((int)nodes, _intervals - 1);
        double v = nodes - k;
        double x = (yearsSince1950 - Math.Floor(yearsSince1950)) * _days;
        int j1 = Math.Min((int)x, _days - 1);
        double u = x - j1;
        int j0 = j1 == 0 ? _days - 1 : j1 - 1, j2 = j1 + 1 == _days ? 0 : j1 + 1, j3 = j2 + 1 == _days ? 0 : j2 + 1;
        // Catmull–Rom weights of P0 … P3 at u.
        double u2 = u * u, u3 = u2 * u;
        double w0 = 0.5 * (-u3 + 2 * u2 - u), w1 = 0.5 * (3 * u3 - 5 * u2 + 2), w2 = 0.5 * (-3 * u3 + 4 * u2 + u), w3 = 0.5 * (u3 - u2);
        for (int b = 0; b < _bands; b++)
        {
            int r0 = (k * _channels + _channelOfBand[b]) * _days, r1 = r0 + _channels * _days;
            double q0 = w0 * table[r0 + j0] + w1 * table[r0 + j1] + w2 * table[r0 + j2] + w3 * table[r0 + j3];
            double q1 = w0 * table[r1 + j0] + w1 * table[r1 + j1] + w2 * table[r1 + j2] + w3 * table[r1 + j3];
            destination[b] = q0 + v * (q1 - q0);
        }
    }
}
