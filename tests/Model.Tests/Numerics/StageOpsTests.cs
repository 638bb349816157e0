using Thermostrat.Model.Numerics;
using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

/// <summary>
/// The unrolled stage-combination kernels against the plain definition y_i + h Σ_j a_j K_j,i summed in stage order
/// (the order the kernels promise, so agreement is exact), for every term count the kernels specialise and beyond, with
/// component counts that exercise the vector part and the scalar tail.
/// </summary>
public sealed class StageOpsTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(7)]
    [InlineData(20)]
    [InlineData(23)]
    public void CombineEqualsThePlainSumInStageOrder(int n)
    {
        var rng = new Random(n);
        for (int count = 0; count <= 19; count++)
        {
            double h = 0.37;
            var a = Enumerable.Range(0, count).Select(_ => rng.NextDouble() - 0.5).ToArray();
            var k = Enumerable.Range(0, Math.Max(count, 1) * n).Select(_ => rng.NextDouble() * 10 - 5).ToArray();
            var y = Enumerable.Range(0, n).Select(_ => rng.NextDouble()).ToArray();
            var expected = new double[n];
            for (int i = 0; i < n; i++)
            {
                double acc = y[i];
                for (int j = 0; j < count; j++) acc += h * a[j] * k[j * n + i];
                expected[i] = acc;
            }
            var output = new double[n];
            StageOps.Combine(y, h, a, count, k, n, output);
            Assert.Equal(expected, output);
            // In place: output may be y.
            var inPlace = (double[])y.Clone();
            StageOps.Combine(inPlace, h, a, count, k, n, inPlace);
            Assert.Equal(expected, inPlace);
        }
    }

    [Theory]
    [InlineData(3)]
    [InlineData(20)]
    [InlineData(23)]
    public void ErrorNormEqualsTheWeightedRmsOfThePlainSum(int n)
    {
        // Hairer, Nørsett and Wanner I, Sect. II.4, eq. 4.11: √(1/n Σ (e_i / (atol_i + rtol·max(|y_i|, |ŷ_i|)))²).
        var rng = new Random(100 + n);
        for (int count = 1; count <= 12; count++)
        {
            double h = 0.01, rtol = 1e-6;
            var e = Enumerable.Range(0, count).Select(_ => rng.NextDouble() - 0.5).ToArray();
            var k = Enumerable.Range(0, count * n).Select(_ => rng.NextDouble() * 10 - 5).ToArray();
            var y = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 4 - 2).ToArray();
            var yNew = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 4 - 2).ToArray();
            var atol = Enumerable.Range(0, n).Select(_ => 1e-8 * (1 + rng.NextDouble())).ToArray();
            double sum = 0;
            for (int i = 0; i < n; i++)
            {
                double acc = 0;
                for (int j = 0; j < count; j++) acc += h * e[j] * k[j * n + i];
                double q = acc / (atol[i] + rtol * Math.Max(Math.Abs(y[i]), Math.Abs(yNew[i])));
                sum += q * q;
            }
            double expected = Math.Sqrt(sum / n);
            double actual = StageOps.ErrorNorm(h, e, count, k, n, y, yNew, atol, rtol, new double[n]);
            // The vector part sums the squares lane by lane: equal to rounding, not bit for bit.
            Assert.Equal(expected, actual, expected * 1e-13);
        }
    }
}
