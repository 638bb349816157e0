using System.Numerics;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Numerics.Ode;
using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

public class OdeFailureTests
{
    /// <summary>y' = −1 − √y: y reaches 0 at a finite time and √ of the negative trial states is NaN.</summary>
    private sealed class SqrtDomainSystem : IOdeSystem
    {
        public int Dimension => 2;
        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
        {
            dydt[0] = -T.One;
            dydt[1] = -T.One - T.Sqrt(y[1]);
        }
    }

    /// <summary>y' = y²: y = 1/(1 − t) from y(0) = 1 blows up at t = 1 (closed form).</summary>
    private sealed class BlowUpSystem : IOdeSystem
    {
        public int Dimension => 1;
        public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> => dydt[0] = y[0] * y[0];
    }

    [Theory]
    [InlineData(OdeMethod.DormandPrince54)]
    [InlineData(OdeMethod.Rodas4)]
    public void NonFiniteStateIsDiagnosedWithVariableTimeAndLastGoodState(OdeMethod method)
    {
        // y1' = −1 − √y1 from y1(0) = 1 reaches 0 before t = 1 (y1' ≤ −1); beyond, √y1 of a negative trial state is NaN.
        var ex = Assert.Throws<OdeSolverException>(() => OdeSolver.Solve(new SqrtDomainSystem(), 0, [0, 1], 5, new SolverOptions { Method = method }));
        Assert.Equal(OdeFailureKind.NonFiniteState, ex.Kind);
        Assert.Equal(1, ex.VariableIndex);
        Assert.InRange(ex.LastGoodTime, 0.6, 0.62); // y1 hits 0 at t = 2 − 2 ln 2 ≈ 0.6137 (separation of variables with u = √y1)
        Assert.True(ex.LastGoodState[1] >= 0 && ex.LastGoodState[1] < 1e-3, $"last good y1 = {ex.LastGoodState[1]}");
        Assert.Equal(-ex.LastGoodTime, ex.LastGoodState[0], 1e-9);
        Assert.Contains("[1]", ex.Message);
        Assert.Contains("non-finite", ex.Message);
        Assert.True(ex.Statistics.RejectedSteps > 0);
    }

    [Fact]
    public void FixedStepNonFiniteFailsAtOnce()
    {
        var ex = Assert.Throws<OdeSolverException>(() => OdeSolver.Solve(new SqrtDomainSystem(), 0, [0, 1], 5, new SolverOptions { Method = OdeMethod.RungeKutta4, FixedStep = 0.1 }));
        Assert.Equal(OdeFailureKind.NonFiniteState, ex.Kind);
        Assert.Equal(1, ex.VariableIndex);
        Assert.Equal(0, ex.Statistics.RejectedSteps - 1);
    }

    [Fact]
    public void NonFiniteDerivativeAtTheStartIsReported()
    {
        var ex = Assert.Throws<OdeSolverException>(() => OdeSolver.Solve(new SqrtDomainSystem(), 0, [0, -1], 1, new SolverOptions()));
        Assert.Equal(OdeFailureKind.NonFiniteState, ex.Kind);
        Assert.Equal(1, ex.VariableIndex);
        Assert.Equal(0.0, ex.LastGoodTime);
    }

    [Theory]
    [InlineData(OdeMethod.DormandPrince54)]
    [InlineData(OdeMethod.Rodas4)]
    public void BlowUpEndsInStepSizeUnderflowNearTheSingularity(OdeMethod method)
    {
        // y = 1/(1 − t): the step size must shrink to nothing as t → 1 (a step may land just past the pole, where relative error
        // control on a huge |y| cannot see it; the failure is still diagnosed within 1e-3 of t = 1).
        var ex = Assert.Throws<OdeSolverException>(() => OdeSolver.Solve(new BlowUpSystem(), 0, [1], 2, new SolverOptions { Method = method }));
        Assert.True(ex.Kind is OdeFailureKind.StepSizeUnderflow or OdeFailureKind.NonFiniteState, ex.Kind.ToString());
        Assert.InRange(ex.LastGoodTime, 0.999, 1.001);
        Assert.True(ex.LastGoodState[0] > 1e3);
    }

