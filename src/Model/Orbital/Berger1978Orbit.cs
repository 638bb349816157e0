using System.Globalization;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// Orbital elements from the trigonometric series of Berger (1978), "Long-term variations of daily
/// insolation and Quaternary climatic changes", J. Atmos. Sci. 35, 2362–2367, Tables 1, 4 and 5,
/// embedded in the library (Data/Orbital, with its source note README.md).
/// </summary>
/// <remarks>
/// <para>With t in years relative to 1950 and each term's argument arg = rate·t + phase:</para>
/// <list type="bullet">
/// <item>obliquity ε = 23.320556° + Σ A cos(arg) (47 terms, A in arcsec);</item>
/// <item>e·sin π = Σ M sin(arg), e·cos π = Σ M cos(arg) (19 terms), e = hypot, π = atan2;</item>
/// <item>general precession ψ = 50.439273″·t + 3.392506° + Σ F sin(arg) (78 terms, F in arcsec);</item>
/// <item>longitude of perihelion from the moving vernal equinox ϖ = π + ψ (mod 360°).</item>
/// </list>
/// <para>The series is valid for about ±1 Myr around the present (<see cref="ValidityLimitYears"/>):
/// <see cref="CheckRange"/> warns beyond it. Beyond ±5 Myr (<see cref="HardLimitYears"/>) both
/// <see cref="At"/> and <see cref="CheckRange"/> throw unless <see cref="AllowBeyondFiveMyr"/> is set;
/// import a tabulated long solution (<see cref="TabulatedOrbit"/>) for such ages.</para>
/// <para>One evaluation costs about 150 sines and cosines (see bench/OrbitalBench.cs); wrap the
/// series in an <see cref="InterpolatedOrbit"/> for long forced runs.</para>
/// </remarks>
public sealed class Berger1978Orbit : IOrbitSource
{
    /// <summary>Half-width (years) of the range around 1950 in which the series is considered valid: 1 Myr.</summary>
    public const double ValidityLimitYears = 1.0e6;

    /// <summary>Half-width (years) beyond which the series is refused unless <see cref="AllowBeyondFiveMyr"/> is set: 5 Myr.</summary>
    public const double HardLimitYears = 5.0e6;

    // Constant terms of the series (Berger 1978; the README in Data/Orbital).
    private const double ObliquityConstantDeg = 23.320556;
    private const double PrecessionRateArcsecPerYear = 50.439273;
    private const double PrecessionConstantDeg = 3.392506;

    private static readonly SeriesSet Series = SeriesSet.LoadEmbedded();

    /// <summary>The shared instance with the ±5 Myr limit enforced.</summary>
    public static Berger1978Orbit Shared { get; } = new();

    /// <summary>Creates the source (the coefficient tables are loaded once per process and shared).</summary>
    public Berger1978Orbit() { }

    /// <summary>Loads the embedded series; the same as <c>new Berger1978Orbit { AllowBeyondFiveMyr = … }</c>.</summary>
    public static Berger1978Orbit Load(bool allowBeyondFiveMyr = false) => new() { AllowBeyondFiveMyr = allowBeyondFiveMyr };

    /// <summary>
    /// When true, times beyond ±5 Myr are evaluated (with a warning from <see cref="CheckRange"/>)
    /// instead of refused. Default false.
    /// </summary>
    public bool AllowBeyondFiveMyr { get; init; }

    /// <summary>Number of terms in the obliquity, eccentricity and precession series (47, 19, 78).</summary>
    public static (int Obliquity, int Eccentricity, int Precession) TermCounts =>
        (Series.Obliquity.Length, Series.Eccentricity.Length, Series.Precession.Length);

    /// <inheritdoc/>
    public string Description => AllowBeyondFiveMyr
        ? "Berger (1978) trigonometric series, J. Atmos. Sci. 35, 2362 (embedded; use beyond ±5 Myr allowed)"
        : "Berger (1978) trigonometric series, J. Atmos. Sci. 35, 2362 (embedded)";

    /// <inheritdoc/>
    public OrbitalElements At(double yearsSince1950)
    {
        IOrbitSource.ValidateTime(yearsSince1950);
        if (!AllowBeyondFiveMyr && Math.Abs(yearsSince1950) > HardLimitYears)
            throw BeyondHardLimit(nameof(yearsSince1950), yearsSince1950);

        double t = yearsSince1950;
        double obliquity = ObliquityConstantDeg + Series.SumCos(Series.Obliquity, t) / 3600.0;
        Series.SumSinCos(Series.Eccentricity, t, out double eSinPi, out double eCosPi);
        double psiDeg = PrecessionRateArcsecPerYear * t / 3600.0 + PrecessionConstantDeg + Series.SumSin(Series.Precession, t) / 3600.0;
        double e = Math.Sqrt(eSinPi * eSinPi + eCosPi * eCosPi);
        double piDeg = Math.Atan2(eSinPi, eCosPi) * Angles.RadToDeg;
        return new OrbitalElements(e, obliquity, Angles.Normalize360(piDeg + psiDeg));
    }

