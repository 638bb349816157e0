namespace Thermostrat.Model.Seawater;

/// <summary>Creates equations of state by their configuration names.</summary>
public static class EquationsOfState
{
    /// <summary>Name of the linear equation of state (<see cref="LinearEquationOfState"/>).</summary>
    public const string LinearName = "linear";

    /// <summary>Name of the simplified nonlinear equation of state of Roquet et al. 2015 (<see cref="Roquet2015EquationOfState"/>).</summary>
    public const string Roquet2015Name = "roquet2015";

    /// <summary>Name of EOS-80 (<see cref="Eos80EquationOfState"/>).</summary>
    public const string Eos80Name = "eos80";

    /// <summary>Name of TEOS-10, the 75-term polynomial (<see cref="Teos10EquationOfState"/>).</summary>
    public const string Teos10Name = "teos10";

    /// <summary>The name used when a configuration names none.</summary>
    public const string DefaultName = Teos10Name;

    /// <summary>All accepted names, simplest first.</summary>
    public static IReadOnlyList<string> Names { get; } = [LinearName, Roquet2015Name, Eos80Name, Teos10Name];

    /// <summary>Creates the equation of state called <paramref name="name"/> (case-insensitive).</summary>
    /// <param name="name">One of <see cref="Names"/>.</param>
    /// <param name="linear">Coefficients for <c>"linear"</c>; ignored by the others; defaults as in <see cref="LinearEosParameters"/>.</param>
    /// <exception cref="ArgumentException">Unknown name; the message lists the allowed names.</exception>
    public static IEquationOfState Create(string name, LinearEosParameters? linear = null)
    {
        ArgumentNullException.ThrowIfNull(name);
        return name.Trim().ToLowerInvariant() switch
        {
            LinearName => new LinearEquationOfState(linear),
            Roquet2015Name => new Roquet2015EquationOfState(),
            Eos80Name => new Eos80EquationOfState(),
            Teos10Name => new Teos10EquationOfState(),
            _ => throw new ArgumentException(
                $"Unknown equation of state '{name}'; allowed: {string.Join(", ", Names)}.", nameof(name)),
        };
    }
}