    [Fact]
    public void TooManyStepsIsReportedWithTheStiffnessHint()
    {
        var ex = Assert.Throws<OdeSolverException>(() => OdeSolver.Solve(new ProtheroRobinsonSystem(-1e6), 0, [0], 10,
            new SolverOptions { Method = OdeMethod.DormandPrince54, MaxSteps = 200 }));
        Assert.Equal(OdeFailureKind.TooManySteps, ex.Kind);
        Assert.Equal(200, ex.Statistics.AcceptedSteps + ex.Statistics.RejectedSteps);
        Assert.Contains("MaxSteps = 200", ex.Message);
        Assert.Contains("stiff", ex.Message);
    }

    // ------------------------------------------------------------------ bad input

    [Fact]
    public void BadArgumentsAreRejectedWithTheirNames()
    {
        var sys = new DecaySystem(1);
        Assert.Equal("tEnd", Assert.Throws<ArgumentOutOfRangeException>(() => OdeSolver.Solve(sys, 1, [1], 1, new SolverOptions())).ParamName);
        Assert.Equal("y0", Assert.Throws<ArgumentException>(() => OdeSolver.Solve(sys, 0, [1, 2], 1, new SolverOptions())).ParamName);
        var nan = Assert.Throws<ArgumentException>(() => OdeSolver.Solve(sys, 0, [double.NaN], 1, new SolverOptions()));
        Assert.Contains("[0]", nan.Message);
        Assert.Equal("t0", Assert.Throws<ArgumentOutOfRangeException>(() => OdeSolver.Solve(sys, double.NaN, [1], 1, new SolverOptions())).ParamName);
        Assert.Equal("parameters", Assert.Throws<ArgumentException>(() => OdeSolver.Solve(new LotkaVolterraSystem(), [1.0], 0, [1, 1], 1, new SolverOptions())).ParamName);
    }

    public static TheoryData<SolverOptions, string> BadOptions => new()
    {
        { new SolverOptions { RelativeTolerance = 0 }, "RelativeTolerance" },
        { new SolverOptions { RelativeTolerance = 1 }, "RelativeTolerance" },
        { new SolverOptions { RelativeTolerance = 1e-16 }, "RelativeTolerance" },
        { new SolverOptions { AbsoluteTolerance = -1 }, "AbsoluteTolerance" },
        { new SolverOptions { AbsoluteTolerances = [1e-6, 1e-6] }, "AbsoluteTolerances" },
        { new SolverOptions { AbsoluteTolerances = [0.0] }, "AbsoluteTolerances" },
        { new SolverOptions { InitialStep = -0.1 }, "InitialStep" },
        { new SolverOptions { MaxStep = 0 }, "MaxStep" },
        { new SolverOptions { MaxSteps = 0 }, "MaxSteps" },
        { new SolverOptions { FixedStep = double.NaN, Method = OdeMethod.RungeKutta4 }, "FixedStep" },
        { new SolverOptions { Method = OdeMethod.RungeKutta4 }, "FixedStep" },
        { new SolverOptions { Method = OdeMethod.Auto, FixedStep = 0.1 }, "FixedStep" },
        { new SolverOptions { Method = OdeMethod.EulerMaruyama, FixedStep = 0.1 }, "Noise" },
        { new SolverOptions { Method = (OdeMethod)99 }, "Method" },
        { new SolverOptions { EventTimeTolerance = 0 }, "EventTimeTolerance" },
        { new SolverOptions { Output = OutputTimes.At([0.5, 2.0]) }, "Output" },
    };

    [Theory]
    [MemberData(nameof(BadOptions))]
    public void BadOptionsAreRejectedNamingTheSetting(SolverOptions options, string name)
    {
        var ex = Assert.ThrowsAny<ArgumentException>(() => OdeSolver.Solve(new DecaySystem(1), 0, [1], 1, options));
        Assert.Equal(name, ex.ParamName);
    }

    [Fact]
    public void OutputScheduleIsValidated()
    {
        Assert.Equal("interval", Assert.Throws<ArgumentOutOfRangeException>(() => OutputTimes.Uniform(0)).ParamName);
        var ex = Assert.Throws<ArgumentException>(() => OutputTimes.At([0.0, 1.0, 1.0]));
        Assert.Contains("strictly ascending", ex.Message);
        Assert.Throws<ArgumentException>(() => OutputTimes.At([0.0, double.PositiveInfinity]));
    }
}

