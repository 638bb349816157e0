using System.Globalization;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// A fast stand-in for an expensive orbit source over a fixed span: the base source is sampled once on a
/// uniform grid and e·sin ϖ, e·cos ϖ and ε are interpolated by not-a-knot cubic splines (ϖ itself is never
/// interpolated across its wrap). Orbital elements vary on kyr scales, so a spacing of 100 years reproduces
/// the Berger (1978) series to about 1e-9 in e·sin ϖ; one evaluation then costs a few nanoseconds.
/// </summary>
/// <remarks>Times outside [<see cref="StartYears"/>, <see cref="EndYears"/>] are refused, never extrapolated.
/// When e = 0 the interpolated ϖ is reported as 0 (it has no effect then).</remarks>
public sealed class InterpolatedOrbit : IOrbitSource
{
    /// <summary>Relative slack allowed at the ends of the span for rounding in the caller's time arithmetic.</summary>
    private const double EndSlack = 1e-12;

    private readonly CubicSpline _spline;
    private readonly double _slack;

    /// <param name="baseOrbit">The source to sample (its <see cref="IOrbitSource.CheckRange"/> is applied to the span; its warnings are kept in <see cref="Warnings"/>).</param>
    /// <param name="tStartYears">Start of the span, years relative to 1950 (negative = past).</param>
    /// <param name="tEndYears">End of the span, years relative to 1950; must exceed <paramref name="tStartYears"/>.</param>
    /// <param name="spacingYears">Largest grid spacing in years, positive (100 is ample for orbital elements); the grid has at least 4 nodes.</param>
    public InterpolatedOrbit(IOrbitSource baseOrbit, double tStartYears, double tEndYears, double spacingYears)
    {
        ArgumentNullException.ThrowIfNull(baseOrbit);
        IOrbitSource.ValidateSpan(tStartYears, tEndYears);
        if (!(tEndYears > tStartYears))
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"tEndYears = {tEndYears:R} must be after tStartYears = {tStartYears:R} for an interpolated orbit."), nameof(tEndYears));
        if (!(spacingYears > 0.0 && double.IsFinite(spacingYears)))
            throw new ArgumentOutOfRangeException(nameof(spacingYears), spacingYears, string.Create(CultureInfo.InvariantCulture, $"spacingYears = {spacingYears:R} is not allowed; the grid spacing must be a positive finite number of years (100 is ample for orbital elements)."));
        Warnings = baseOrbit.CheckRange(tStartYears, tEndYears);
        BaseOrbit = baseOrbit;
        StartYears = tStartYears;
        EndYears = tEndYears;
        int intervals = Math.Max(3, (int)Math.Ceiling((tEndYears - tStartYears) / spacingYears));
        SpacingYears = (tEndYears - tStartYears) / intervals;
        var t = new double[intervals + 1];
        var eSin = new double[intervals + 1];
        var eCos = new double[intervals + 1];
        var obliquity = new double[intervals + 1];
        for (int k = 0; k <= intervals; k++)
        {
            t[k] = k == intervals ? tEndYears : tStartYears + k * SpacingYears;
            OrbitalElements o = baseOrbit.At(t[k]);
            eSin[k] = o.ClimaticPrecession;
            eCos[k] = o.EccentricityCosPerihelion;
            obliquity[k] = o.ObliquityDeg;
        }
        _spline = new CubicSpline(t, [eSin, eCos, obliquity]);
        _slack = EndSlack * Math.Max(1.0, Math.Max(Math.Abs(tStartYears), Math.Abs(tEndYears)));
    }

    /// <summary>The sampled source.</summary>
    public IOrbitSource BaseOrbit { get; }

    /// <summary>Start of the span (years relative to 1950).</summary>
    public double StartYears { get; }

    /// <summary>End of the span (years relative to 1950).</summary>
    public double EndYears { get; }

    /// <summary>The grid spacing actually used (years), at most the requested spacing.</summary>
    public double SpacingYears { get; }

    /// <summary>Warnings the base source gave for the span (e.g. the Berger series beyond ±1 Myr).</summary>
    public IReadOnlyList<string> Warnings { get; }

    /// <inheritdoc/>
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{BaseOrbit.Description}, cubic-spline interpolated every {SpacingYears:0.###} years over t = {StartYears:0.###} to {EndYears:0.###} years");

    /// <inheritdoc/>
    public OrbitalElements At(double yearsSince1950)
    {
        if (!(yearsSince1950 >= StartYears - _slack && yearsSince1950 <= EndYears + _slack))
            throw OutOfSpan(yearsSince1950);
        _spline.Evaluate3(yearsSince1950, out double eSin, out double eCos, out double obliquity);
        return OrbitalElements.FromComponents(eSin, eCos, obliquity);
    }

    /// <inheritdoc/>
    public IReadOnlyList<string> CheckRange(double tStartYears, double tEndYears)
    {
        IOrbitSource.ValidateSpan(tStartYears, tEndYears);
        if (tStartYears < StartYears - _slack) throw OutOfSpan(tStartYears, nameof(tStartYears));
        if (tEndYears > EndYears + _slack) throw OutOfSpan(tEndYears, nameof(tEndYears));
        return Warnings;
    }

    private ArgumentOutOfRangeException OutOfSpan(double t, string parameter = "yearsSince1950") =>
        new(parameter, t, string.Create(CultureInfo.InvariantCulture,
            $"{parameter} = {t:R} years is outside the interpolated span [{StartYears:R}, {EndYears:R}] years (ages {IOrbitSource.AgeKaFromYears(EndYears):0.###} to {IOrbitSource.AgeKaFromYears(StartYears):0.###} ka); build the InterpolatedOrbit over the whole run."));
}
