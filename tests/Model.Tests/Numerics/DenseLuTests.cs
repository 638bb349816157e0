using MathNet.Numerics.LinearAlgebra;
using Thermostrat.Model.Numerics;
using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

public class DenseLuTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(7)]
    [InlineData(20)]
    [InlineData(65)]
    public void SolutionsMatchMathNetAndHaveSmallResiduals(int n)
    {
        // Reference library: MathNet.Numerics' dense LU (Matrix.LU().Solve). Random matrices without diagonal dominance, so pivoting is exercised.
        var rng = new Random(n);
        var a = new double[n * n];
        for (int i = 0; i < a.Length; i++) a[i] = rng.NextDouble() * 2 - 1;
        var b = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 2 - 1).ToArray();
        var reference = Matrix<double>.Build.DenseOfRowMajor(n, n, a).LU().Solve(Vector<double>.Build.DenseOfArray(b)).ToArray();

        var lu = (double[])a.Clone();
        var piv = new int[n];
        Assert.True(DenseLu.Factor(lu, n, piv));
        var x = (double[])b.Clone();
        DenseLu.Solve(lu, n, piv, x);

        // Column-major variant used by the Rosenbrock integrator: same system, transposed storage.
        var cm = new double[n * n];
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) cm[j * n + i] = a[i * n + j];
        var inv = new double[n];
        Assert.True(ColumnMajorLu.Factor(cm, n, piv, inv));
        var xc = (double[])b.Clone();
        ColumnMajorLu.Solve(cm, n, piv, inv, xc);

        double scale = reference.Max(Math.Abs);
        for (int i = 0; i < n; i++)
        {
            Assert.True(Math.Abs(x[i] - reference[i]) <= 1e-10 * scale, $"row-major x[{i}] = {x[i]}, MathNet {reference[i]}");
            Assert.True(Math.Abs(xc[i] - reference[i]) <= 1e-10 * scale, $"column-major x[{i}] = {xc[i]}, MathNet {reference[i]}");
        }
        // Exact property: the residual b − A x is at rounding level (backward stability of partial pivoting, Golub and Van Loan Sect. 3.4.6).
        for (int i = 0; i < n; i++)
        {
            double r = b[i];
            for (int j = 0; j < n; j++) r -= a[i * n + j] * x[j];
            Assert.True(Math.Abs(r) < 1e-12 * n * Math.Max(1, scale), $"residual[{i}] = {r}");
        }
    }

    [Fact]
    public void SingularMatrixIsReported()
    {
        double[] a = [1, 2, 3, 2, 4, 6, 1, 0, 1]; // row 2 = 2 × row 1
        var piv = new int[3];
        Assert.False(DenseLu.Factor(a, 3, piv));
        double[] c = [1, 2, 1, 2, 4, 0, 3, 6, 1]; // the same matrix column-major
        Assert.False(ColumnMajorLu.Factor(c, 3, piv, new double[3]));
    }

    [Fact]
    public void PermutationNeedsPivoting()
    {
        // A = [[0, 1], [1, 0]] has a zero leading entry: solvable only with a row exchange; A x = (2, 3) gives x = (3, 2).
        double[] a = [0, 1, 1, 0];
        var piv = new int[2];
        Assert.True(DenseLu.Factor(a, 2, piv));
        double[] x = [2, 3];
        DenseLu.Solve(a, 2, piv, x);
        Assert.Equal([3.0, 2.0], x);
    }

    [Fact]
    public void BadSizesAreRejected()
    {
        Assert.Throws<ArgumentException>(() => DenseLu.Factor(new double[3], 2, new int[2]));
        Assert.Throws<ArgumentException>(() => DenseLu.Factor(new double[4], 2, new int[1]));
        Assert.Throws<ArgumentOutOfRangeException>(() => DenseLu.Factor(new double[4], -1, new int[2]));
        Assert.Throws<ArgumentException>(() => DenseLu.Solve(new double[4], 2, new int[2], new double[1]));
    }
}
