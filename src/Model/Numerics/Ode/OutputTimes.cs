namespace Thermostrat.Model.Numerics.Ode;

/// <summary>When <see cref="OdeSolver"/> writes the solution to its <see cref="IOutputSink"/>.</summary>
public enum OutputMode
{
    /// <summary>At the initial time and at the end of every accepted step.</summary>
    EveryStep,
    /// <summary>At t0, t0 + Δ, t0 + 2Δ, ... ≤ tEnd (computed as t0 + kΔ, without accumulated rounding), from dense output.</summary>
    Uniform,
    /// <summary>At the listed times (ascending, within [t0, tEnd]), from dense output.</summary>
    List,
    /// <summary>Only the final state is written (at tEnd or at a terminal event).</summary>
    FinalOnly,
}

/// <summary>The output schedule of a solve: every step, a uniform grid, a list of times, or the final state only.</summary>
public sealed class OutputTimes
{
    private OutputTimes(OutputMode mode, double interval, double[] times)
    {
        Mode = mode;
        Interval = interval;
        _times = times;
    }

    private readonly double[] _times;

    /// <summary>The schedule's kind.</summary>
    public OutputMode Mode { get; }

    /// <summary>The grid spacing Δ for <see cref="OutputMode.Uniform"/> (time units); NaN otherwise.</summary>
    public double Interval { get; }

    /// <summary>The listed times for <see cref="OutputMode.List"/>; empty otherwise.</summary>
    public IReadOnlyList<double> Times => _times;

    /// <summary>Write t0 and every accepted step.</summary>
    public static OutputTimes EveryStep { get; } = new(OutputMode.EveryStep, double.NaN, []);

    /// <summary>Write only the final state.</summary>
    public static OutputTimes FinalOnly { get; } = new(OutputMode.FinalOnly, double.NaN, []);

    /// <summary>Write at t0 + kΔ for k = 0, 1, ... while ≤ tEnd.</summary>
    /// <param name="interval">Δ &gt; 0, time units.</param>
    public static OutputTimes Uniform(double interval)
    {
        if (!(interval > 0) || !double.IsFinite(interval))
            throw new ArgumentOutOfRangeException(nameof(interval), interval, "The output interval must be a positive finite time.");
        return new(OutputMode.Uniform, interval, []);
    }

    /// <summary>Write at the given times, which must be finite and strictly ascending (checked against [t0, tEnd] at solve time).</summary>
    public static OutputTimes At(IEnumerable<double> times)
    {
        ArgumentNullException.ThrowIfNull(times);
        double[] t = times.ToArray();
        for (int i = 0; i < t.Length; i++)
        {
            if (!double.IsFinite(t[i]))
                throw new ArgumentException($"Output time [{i}] = {t[i]} is not finite.", nameof(times));
            if (i > 0 && !(t[i] > t[i - 1]))
                throw new ArgumentException($"Output times must be strictly ascending; [{i - 1}] = {t[i - 1]:R} is followed by [{i}] = {t[i]:R}.", nameof(times));
        }
        return new(OutputMode.List, double.NaN, t);
    }

    internal double[] ListedTimes => _times;

    /// <inheritdoc/>
    public override string ToString() => Mode switch
    {
        OutputMode.Uniform => $"Uniform({Interval:R})",
        OutputMode.List => $"List({_times.Length} times)",
        _ => Mode.ToString(),
    };
}
