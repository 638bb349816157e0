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
    /// <summary>The definition the kernels must reproduce bit for bit: y_i + Σ_j (h a_j) K_j,i added in stage order.</summary>
    private static double[] PlainSum(double[] y, double h, double[] a, int count, double[] k, int n)
    {
        var sum = new double[n];
        for (int i = 0; i < n; i++)
        {
            double acc = y[i];
            for (int j = 0; j < count; j++) acc += h * a[j] * k[j * n + i];
            sum[i] = acc;
        }
        return sum;
    }

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
            var expected = PlainSum(y, h, a, count, k, n);
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
    [InlineData(1)]
    [InlineData(5)]
    [InlineData(20)]
    [InlineData(23)]
    public void SizedCombineEqualsThePlainSumInStageOrder(int n)
    {
        // The stepper's unchecked pass (1 to 8 terms) must give the same bits as the checked one and the plain loop.
        var rng = new Random(50 + n);
        for (int count = 1; count <= StageOps.MaxSizedTerms; count++)
        {
            double h = 0.29;
            var a = Enumerable.Range(0, count).Select(_ => rng.NextDouble() - 0.5).ToArray();
            var k = Enumerable.Range(0, count * n).Select(_ => rng.NextDouble() * 10 - 5).ToArray();
            var y = Enumerable.Range(0, n).Select(_ => rng.NextDouble()).ToArray();
            var expected = PlainSum(y, h, a, count, k, n);
            var output = new double[n];
            StageOps.CombineSized(ref y[0], h, a, count, ref k[0], n, ref output[0]);
            Assert.Equal(expected, output);
        }
    }

    [Theory]
    [InlineData(3)]
    [InlineData(20)]
    [InlineData(23)]
    public void ErrorMeanSquareIsNaNWhenTheNewStateOverflowsFromFiniteStages(int n)
    {
        // Finite stages can still sum to ±∞ in ŷ; its scale atol + rtol·|ŷ| is then ∞ and the quotient 0, which must not pass
        // for a small error: the norm is NaN, so the stepper looks for the non-finite component (IEEE 754: ∞ − ∞ is NaN).
        // Two stages take the fused pass, ten the scratch vector and the separate norm.
        foreach (int count in new[] { 2, 10 })
        {
            var e = Enumerable.Range(0, count).Select(j => j % 2 == 0 ? 0.1 : -0.1).ToArray();
            var k = Enumerable.Range(0, count * n).Select(i => 1.0 + i % 3).ToArray();
            var y = Enumerable.Repeat(1.0, n).ToArray();
            var atol = Enumerable.Repeat(1e-8, n).ToArray();
            foreach (int bad in new[] { 0, n - 1 })
            {
                var yNew = Enumerable.Repeat(1.0, n).ToArray();
                double finite = StageOps.ErrorMeanSquare(0.01, e, count, k, n, y, yNew, atol, 1e-6, new double[n]);
                Assert.True(double.IsFinite(finite));
                yNew[bad] = double.PositiveInfinity;
                Assert.True(double.IsNaN(StageOps.ErrorMeanSquare(0.01, e, count, k, n, y, yNew, atol, 1e-6, new double[n])), $"{count} stages, ∞ at [{bad}]");
                yNew[bad] = double.NaN;
                Assert.True(double.IsNaN(StageOps.ErrorMeanSquare(0.01, e, count, k, n, y, yNew, atol, 1e-6, new double[n])), $"{count} stages, NaN at [{bad}]");
            }
        }
    }

    [Theory]
    [InlineData(3)]
    [InlineData(20)]
    [InlineData(23)]
    public void ErrorMeanSquareEqualsTheSquaredWeightedRmsOfThePlainSum(int n)
    {
        // Hairer, Nørsett and Wanner I, Sect. II.4, eq. 4.11: √(1/n Σ (e_i / (atol_i + rtol·max(|y_i|, |ŷ_i|)))²), squared.
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
            double expected = sum / n; // the square of the norm: the steppers hand err² to the controller
            double actual = StageOps.ErrorMeanSquare(h, e, count, k, n, y, yNew, atol, rtol, new double[n]);
            // The vector part sums the squares lane by lane: equal to rounding, not bit for bit.
            Assert.Equal(expected, actual, expected * 1e-13);
        }
    }
}
