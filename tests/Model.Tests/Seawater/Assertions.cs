using System.Globalization;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

internal static class Assertions
{
    /// <summary>Asserts |actual − expected| &lt; tolerance for every case; the failure message shows the worst case and the count.</summary>
    public static void AllWithin(string what, IEnumerable<(string Where, double Expected, double Actual)> cases, Func<double, double> tolerance)
    {
        var list = cases.ToList();
        Assert.NotEmpty(list);
        var failures = list.Where(c => !(Math.Abs(c.Actual - c.Expected) < tolerance(c.Expected))).ToList();
        if (failures.Count == 0) return;
        var worst = failures.MaxBy(c => Math.Abs(c.Actual - c.Expected) / tolerance(c.Expected));
        Assert.Fail(string.Create(CultureInfo.InvariantCulture,
            $"{what}: {failures.Count} of {list.Count} outside tolerance; worst at {worst.Where}: expected {worst.Expected:R}, got {worst.Actual:R}, " +
            $"difference {worst.Actual - worst.Expected:E3}, tolerance {tolerance(worst.Expected):E3}"));
    }

    public static void AllWithin(string what, IEnumerable<(string Where, double Expected, double Actual)> cases, double tolerance) =>
        AllWithin(what, cases, _ => tolerance);
}
