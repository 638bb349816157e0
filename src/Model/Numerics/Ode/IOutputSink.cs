namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// Receives the solution at the output times of a solve, in increasing time, as it is produced, so that the
/// solver keeps no trajectory in memory. The span is valid only during the call: copy what you keep.
/// </summary>
public interface IOutputSink
{
    /// <summary>One output row: time <paramref name="t"/> and state <paramref name="y"/>.</summary>
    void Write(double t, ReadOnlySpan<double> y);
}

/// <summary>An <see cref="IOutputSink"/> that keeps every row in memory (for tests, small runs and notebooks).</summary>
public sealed class RecordingSink : IOutputSink
{
    private readonly List<double> _times = [];
    private readonly List<double[]> _states = [];

    /// <summary>Output times, in order.</summary>
    public IReadOnlyList<double> Times => _times;

    /// <summary>States at <see cref="Times"/>.</summary>
    public IReadOnlyList<double[]> States => _states;

    /// <inheritdoc/>
    public void Write(double t, ReadOnlySpan<double> y)
    {
        _times.Add(t);
        _states.Add(y.ToArray());
    }
}
