using System.Globalization;
using System.Runtime.ExceptionServices;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// Precomputed orbital forcing for long runs: one or more quantities that depend only on the orbital
/// elements (e.g. the annual-mean insolation of each box's latitude band) evaluated once on a uniform time
/// grid and interpolated by not-a-knot cubic splines, so that a model pays a few nanoseconds per
/// evaluation instead of a quadrature. Orbital elements vary on kyr scales: a spacing of 100–500 years
/// resolves even climatic precession (periods ≥ 19 kyr).
/// </summary>
/// <remarks>Times outside the span are refused, never extrapolated. The series is immutable and thread-safe.</remarks>
public sealed class OrbitalForcingSeries
{
    private readonly CubicSpline _spline;
    private readonly double _slack;
    private readonly int _channels;

    /// <summary>Builds a multi-channel series.</summary>
    /// <param name="orbit">Orbit source (its <see cref="IOrbitSource.CheckRange"/> is applied; warnings land in <see cref="Warnings"/>).</param>
    /// <param name="tStartYears">Start of the span, years relative to 1950 (negative = past).</param>
    /// <param name="tEndYears">End of the span, years relative to 1950, after the start.</param>
    /// <param name="spacingYears">Largest grid spacing, years, positive.</param>
    /// <param name="channelNames">One name per quantity (e.g. "box W annual-mean insolation, W/m²").</param>
    /// <param name="quantities">Writes the quantities for one set of elements into the span (length = number of channels). Called from several threads when <paramref name="parallel"/> is true, so it must be thread-safe.</param>
    /// <param name="parallel">Evaluate grid nodes in parallel (results do not depend on it).</param>
    public OrbitalForcingSeries(IOrbitSource orbit, double tStartYears, double tEndYears, double spacingYears,
        IReadOnlyList<string> channelNames, QuantityWriter quantities, bool parallel = true)
    {
        ArgumentNullException.ThrowIfNull(orbit);
        ArgumentNullException.ThrowIfNull(channelNames);
        ArgumentNullException.ThrowIfNull(quantities);
        IOrbitSource.ValidateSpan(tStartYears, tEndYears);
        if (!(tEndYears > tStartYears))
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"tEndYears = {tEndYears:R} must be after tStartYears = {tStartYears:R}."), nameof(tEndYears));
        if (!(spacingYears > 0.0 && double.IsFinite(spacingYears)))
            throw new ArgumentOutOfRangeException(nameof(spacingYears), spacingYears, string.Create(CultureInfo.InvariantCulture, $"spacingYears = {spacingYears:R} is not allowed; the grid spacing must be a positive finite number of years."));
        if (channelNames.Count == 0) throw new ArgumentException("channelNames is empty; give one name per quantity.", nameof(channelNames));

        Warnings = orbit.CheckRange(tStartYears, tEndYears);
        Orbit = orbit;
        ChannelNames = [.. channelNames];
        StartYears = tStartYears;
        EndYears = tEndYears;
        int intervals = Math.Max(3, (int)Math.Ceiling((tEndYears - tStartYears) / spacingYears));
        SpacingYears = (tEndYears - tStartYears) / intervals;
        int channels = channelNames.Count;
        var t = new double[intervals + 1];
        var values = new double[channels][];
        for (int c = 0; c < channels; c++) values[c] = new double[intervals + 1];
        for (int k = 0; k <= intervals; k++) t[k] = k == intervals ? tEndYears : tStartYears + k * SpacingYears;

        void Node(int k)
        {
            Span<double> row = stackalloc double[channels];
            row.Fill(double.NaN);
            quantities(orbit.At(t[k]), row);
            for (int c = 0; c < channels; c++)
            {
                if (!double.IsFinite(row[c]))
                    throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                        $"The forcing quantity '{ChannelNames[c]}' is {row[c]} at t = {t[k]:R} years; quantities must be finite (was every channel written?)."));
                values[c][k] = row[c];
            }
        }
        if (parallel)
        {
            try
            {
                Parallel.For(0, intervals + 1, Node);
            }
            catch (AggregateException ex) when (ex.InnerExceptions.Count > 0)
            {
                // Report the first failure as the sequential loop would, not wrapped.
                ExceptionDispatchInfo.Capture(ex.InnerExceptions[0]).Throw();
            }
        }
        else
        {
            for (int k = 0; k <= intervals; k++) Node(k);
        }

        _spline = new CubicSpline(t, values);
        _channels = channels;
        _slack = 1e-12 * Math.Max(1.0, Math.Max(Math.Abs(tStartYears), Math.Abs(tEndYears)));
    }

    /// <summary>Writes quantities that depend only on the orbital elements into <paramref name="destination"/>.</summary>
    public delegate void QuantityWriter(OrbitalElements elements, Span<double> destination);

    /// <summary>A single-quantity series, e.g. <c>o =&gt; Insolation.BandAnnualMean(o, -5, 5)</c>.</summary>
    public static OrbitalForcingSeries Create(IOrbitSource orbit, double tStartYears, double tEndYears, double spacingYears,
        string name, Func<OrbitalElements, double> quantity, bool parallel = true)
    {
        ArgumentNullException.ThrowIfNull(quantity);
        return new OrbitalForcingSeries(orbit, tStartYears, tEndYears, spacingYears, [name], (o, d) => d[0] = quantity(o), parallel);
    }

    /// <summary>The orbit the series was computed from.</summary>
    public IOrbitSource Orbit { get; }

    /// <summary>Names of the quantities, one per channel.</summary>
    public IReadOnlyList<string> ChannelNames { get; }

    /// <summary>Start of the span (years relative to 1950).</summary>
    public double StartYears { get; }

    /// <summary>End of the span (years relative to 1950).</summary>
    public double EndYears { get; }

    /// <summary>Grid spacing used (years), at most the requested spacing.</summary>
    public double SpacingYears { get; }

    /// <summary>Warnings from the orbit source for the span.</summary>
    public IReadOnlyList<string> Warnings { get; }

    /// <summary>Value of channel <paramref name="channel"/> at <paramref name="yearsSince1950"/>.</summary>
    public double ValueAt(double yearsSince1950, int channel = 0)
    {
        CheckTime(yearsSince1950);
        if ((uint)channel >= (uint)_channels)
            throw new ArgumentOutOfRangeException(nameof(channel), channel, $"channel = {channel} is not allowed; this series has channels 0 to {_channels - 1}.");
        return _spline.Evaluate(yearsSince1950, channel);
    }

    /// <summary>Values of all channels at <paramref name="yearsSince1950"/> into <paramref name="destination"/> (length ≥ channels).</summary>
    public void ValuesAt(double yearsSince1950, Span<double> destination)
    {
        CheckTime(yearsSince1950);
        if (destination.Length < _channels)
            throw new ArgumentException($"destination has length {destination.Length}; this series has {_channels} channels.", nameof(destination));
        _spline.Evaluate(yearsSince1950, destination);
    }

    private void CheckTime(double t)
    {
        if (!(t >= StartYears - _slack && t <= EndYears + _slack))
            throw new ArgumentOutOfRangeException("yearsSince1950", t, string.Create(CultureInfo.InvariantCulture,
                $"yearsSince1950 = {t:R} is outside the forcing series span [{StartYears:R}, {EndYears:R}] years; build the series over the whole run."));
    }
}
