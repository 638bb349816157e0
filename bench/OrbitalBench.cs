using Thermostrat.Model.Orbital;

namespace Thermostrat.Bench;

/// <summary>
/// Orbital elements and insolation: cost of one orbital-element evaluation, of one daily insolation value,
/// of the derived quantities, and of the full daily table 0–1000 ka × 181 latitudes × 365 days.
/// </summary>
public static class OrbitalBench
{
    public static void Run(BenchContext context)
    {
        var berger = Berger1978Orbit.Shared;
        var interpolated = new InterpolatedOrbit(berger, -1_000_000, 0, 100);
        OrbitalElements present = berger.At(0);
        double sink = 0;

        // ---- orbital elements
        const int elementCalls = 20_000;
        context.Report("Berger (1978) series, one evaluation", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < elementCalls; i++) sink += berger.At(-50.0 * i).Eccentricity;
        }, elementCalls), "ns");
        context.Report("InterpolatedOrbit (100-yr cubic spline), one evaluation", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < elementCalls; i++) sink += interpolated.At(-50.0 * i).Eccentricity;
        }, elementCalls), "ns");

        // ---- daily values
        var ev = new InsolationEvaluator(present);
        const int dailyCalls = 200_000;
        context.Report("daily mean, scalar by true longitude (checked)", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < dailyCalls; i++) sink += ev.DailyMean(-90.0 + (i % 181), (i * 0.37) % 360.0);
        }, dailyCalls), "ns");
        context.Report("daily mean, scalar by calendar day (Kepler each call)", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < dailyCalls; i++) sink += ev.DailyMeanOnDay(-90.0 + (i % 181), (i * 0.37) % 365.0);
        }, dailyCalls), "ns");

        var grid = DailyInsolationGrid.Standard();
        var table = new double[grid.Count];
        context.Report("daily mean, DailyInsolationGrid 181 × 365, per value", context.MedianNsPerOp(() =>
        {
            grid.Fill(present, table);
            sink += table[100];
        }, grid.Count, samples: 25), "ns", "< 50 ns");
        context.Report("DailyInsolationGrid.Fill, bytes allocated per epoch", BenchContext.AllocatedBytes(() => grid.Fill(present, table)), "B");
        context.Report("InsolationEvaluator construction (per epoch)", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 10_000; i++) sink += new InsolationEvaluator(present with { PerihelionDeg = i }).SolarConstantWm2;
        }, 10_000), "ns");

        // ---- derived quantities (per call)
        context.Report("AnnualMean at one latitude", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 200; i++) sink += Insolation.AnnualMean(present, -89.5 + i * 0.9);
        }, 200) / 1000, "µs");
        context.Report("BandAnnualMean 20°S–20°N", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 20; i++) sink += Insolation.BandAnnualMean(present, -20 - i * 0.1, 20);
        }, 20) / 1000, "µs");
        context.Report("BandDailyMean 20°S–20°N", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 200; i++) sink += Insolation.BandDailyMean(present, -20, 20, i * 1.8);
        }, 200) / 1000, "µs");
        context.Report("MonthlyMeans (calendar) at one latitude", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 20; i++) sink += Insolation.MonthlyMeans(present, 65 - i, MonthKind.Calendar)[6];
        }, 20) / 1000, "µs");
        context.Report("CaloricHalfYears at one latitude", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 10; i++) sink += Insolation.CaloricHalfYears(present, 65 - i).SummerMeanWm2;
        }, 10, samples: 7) / 1000, "µs");
        context.Report("IntegratedSummerEnergy (τ = 275 W/m²) at one latitude", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < 20; i++) sink += Insolation.IntegratedSummerEnergy(present, 65 - i, 275);
        }, 20) / 1000, "µs");
        var series = OrbitalForcingSeries.Create(interpolated, -1_000_000, 0, 250, "band", o => Insolation.BandAnnualMean(o, -5, 5));
        context.Report("OrbitalForcingSeries.ValueAt (precomputed band mean)", context.MedianNsPerOp(() =>
        {
            for (int i = 0; i < elementCalls; i++) sink += series.ValueAt(-50.0 * i);
        }, elementCalls), "ns");

        // ---- the full table: 0–1000 ka every 1 ka × 181 latitudes × 365 days (66.1 million values)
        int ages = context.Quick ? 101 : 1001;
        long values = (long)ages * grid.Count;
        var sums = new double[ages];
        void Epoch(int a, double[] buffer)
        {
            grid.Fill(berger.At(IOrbitSource.YearsFromAgeKa(a)), buffer);
            double s = 0;
            foreach (double q in buffer) s += q;
            sums[a] = s;
        }
        double serial = context.MedianSeconds(() =>
        {
            var buffer = new double[grid.Count];
            for (int a = 0; a < ages; a++) Epoch(a, buffer);
        }, samples: 5);
        double checksumSerial = sums.Sum();
        double parallel = context.MedianSeconds(() =>
        {
            Parallel.For(0, ages, () => new double[grid.Count], (a, _, buffer) => { Epoch(a, buffer); return buffer; }, _ => { });
        }, samples: 5);
        if (sums.Sum() != checksumSerial) throw new InvalidOperationException("parallel table differs from the serial table");
        string label = $"{ages} ages × 181 latitudes × 365 days ({values / 1e6:F1} M values)";
        context.Report($"full table, one core: {label}", serial, "s");
        context.Report($"full table, all {Environment.ProcessorCount} cores (Parallel.For over ages)", parallel, "s");
        context.Report("  per value, one core", serial * 1e9 / values, "ns", "< 50 ns");
        context.Report("  parallel speed-up", serial / parallel, "×", $"≈ {Environment.ProcessorCount} (near-linear)");
        context.Out.WriteLine($"  (checksum {checksumSerial:E6} W/m² summed; sink {sink:E3})");
    }
}
