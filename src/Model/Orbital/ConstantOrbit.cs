namespace Thermostrat.Model.Orbital;

/// <summary>An orbit whose elements never change: all of them held at chosen values (for building-block experiments).</summary>
public sealed class ConstantOrbit : IOrbitSource
{
    /// <param name="elements">The elements returned at every time (validated: 0 ≤ e &lt; 1, 0 ≤ ε ≤ 90°, ϖ finite; ϖ is reduced to [0, 360)).</param>
    public ConstantOrbit(OrbitalElements elements)
    {
        elements.Validate(nameof(elements));
        Elements = elements with { PerihelionDeg = Angles.Normalize360(elements.PerihelionDeg) };
    }

    /// <summary>The fixed elements.</summary>
    public OrbitalElements Elements { get; }

    /// <inheritdoc/>
    public string Description => $"constant orbit: {Elements}";

    /// <inheritdoc/>
    public OrbitalElements At(double yearsSince1950)
    {
        IOrbitSource.ValidateTime(yearsSince1950);
        return Elements;
    }

    /// <inheritdoc/>
    public IReadOnlyList<string> CheckRange(double tStartYears, double tEndYears)
    {
        IOrbitSource.ValidateSpan(tStartYears, tEndYears);
        return [];
    }
}