    /// <inheritdoc/>
    public IReadOnlyList<string> CheckRange(double tStartYears, double tEndYears)
    {
        IOrbitSource.ValidateSpan(tStartYears, tEndYears);
        double worst = Math.Abs(tStartYears) >= Math.Abs(tEndYears) ? tStartYears : tEndYears;
        double reach = Math.Abs(worst);
        if (reach > HardLimitYears && !AllowBeyondFiveMyr)
            throw BeyondHardLimit(Math.Abs(tStartYears) >= Math.Abs(tEndYears) ? nameof(tStartYears) : nameof(tEndYears), worst);
        if (reach > ValidityLimitYears)
            return [string.Create(CultureInfo.InvariantCulture,
                $"The Berger (1978) series is used out to t = {worst:0} years (age {IOrbitSource.AgeKaFromYears(worst):0.###} ka), beyond its ±1 Myr (±1000 ka) range of validity; its accuracy degrades there. Import a tabulated long solution for such ages.")];
        return [];
    }

    private static ArgumentOutOfRangeException BeyondHardLimit(string parameter, double t) =>
        new(parameter, t, string.Create(CultureInfo.InvariantCulture,
            $"{parameter} = {t:0} years (age {IOrbitSource.AgeKaFromYears(t):0.###} ka) is beyond ±5 Myr (±5000 ka), where the Berger (1978) series is refused; its validity is about ±1 Myr. Import a tabulated long solution, or set AllowBeyondFiveMyr = true to use the series anyway."));

    /// <summary>One term: amplitude, angular rate (rad/yr) and phase (rad).</summary>
    private readonly record struct Term(double Amplitude, double RateRadPerYear, double PhaseRad);

    /// <summary>The three coefficient tables, immutable once loaded.</summary>
    private sealed class SeriesSet
    {
        public required Term[] Obliquity { get; init; }
        public required Term[] Eccentricity { get; init; }
        public required Term[] Precession { get; init; }

        public double SumCos(Term[] terms, double t)
        {
            double s = 0;
            foreach (ref readonly Term k in terms.AsSpan()) s += k.Amplitude * Math.Cos(k.RateRadPerYear * t + k.PhaseRad);
            return s;
        }

        public double SumSin(Term[] terms, double t)
        {
            double s = 0;
            foreach (ref readonly Term k in terms.AsSpan()) s += k.Amplitude * Math.Sin(k.RateRadPerYear * t + k.PhaseRad);
            return s;
        }

        public void SumSinCos(Term[] terms, double t, out double sinSum, out double cosSum)
        {
            double ss = 0, cs = 0;
            foreach (ref readonly Term k in terms.AsSpan())
            {
                (double sin, double cos) = Math.SinCos(k.RateRadPerYear * t + k.PhaseRad);
                ss += k.Amplitude * sin;
                cs += k.Amplitude * cos;
            }
            sinSum = ss;
            cosSum = cs;
        }

        public static SeriesSet LoadEmbedded() => new()
        {
            Obliquity = LoadTable("berger1978_obliquity.csv", "amplitude_arcsec", expectedTerms: 47),
            Eccentricity = LoadTable("berger1978_eccentricity.csv", "amplitude", expectedTerms: 19),
            Precession = LoadTable("berger1978_precession.csv", "amplitude_arcsec", expectedTerms: 78),
        };

        private static Term[] LoadTable(string fileName, string amplitudeColumn, int expectedTerms)
        {
            string resource = $"Thermostrat.Model.Data.Orbital.{fileName}";
            using Stream stream = typeof(Berger1978Orbit).Assembly.GetManifestResourceStream(resource)
                ?? throw new InvalidOperationException($"The embedded resource '{resource}' is missing from the Thermostrat.Model assembly; the build must embed Data/Orbital/*.csv.");
            using var reader = new StreamReader(stream);
            NumericCsv table = NumericCsv.Parse(reader, resource);
            int a = table.Column(amplitudeColumn), r = table.Column("rate_arcsec_per_yr"), p = table.Column("phase_deg");
            if (table.Rows.Count != expectedTerms)
                throw new InvalidOperationException($"{resource}: {table.Rows.Count} terms, expected {expectedTerms} (Berger 1978).");
            var terms = new Term[table.Rows.Count];
            for (int i = 0; i < terms.Length; i++)
            {
                double[] row = table.Rows[i];
                if (!double.IsFinite(row[a]) || !double.IsFinite(row[r]) || !double.IsFinite(row[p]))
                    throw new InvalidOperationException($"{resource}, line {table.LineNumbers[i]}: non-finite coefficient.");
                terms[i] = new Term(row[a], row[r] * Angles.ArcsecToRad, row[p] * Angles.DegToRad);
            }
            return terms;
        }
    }
}
