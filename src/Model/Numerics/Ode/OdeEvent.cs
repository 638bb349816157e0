namespace Thermostrat.Model.Numerics.Ode;

/// <summary>An event function g(t, y): an event occurs where g changes sign. Must not allocate.</summary>
public delegate double EventFunction(double t, ReadOnlySpan<double> y);

/// <summary>Which sign changes of g count as an event.</summary>
public enum EventDirection
{
    /// <summary>Both directions.</summary>
    Either,
    /// <summary>g goes from negative to non-negative.</summary>
    Rising,
    /// <summary>g goes from positive to non-positive.</summary>
    Falling,
}

/// <summary>
/// A user event: the solver evaluates <see cref="Function"/> at the end of every accepted step and, where its sign
/// changes in the requested <see cref="Direction"/>, locates the crossing on the step's dense output by the
/// Illinois method (modified regula falsi; Dowell and Jarratt 1971, BIT 11, 168) to within
/// <see cref="SolverOptions.EventTimeTolerance"/>. A crossing leaves g = 0 exactly at a step end only once:
/// leaving zero is not a new event.
/// </summary>
public sealed class OdeEvent
{
    /// <summary>A name for reports.</summary>
    public required string Name { get; init; }

    /// <summary>g(t, y).</summary>
    public required EventFunction Function { get; init; }

    /// <summary>Which sign changes count (default both).</summary>
    public EventDirection Direction { get; init; } = EventDirection.Either;

    /// <summary>When true the solve stops at the first occurrence; otherwise occurrences are recorded and the solve goes on.</summary>
    public bool Terminal { get; init; }
}

/// <summary>One located event.</summary>
/// <param name="EventIndex">Index of the event in the list given to the solver.</param>
/// <param name="Name">The event's name.</param>
/// <param name="Time">Crossing time.</param>
/// <param name="Rising">True if g rose through zero, false if it fell.</param>
/// <param name="State">State at <paramref name="Time"/> (from dense output).</param>
public sealed record EventOccurrence(int EventIndex, string Name, double Time, bool Rising, double[] State);
