using System.Buffers;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// A fixed grid of latitudes × days of the year on which daily-mean insolation is filled for one epoch at a
/// time: latitude terms are precomputed once, day terms (true longitude by Kepler's equation, declination,
/// distance factor) once per epoch, so each value costs one arccosine, one square root and a few products.
/// </summary>
/// <remarks>Immutable and safe to share between threads (e.g. <c>Parallel.For</c> over ages, each thread with its own destination).</remarks>
public sealed class DailyInsolationGrid
{
    private readonly double[] _latitudesDeg;
    private readonly double[] _days;
    private readonly double[] _sinLat;
    private readonly double[] _cosLat;

    /// <param name="latitudesDeg">Latitudes in degrees, each in [−90, 90] (any order).</param>
    /// <param name="daysOfYear">Days of the year, each in [0, 365.2422] (from 0 at 00:00 on 1 January; see <see cref="SolarCalendar"/>).</param>
    public DailyInsolationGrid(IReadOnlyList<double> latitudesDeg, IReadOnlyList<double> daysOfYear)
    {
        ArgumentNullException.ThrowIfNull(latitudesDeg);
        ArgumentNullException.ThrowIfNull(daysOfYear);
        if (latitudesDeg.Count == 0) throw new ArgumentException("latitudesDeg is empty; give at least one latitude.", nameof(latitudesDeg));
        if (daysOfYear.Count == 0) throw new ArgumentException("daysOfYear is empty; give at least one day.", nameof(daysOfYear));
        _latitudesDeg = [.. latitudesDeg];
        _days = [.. daysOfYear];
        _sinLat = new double[_latitudesDeg.Length];
        _cosLat = new double[_latitudesDeg.Length];
        for (int i = 0; i < _latitudesDeg.Length; i++)
        {
            Insolation.ValidateLatitude(_latitudesDeg[i], $"latitudesDeg[{i}]");
            (_sinLat[i], _cosLat[i]) = LatitudeTrig.FromDegrees(_latitudesDeg[i]);
        }
        for (int j = 0; j < _days.Length; j++) SolarCalendar.ValidateDay(_days[j], $"daysOfYear[{j}]");
    }

    /// <summary>
    /// The standard grid: 181 latitudes from −90° to 90° every 1°, and 365 days at the midpoints of day numbers
    /// 1…365 (days of the year 0.5, 1.5, …, 364.5).
    /// </summary>
    public static DailyInsolationGrid Standard() =>
        new(Enumerable.Range(0, 181).Select(i => -90.0 + i).ToArray(), Enumerable.Range(0, 365).Select(j => j + 0.5).ToArray());

    /// <summary>Latitudes of the grid, degrees.</summary>
    public IReadOnlyList<double> LatitudesDeg => _latitudesDeg;

    /// <summary>Days of the year of the grid.</summary>
    public IReadOnlyList<double> DaysOfYear => _days;

    /// <summary>Number of values per epoch: latitudes × days.</summary>
    public int Count => _latitudesDeg.Length * _days.Length;

    /// <summary>
    /// Fills <paramref name="destination"/> (length ≥ <see cref="Count"/>) with daily-mean insolation in W/m²
    /// for <paramref name="elements"/>, latitude-major: value [i·days + j] is latitude i on day j.
    /// </summary>
    public void Fill(in OrbitalElements elements, Span<double> destination, double solarConstantWm2 = Insolation.DefaultSolarConstantWm2)
    {
        if (destination.Length < Count)
            throw new ArgumentException($"destination has length {destination.Length}; the grid needs {Count} ({_latitudesDeg.Length} latitudes × {_days.Length} days).", nameof(destination));
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        int nDays = _days.Length;
        double[]? rented = null;
        Span<double> work = nDays <= 512 ? stackalloc double[3 * 512] : (rented = ArrayPool<double>.Shared.Rent(3 * nDays));
        Span<double> sinDelta = work[..nDays], cosDelta = work.Slice(nDays, nDays), scale = work.Slice(2 * nDays, nDays);
        try
        {
            for (int j = 0; j < nDays; j++)
            {
                double lambda = ev.TrueLongitudeRad(_days[j]);
                sinDelta[j] = ev.SinObliquity * Math.Sin(lambda);
                cosDelta[j] = Math.Sqrt(1.0 - sinDelta[j] * sinDelta[j]);
                scale[j] = ev.DistanceScaleRad(lambda);
            }
            for (int i = 0; i < _latitudesDeg.Length; i++)
            {
                double sinLat = _sinLat[i], cosLat = _cosLat[i];
                Span<double> row = destination.Slice(i * nDays, nDays);
                for (int j = 0; j < row.Length; j++)
                    row[j] = scale[j] * InsolationEvaluator.DailyGeometry(sinLat, cosLat, sinDelta[j], cosDelta[j]);
            }
        }
        finally
        {
            if (rented is not null) ArrayPool<double>.Shared.Return(rented);
        }
    }
}
