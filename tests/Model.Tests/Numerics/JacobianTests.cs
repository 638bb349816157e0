using Thermostrat.Model.Numerics;
using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

public class JacobianTests
{
    [Fact]
    public void DualJacobianEqualsHandDerivedJacobian()
    {
        // Reference: the Jacobian differentiated by hand (MixedFunctionsSystem.AnalyticJacobian).
        var system = new MixedFunctionsSystem();
        double t = 0.37;
        double[] y = [0.4, -1.3, 0.8, 2.2];
        var jac = new double[16];
        var f = new double[4];
        AutoJacobian.OfState(system, t, y, jac, f);
        double[] expected = MixedFunctionsSystem.AnalyticJacobian(t, y);
        for (int k = 0; k < 16; k++)
            Assert.True(Math.Abs(expected[k] - jac[k]) <= 1e-12 * Math.Max(1, Math.Abs(expected[k])), $"J[{k / 4},{k % 4}]: {jac[k]} vs {expected[k]}");
        var fExpected = new double[4];
        system.Evaluate<double>(t, y, fExpected);
        Assert.Equal(fExpected, f);
    }

    [Fact]
    public void DualJacobianOfRobertsonEqualsAnalytic()
    {
        // Robertson's Jacobian by hand (Hairer and Wanner II, Sect. IV.1, from eq. 1.4).
        var system = new RobertsonSystem();
        double[] y = [0.7, 3e-5, 0.3];
        var jac = new double[9];
        var f = new double[3];
        AutoJacobian.OfState(system, 0, y, jac, f);
        double[] expected = RobertsonSystem.AnalyticJacobian(y);
        for (int k = 0; k < 9; k++)
            Assert.True(Math.Abs(expected[k] - jac[k]) <= 1e-12 * Math.Max(1, Math.Abs(expected[k])), $"J[{k}]: {jac[k]} vs {expected[k]}");
    }

    [Fact]
    public void AutomaticAndFiniteDifferenceJacobiansAgree()
    {
        // Central differences have error O(h²) + O(ε/h) ≈ 1e-10 relative with h = ε^(1/3) (Dennis and Schnabel, Sect. 5.6).
        var system = new MixedFunctionsSystem();
        double[] y = [0.4, -1.3, 0.8, 2.2];
        var ad = new double[16];
        var fd = new double[16];
        var f1 = new double[4];
        var f2 = new double[4];
        AutoJacobian.OfState(system, 1.1, y, ad, f1);
        FiniteDifferenceJacobian.OfState(system, 1.1, y, fd, f2);
        for (int k = 0; k < 16; k++)
            Assert.True(Math.Abs(ad[k] - fd[k]) <= 1e-8 * Math.Max(1, Math.Abs(ad[k])), $"J[{k}]: AD {ad[k]} vs FD {fd[k]}");
        Assert.Equal(f1, f2);
    }

    [Fact]
    public void ParametricJacobiansMatchHandDerivatives()
    {
        // Lotka–Volterra by hand: J = [[p0 − p1 y1, −p1 y0], [p1 y1, p1 y0 − p2]]; ∂f/∂p0 = (y0, 0), ∂f/∂p1 = (−y0 y1, y0 y1), ∂f/∂p2 = (0, −y1).
        var system = new LotkaVolterraSystem();
        double[] y = [1.7, 0.6];
        double[] p = [0.9, 0.3, 1.4];
        var jac = new double[4];
        var f = new double[2];
        AutoJacobian.OfState(system, 0, y, p, jac, f);
        Close.All(new[] { 0.9 - 0.3 * 0.6, -0.3 * 1.7, 0.3 * 0.6, 0.3 * 1.7 - 1.4 }, jac, 1e-15);
        Close.All(new[] { 0.9 * 1.7 - 0.3 * 1.7 * 0.6, 0.3 * 1.7 * 0.6 - 1.4 * 0.6 }, f, 1e-15);

        var fdJac = new double[4];
        FiniteDifferenceJacobian.OfState(system, 0, y, p, fdJac, f);
        Close.All(jac, fdJac, 1e-9);

        var dfdp = new double[2];
        AutoJacobian.OfParameter(system, 0, y, p, 0, dfdp);
        Close.All(new[] { 1.7, 0.0 }, dfdp, 1e-15);
        AutoJacobian.OfParameter(system, 0, y, p, 1, dfdp);
        Close.All(new[] { -1.7 * 0.6, 1.7 * 0.6 }, dfdp, 1e-15);
        AutoJacobian.OfParameter(system, 0, y, p, 2, dfdp);
        Close.All(new[] { 0.0, -0.6 }, dfdp, 1e-15);
    }

    [Theory]
    [InlineData(5)]
    [InlineData(100)] // above the stack limit: pooled work arrays
    public void LinearSystemJacobianIsItsMatrix(int n)
    {
        // Exact property: the Jacobian of f = A y is A, for AD exactly; for central differences exactly up to rounding.
        var rng = new Random(12345);
        var a = new double[n * n];
        for (int k = 0; k < a.Length; k++) a[k] = rng.NextDouble() * 2 - 1;
        var system = new LinearSystem(n, a);
        var y = new double[n];
        for (int k = 0; k < n; k++) y[k] = rng.NextDouble();
        var jac = new double[n * n];
        var f = new double[n];
        AutoJacobian.OfState(system, 0, y, jac, f);
        Assert.Equal(a, jac);
        FiniteDifferenceJacobian.OfState(system, 0, y, jac, f);
        Close.All(a, jac, 1e-9);
    }

    [Fact]
    public void BadBuffersAreRejectedWithTheirNames()
    {
        var system = new RobertsonSystem();
        var ex = Assert.Throws<ArgumentException>(() => AutoJacobian.OfState(system, 0, new double[3], new double[8], new double[3]));
        Assert.Equal("jacobianRowMajor", ex.ParamName);
        Assert.Contains("9", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => FiniteDifferenceJacobian.OfState(system, 0, new double[2], new double[9], new double[3]));
        Assert.Equal("y", ex.ParamName);
        var lv = new LotkaVolterraSystem();
        var oor = Assert.Throws<ArgumentOutOfRangeException>(() => AutoJacobian.OfParameter(lv, 0, new double[2], new double[3], 3, new double[2]));
        Assert.Equal("parameterIndex", oor.ParamName);
    }

    [Fact]
    public void JacobianDoesNotAllocate()
    {
        var system = new MixedFunctionsSystem();
        double[] y = [0.4, -1.3, 0.8, 2.2];
        var jac = new double[16];
        var f = new double[4];
        AutoJacobian.OfState(system, 0, y, jac, f);
        FiniteDifferenceJacobian.OfState(system, 0, y, jac, f);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 10; i++)
        {
            AutoJacobian.OfState(system, 0, y, jac, f);
            FiniteDifferenceJacobian.OfState(system, 0, y, jac, f);
        }
        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
    }
}
