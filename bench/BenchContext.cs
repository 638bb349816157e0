using System.Diagnostics;

namespace Thermostrat.Bench;

/// <summary>Shared timing harness: warm-up, repeated samples, median.</summary>
public sealed class BenchContext(TextWriter output, bool quick)
{
    /// <summary>Where results are printed.</summary>
    public TextWriter Out { get; } = output;

    /// <summary>Fewer repetitions (for a smoke run); numbers are then less stable.</summary>
    public bool Quick { get; } = quick;

    /// <summary>
    /// Times <paramref name="action"/>, which performs <paramref name="operationsPerCall"/> operations,
    /// after a warm-up; returns the median over samples of nanoseconds per operation.
    /// </summary>
    public double MedianNsPerOp(Action action, long operationsPerCall, int samples = 15)
    {
        if (Quick) samples = Math.Min(samples, 5);
        for (int i = 0; i < 3; i++) action(); // warm-up: JIT tiers, caches
        var ns = new double[samples];
        for (int i = 0; i < samples; i++)
        {
            long start = Stopwatch.GetTimestamp();
            action();
            ns[i] = Stopwatch.GetElapsedTime(start).TotalNanoseconds / operationsPerCall;
        }
        Array.Sort(ns);
        return ns[samples / 2];
    }

    /// <summary>Median wall time in seconds of <paramref name="action"/> over a few samples after one warm-up.</summary>
    public double MedianSeconds(Action action, int samples = 5)
    {
        if (Quick) samples = Math.Min(samples, 3);
        action();
        var s = new double[samples];
        for (int i = 0; i < samples; i++)
        {
            long start = Stopwatch.GetTimestamp();
            action();
            s[i] = Stopwatch.GetElapsedTime(start).TotalSeconds;
        }
        Array.Sort(s);
        return s[samples / 2];
    }

    /// <summary>Bytes allocated on this thread by <paramref name="action"/> (after one warm-up call).</summary>
    public static long AllocatedBytes(Action action)
    {
        action();
        long before = GC.GetAllocatedBytesForCurrentThread();
        action();
        return GC.GetAllocatedBytesForCurrentThread() - before;
    }

    /// <summary>Prints one result row.</summary>
    public void Report(string what, double value, string unit, string? target = null) =>
        Out.WriteLine(target is null ? $"  {what,-60} {value,12:G4} {unit}" : $"  {what,-60} {value,12:G4} {unit}   (target {target})");
}