public class EulerMaruyamaTests
{
    [Fact]
    public void WithoutNoiseItIsTheExplicitEulerMethodExactly()
    {
        // y' = −k y with σ = 0: y_N = (1 − hk)^N y0, the explicit Euler recursion in closed form.
        var r = OdeSolver.Solve(new DecaySystem(2.0), 0, [3.0], 1.0,
            new SolverOptions { Method = OdeMethod.EulerMaruyama, FixedStep = 0.01, Noise = new AdditiveNoise(0) });
        Assert.Equal(3.0 * Math.Pow(1 - 0.02, 100), r.FinalState[0], 1e-13);
        Assert.Equal(100, r.Statistics.AcceptedSteps);
    }

    [Fact]
    public void OrnsteinUhlenbeckMomentsMatchTheClosedForm()
    {
        // dy = −θ y dt + σ dW from y0: E[y(T)] = y0 e^(−θT), Var[y(T)] = σ²/(2θ)(1 − e^(−2θT)) (Gardiner, Stochastic Methods, Sect. 3.8.4).
        // Euler–Maruyama has weak order 1: with h = 0.005 the bias is ≈ θh relative, far below the sampling error of 4000 paths.
        const double theta = 1.5, sigma = 0.8, y0 = 2.0, T = 2.0;
        const int paths = 4000;
        var finals = new double[paths];
        for (int p = 0; p < paths; p++)
        {
            var r = OdeSolver.Solve(new DecaySystem(theta), 0, [y0], T,
                new SolverOptions { Method = OdeMethod.EulerMaruyama, FixedStep = 0.005, Noise = new AdditiveNoise(sigma), Seed = (ulong)p, Output = OutputTimes.FinalOnly });
            finals[p] = r.FinalState[0];
        }
        double mean = finals.Average();
        double variance = finals.Sum(v => (v - mean) * (v - mean)) / (paths - 1);
        double exactMean = y0 * Math.Exp(-theta * T);
        double exactVar = sigma * sigma / (2 * theta) * (1 - Math.Exp(-2 * theta * T));
        double meanSe = Math.Sqrt(exactVar / paths);          // standard error of the mean
        double varSe = exactVar * Math.Sqrt(2.0 / (paths - 1)); // standard error of a normal sample variance
        Assert.True(Math.Abs(mean - exactMean) < 4 * meanSe, $"mean {mean} vs {exactMean} (se {meanSe:E2})");
        Assert.True(Math.Abs(variance - exactVar) < 4 * varSe + 0.01 * exactVar, $"variance {variance} vs {exactVar} (se {varSe:E2})");
    }

    [Fact]
    public void EqualSeedsGiveEqualPathsAndDifferentSeedsDiffer()
    {
        SolverOptions Options(ulong seed) => new() { Method = OdeMethod.EulerMaruyama, FixedStep = 0.01, Noise = new AdditiveNoise(0.3), Seed = seed, Output = OutputTimes.Uniform(0.1) };
        var a = new RecordingSink();
        var b = new RecordingSink();
        var c = new RecordingSink();
        OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 5, Options(42), a);
        OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 5, Options(42), b);
        OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 5, Options(43), c);
        Assert.Equal(a.States.SelectMany(s => s), b.States.SelectMany(s => s));
        Assert.NotEqual(a.States[^1][0], c.States[^1][0]);
    }

    [Fact]
    public void StandardNormalVariatesHaveUnitVarianceAndZeroMean()
    {
        // Moments of N(0, 1) (and E[z⁴] = 3) over 200 000 draws, within 5 standard errors.
        var g = new GaussianSource(7);
        const int n = 200_000;
        double s1 = 0, s2 = 0, s4 = 0;
        for (int i = 0; i < n; i++)
        {
            double z = g.NextGaussian();
            s1 += z;
            s2 += z * z;
            s4 += z * z * z * z;
        }
        Assert.True(Math.Abs(s1 / n) < 5 / Math.Sqrt(n));
        Assert.True(Math.Abs(s2 / n - 1) < 5 * Math.Sqrt(2.0 / n));
        Assert.True(Math.Abs(s4 / n - 3) < 5 * Math.Sqrt(96.0 / n));
    }
}
