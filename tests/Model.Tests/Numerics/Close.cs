using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

/// <summary>Element-wise absolute-tolerance comparison of arrays with the failing index in the message.</summary>
internal static class Close
{
    public static void All(IReadOnlyList<double> expected, IReadOnlyList<double> actual, double tolerance)
    {
        Assert.Equal(expected.Count, actual.Count);
        for (int i = 0; i < expected.Count; i++)
            Assert.True(Math.Abs(expected[i] - actual[i]) <= tolerance, $"[{i}]: expected {expected[i]:R}, got {actual[i]:R} (tolerance {tolerance})");
    }
}
