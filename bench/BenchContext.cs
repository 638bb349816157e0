using System.Diagnostics;
using System.Runtime.InteropServices;

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

    /// <summary>
    /// Steady-state cost of <paramref name="action"/> (which performs <paramref name="operationsPerCall"/> operations): runs it
    /// for at least <paramref name="warmSeconds"/> and 40 calls first, so that tiered compilation (with its profile-guided
    /// tier) has finished with every method it calls, then times <paramref name="samples"/> calls. Returns the least thread
    /// CPU time per operation (the cost on an undisturbed core; wall time where thread CPU time is not available) and the
    /// median wall time per operation.
    /// </summary>
    public (double BestNs, double MedianNs) SteadyNsPerOp(Action action, long operationsPerCall, double warmSeconds = 0.4, int samples = 31)
    {
        if (Quick) { samples = Math.Min(samples, 7); warmSeconds = Math.Min(warmSeconds, 0.2); }
        var sw = Stopwatch.StartNew();
        for (int i = 0; i < 40 || sw.Elapsed.TotalSeconds < warmSeconds; i++)
        {
            action();
            if (sw.Elapsed.TotalSeconds > 10 * warmSeconds && i >= 40) break;
        }
        var wall = new double[samples];
        double best = double.PositiveInfinity;
        for (int i = 0; i < samples; i++)
        {
            long cpu0 = ThreadCpu.Available ? ThreadCpu.NowNs() : 0;
            long start = Stopwatch.GetTimestamp();
            action();
            wall[i] = Stopwatch.GetElapsedTime(start).TotalNanoseconds / operationsPerCall;
            double cpu = ThreadCpu.Available ? (ThreadCpu.NowNs() - cpu0) / (double)operationsPerCall : wall[i];
            best = Math.Min(best, cpu);
        }
        Array.Sort(wall);
        return (best, wall[samples / 2]);
    }

    /// <summary>Prints one result row.</summary>
    public void Report(string what, double value, string unit, string? target = null) =>
        Out.WriteLine(target is null ? $"  {what,-60} {value,12:G4} {unit}" : $"  {what,-60} {value,12:G4} {unit}   (target {target})");

    /// <summary>This thread's CPU time from <c>clock_gettime(CLOCK_THREAD_CPUTIME_ID)</c> (Linux).</summary>
    public static class ThreadCpu
    {
        private const int ClockThreadCpuTimeId = 3;

        [StructLayout(LayoutKind.Sequential)]
        private struct Timespec
        {
            public long Seconds;
            public long Nanoseconds;
        }

        [DllImport("libc", EntryPoint = "clock_gettime")]
        private static extern int ClockGetTime(int clockId, out Timespec time);

        public static bool Available { get; } = OperatingSystem.IsLinux() && Probe();

        private static bool Probe()
        {
            try { return ClockGetTime(ClockThreadCpuTimeId, out _) == 0; }
            catch (DllNotFoundException) { return false; }
            catch (EntryPointNotFoundException) { return false; }
        }

        public static long NowNs()
        {
            ClockGetTime(ClockThreadCpuTimeId, out Timespec t);
            return t.Seconds * 1_000_000_000L + t.Nanoseconds;
        }
    }
}
