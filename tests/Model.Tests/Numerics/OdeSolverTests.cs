using Thermostrat.Model.Numerics.Ode;
using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

public class OdeSolverTests
{
    private static readonly SolverOptions Tight = new() { RelativeTolerance = 1e-10, AbsoluteTolerance = 1e-12 };

    // ------------------------------------------------------------------ reference problems

    [Fact]
    public void RobertsonAtT40MatchesCheckValuesWithTheStiffMethod()
    {
        // Robertson kinetics at t = 40, CHECK-VALUES.md (Hairer and Wanner II test set; confirmed with SciPy Radau at rtol 1e-12).
        double[] reference = [0.7158270687, 9.185534764e-6, 0.2841637457];
        var r = OdeSolver.Solve(new RobertsonSystem(), 0, [1, 0, 0], 40,
            new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-14, IsAutonomous = true, Output = OutputTimes.FinalOnly });
        for (int i = 0; i < 3; i++)
            Assert.True(Math.Abs(r.FinalState[i] - reference[i]) / reference[i] < 1e-6, $"y{i + 1} = {r.FinalState[i]:R}, reference {reference[i]}");
        Assert.Equal(40.0, r.FinalTime);
        Assert.Equal(SolveStatus.Completed, r.Status);
    }

    [Fact]
    public void RobertsonLongRunMatchesScipyReference()
    {
        // Reference: SciPy Radau rtol 1e-12 at t = 1e5 (fixture; make_ode_references.py). Mass y1 + y2 + y3 = 1 is conserved exactly
        // by the equations and, to rounding, by any Runge–Kutta or Rosenbrock method (linear invariants are preserved).
        var (reference, agreement) = OdeReferences.Get("robertson", 1e5);
        Assert.True(agreement < 1e-9);
        var r = OdeSolver.Solve(new RobertsonSystem(), 0, [1, 0, 0], 1e5,
            new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-14, IsAutonomous = true, Output = OutputTimes.FinalOnly });
        for (int i = 0; i < 3; i++)
            Assert.True(Math.Abs(r.FinalState[i] - reference[i]) / reference[i] < 1e-6, $"y{i + 1} = {r.FinalState[i]:R}, reference {reference[i]:R}");
        Assert.Equal(1.0, r.FinalState.Sum(), 1e-12);
    }

    [Fact]
    public void AutoSwitchesToTheStiffMethodOnRobertsonAndReportsIt()
    {
        double[] reference = [0.7158270687, 9.185534764e-6, 0.2841637457]; // CHECK-VALUES.md, t = 40
        var r = OdeSolver.Solve(new RobertsonSystem(), 0, [1, 0, 0], 40,
            new SolverOptions { Method = OdeMethod.Auto, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-14, Output = OutputTimes.FinalOnly });
        var sw = Assert.Single(r.MethodSwitches);
        Assert.Equal(OdeMethod.DormandPrince54, sw.From);
        Assert.Equal(OdeMethod.Rodas4, sw.To);
        Assert.Equal(OdeMethod.Rodas4, r.FinalMethod);
        Assert.Equal(r.StiffnessDetectedAt, sw.Time);
        Assert.True(sw.Time < 40);
        for (int i = 0; i < 3; i++)
            Assert.True(Math.Abs(r.FinalState[i] - reference[i]) / reference[i] < 1e-6, $"y{i + 1} = {r.FinalState[i]:R}");
    }

    [Fact]
    public void VanDerPolStiffMatchesScipyReference()
    {
        // Van der Pol μ = 1000 on [0, 3000] (Hairer and Wanner II, Sect. IV.1); reference SciPy Radau rtol 1e-12 (fixture).
        var (reference, agreement) = OdeReferences.Get("vanderpol_mu1000", 3000);
        var r = OdeSolver.Solve(new VanDerPolSystem(1000), 0, [2, 0], 3000,
            new SolverOptions { Method = OdeMethod.Auto, RelativeTolerance = 1e-10, AbsoluteTolerance = 1e-12, IsAutonomous = true, Output = OutputTimes.FinalOnly });
        Assert.NotEmpty(r.MethodSwitches);
        Assert.True(Math.Abs(r.FinalState[0] - reference[0]) < 1e-6 * Math.Abs(reference[0]) + agreement, $"y1 = {r.FinalState[0]:R}, reference {reference[0]:R}");
        Assert.True(Math.Abs(r.FinalState[1] - reference[1]) < 1e-5 * Math.Abs(reference[1]), $"y2 = {r.FinalState[1]:R}, reference {reference[1]:R}");
    }

    [Theory]
    [InlineData(OdeMethod.DormandPrince54)]
    [InlineData(OdeMethod.BogackiShampine32)]
    [InlineData(OdeMethod.Rodas4)]
    public void StommelTwoBoxMatchesScipyReference(OdeMethod method)
    {
        // A Stommel (1961)-type two-box salt-advection scenario with invented periodic freshwater forcing (time-dependent f),
        // reference SciPy Radau rtol 1e-12 (fixture).
        var (reference, _) = OdeReferences.Get("stommel_forced", 50);
        var r = OdeSolver.Solve(new StommelSystem(3.0, 1.0, 0.5, 10.0, 0.3), 0, [1.0, 0.5], 50,
            new SolverOptions { Method = method, RelativeTolerance = 1e-10, AbsoluteTolerance = 1e-12, Output = OutputTimes.FinalOnly });
        for (int i = 0; i < 2; i++)
            Assert.True(Math.Abs(r.FinalState[i] - reference[i]) < 1e-8, $"{method}: y{i} = {r.FinalState[i]:R}, reference {reference[i]:R}");
    }

    // ------------------------------------------------------------------ stiffness

    [Theory]
    [InlineData(-1e6)]
    [InlineData(-1e8)]
    [InlineData(-1e10)]
    public void ProtheroRobinsonStiffMethodKeepsTheExactSolution(double lambda)
    {
        // Prothero and Robinson (1974): exact y = sin t for every λ < 0. At every step end the stiffly accurate RODAS4 stays on it
        // to the tolerance, with steps of order 1 (an explicit method would need |λ|·10/3.3 steps).
        var sink = new RecordingSink();
        var r = OdeSolver.Solve(new ProtheroRobinsonSystem(lambda), 0, [0], 10,
            new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-6 }, sink);
        for (int k = 0; k < sink.Times.Count; k++)
            Assert.True(Math.Abs(sink.States[k][0] - Math.Sin(sink.Times[k])) < 1e-6, $"λ = {lambda}: t = {sink.Times[k]}, y = {sink.States[k][0]}");
        Assert.True(r.Statistics.AcceptedSteps < 50, $"{r.Statistics.AcceptedSteps} steps");
    }

    [Fact]
    public void ProtheroRobinsonStiffStepCountIsIndependentOfLambda()
    {
        // L-stability and stiff accuracy of RODAS4 (Hairer and Wanner II, Sect. VI.4): once the problem is stiff, the step count is set
        // by g = sin and the tolerance, not by λ (observed 10, 8, 8 steps for λ = −1e6, −1e8, −1e10 at rtol 1e-6).
        long Steps(double lambda) => OdeSolver.Solve(new ProtheroRobinsonSystem(lambda), 0, [0], 10,
            new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-6, Output = OutputTimes.FinalOnly }).Statistics.AcceptedSteps;
        long[] counts = [Steps(-1e6), Steps(-1e8), Steps(-1e10)];
        Assert.True(counts.Max() <= 1.3 * counts.Min(), $"step counts {string.Join(", ", counts)}");
    }

    [Fact]
    public void StiffDenseOutputIsAccurateWhenMaxStepBoundsTheStep()
    {
        // On a stiff problem RODAS4's steps outgrow the output spacing, and on stiff components its continuous extension is only
        // O(h³) (measured: 1.4e-5 at h = 0.1, 2.7e-8 at h = 0.0125 for λ = −1e6, against O(h⁴) for λ = −1), while the step ends stay
        // exact. Bounding MaxStep restores accurate output between steps (exact solution sin t).
        var sink = new RecordingSink();
        OdeSolver.Solve(new ProtheroRobinsonSystem(-1e6), 0, [0], 10,
            new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-6, MaxStep = 0.02, Output = OutputTimes.Uniform(0.01) }, sink);
        Assert.Equal(1001, sink.Times.Count);
        for (int k = 0; k < sink.Times.Count; k++)
            Assert.True(Math.Abs(sink.States[k][0] - Math.Sin(sink.Times[k])) < 1e-6, $"t = {sink.Times[k]}, y = {sink.States[k][0]}");
    }

    [Fact]
    public void ExplicitMethodReportsStiffnessOnProtheroRobinson()
    {
        // Hairer–Wanner stiffness detection (Solving ODEs II, Sect. IV.2): with λ = −1e6 the explicit step is held at |hλ| ≈ 3.3.
        var r = OdeSolver.Solve(new ProtheroRobinsonSystem(-1e6), 0, [0], 0.01,
            new SolverOptions { Method = OdeMethod.DormandPrince54, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-8, Output = OutputTimes.FinalOnly });
        Assert.NotNull(r.StiffnessDetectedAt);
        Assert.Empty(r.MethodSwitches); // DormandPrince54 only reports; Auto switches
        Assert.Equal(OdeMethod.DormandPrince54, r.FinalMethod);
        Assert.True(r.LastStepSize * 1e6 < 4.0, $"last step {r.LastStepSize}");

        var auto = OdeSolver.Solve(new ProtheroRobinsonSystem(-1e6), 0, [0], 10,
            new SolverOptions { Method = OdeMethod.Auto, RelativeTolerance = 1e-6, AbsoluteTolerance = 1e-8, Output = OutputTimes.FinalOnly });
        Assert.Single(auto.MethodSwitches);
        Assert.True(auto.Statistics.AcceptedSteps < 1000, $"{auto.Statistics.AcceptedSteps} steps");
        Assert.Equal(Math.Sin(10), auto.FinalState[0], 1e-6);
    }

    [Fact]
    public void NonStiffProblemIsNotReportedStiff()
    {
        var r = OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 100, Tight with { Method = OdeMethod.Auto, Output = OutputTimes.FinalOnly });
        Assert.Null(r.StiffnessDetectedAt);
        Assert.Empty(r.MethodSwitches);
    }

    // ------------------------------------------------------------------ orders

    public static TheoryData<OdeMethod, int, double, int> Orders => new()
    {
        { OdeMethod.DormandPrince54, 5, 0.05, 3 }, // three levels: a fourth would reach rounding error
        { OdeMethod.BogackiShampine32, 3, 0.1, 4 },
        { OdeMethod.RungeKutta4, 4, 0.1, 4 },
        { OdeMethod.Rodas4, 4, 0.1, 4 },
        { OdeMethod.EulerMaruyama, 1, 0.05, 4 },
    };

    [Theory]
    [MemberData(nameof(Orders))]
    public void ConvergenceSlopeMatchesTheClaimedOrder(OdeMethod method, int order, double h0, int levels)
    {
        // Closed form of LogisticSystem (nonlinear, non-autonomous). Fixed steps h0/2^k, k < levels; the least-squares log–log slope
        // of the error at t = 2 must be within ±0.3 of the order (Hairer, Nørsett and Wanner I, Sect. II.3). This also checks the
        // tableaux' order conditions. EulerMaruyama with σ = 0 is the explicit Euler method (order 1).
        var hs = new List<double>();
        var errs = new List<double>();
        for (int k = 0; k < levels; k++)
        {
            double h = h0 / (1 << k);
            var r = OdeSolver.Solve(new LogisticSystem(), 0, [0.1], 2,
                new SolverOptions { Method = method, FixedStep = h, Output = OutputTimes.FinalOnly, Noise = new AdditiveNoise(0) });
            hs.Add(h);
            errs.Add(Math.Abs(r.FinalState[0] - LogisticSystem.Exact(2, 0.1)));
        }
        Assert.True(errs[^1] > 1e-13, $"errors reached rounding level: {string.Join(", ", errs)}");
        double slope = Slope(hs, errs);
        Assert.True(Math.Abs(slope - order) <= 0.3, $"{method}: slope {slope:F3}, claimed order {order}; errors {string.Join(", ", errs.Select(e => e.ToString("E2")))}");
    }

    public static TheoryData<OdeMethod, int, double> DenseOrders => new()
    {
        { OdeMethod.DormandPrince54, 5, 0.1 }, // Shampine's order-4 interpolant: local O(h^5), as the global error
        { OdeMethod.BogackiShampine32, 3, 0.1 }, // Hermite, local O(h^4), limited by the global O(h^3)
        { OdeMethod.RungeKutta4, 4, 0.1 },
        { OdeMethod.Rodas4, 4, 0.1 }, // order-3 continuous extension: local O(h^4)
    };

    [Theory]
    [MemberData(nameof(DenseOrders))]
    public void DenseOutputConvergesAtTheExpectedOrder(OdeMethod method, int order, double h0)
    {
        // Dense output at 397 off-step times against the closed form; the worst error over all of them.
        var times = Enumerable.Range(0, 397).Select(i => 0.00123 + i * 0.005).ToArray();
        var hs = new List<double>();
        var errs = new List<double>();
        for (int k = 0; k < 4; k++)
        {
            double h = h0 / (1 << k);
            var sink = new RecordingSink();
            OdeSolver.Solve(new LogisticSystem(), 0, [0.1], 2, new SolverOptions { Method = method, FixedStep = h, Output = OutputTimes.At(times) }, sink);
            Assert.Equal(times, sink.Times);
            double e = 0;
            for (int i = 0; i < sink.Times.Count; i++) e = Math.Max(e, Math.Abs(sink.States[i][0] - LogisticSystem.Exact(sink.Times[i], 0.1)));
            hs.Add(h);
            errs.Add(e);
        }
        double slope = Slope(hs, errs);
        Assert.True(Math.Abs(slope - order) <= 0.3, $"{method}: dense slope {slope:F3}, expected {order}; errors {string.Join(", ", errs.Select(e => e.ToString("E2")))}");
    }

    private static double Slope(IReadOnlyList<double> h, IReadOnlyList<double> e)
    {
        // Least-squares slope of log e against log h.
        var x = h.Select(v => Math.Log(v)).ToArray();
        var y = e.Select(v => Math.Log(v)).ToArray();
        double mx = x.Average(), my = y.Average();
        return x.Zip(y, (a, b) => (a - mx) * (b - my)).Sum() / x.Sum(a => (a - mx) * (a - mx));
    }

    // ------------------------------------------------------------------ accuracy and invariants

    [Theory]
    [InlineData(OdeMethod.DormandPrince54)]
    [InlineData(OdeMethod.BogackiShampine32)]
    [InlineData(OdeMethod.Rodas4)]
    [InlineData(OdeMethod.Auto)]
    public void LinearDecayIsExactToTolerance(OdeMethod method)
    {
        // y' = −y: y(10) = e^−10 (closed form). For linear decay the global relative error is exactly the sum of the steps' local
        // relative errors (nothing amplifies them), so if every local error is within rtol, the final relative error is at most
        // (accepted steps)·rtol; and it must also stay within a small multiple of rtol (observed: ≤ 2.4 rtol for DOPRI5 and RODAS4,
        // ≈ 12–16 rtol for Bogacki–Shampine, whose steps are many and whose local error is ≈ 0.35 of its tolerance at rtol 1e-4).
        foreach (double rtol in new[] { 1e-4, 1e-7, 1e-10 })
        {
            var r = OdeSolver.Solve(new DecaySystem(1.0), 0, [1], 10,
                new SolverOptions { Method = method, RelativeTolerance = rtol, AbsoluteTolerance = 1e-20, Output = OutputTimes.FinalOnly });
            double rel = Math.Abs(r.FinalState[0] / Math.Exp(-10) - 1);
            Assert.True(rel <= r.Statistics.AcceptedSteps * rtol, $"{method} rtol {rtol}: relative error {rel:E2} over {r.Statistics.AcceptedSteps} steps");
            double factor = method == OdeMethod.BogackiShampine32 ? 20 : 3;
            Assert.True(rel < factor * rtol, $"{method} rtol {rtol}: relative error {rel:E2}");
        }
    }

    [Theory]
    [InlineData(OdeMethod.DormandPrince54, 1e-10, 3.0)]
    [InlineData(OdeMethod.Rodas4, 1e-10, 3.0)]
    [InlineData(OdeMethod.BogackiShampine32, 1e-8, 20.0)]
    public void HarmonicOscillatorEnergyStaysWithinTheToleranceOver1000Periods(OdeMethod method, double rtol, double perPeriod)
    {
        // Exact invariant E = (y1² + y2²)/2 = 1/2. These methods are not symplectic: |ΔE| grows linearly in time (Hairer, Lubich and
        // Wanner, Geometric Numerical Integration, 2nd ed., ch. IX). With error-per-step control the growth per period is a
        // fixed multiple of rtol: ≈ 2 for DOPRI5, below 0.1 for RODAS4, ≈ 15 for Bogacki–Shampine (≈ 20× more steps per period).
        // Check at every period: |ΔE| ≤ perPeriod · rtol · (periods elapsed), so the drift stays bounded by the tolerance and linear.
        double periods = 1000, tEnd = periods * 2 * Math.PI;
        var sink = new EnergySink();
        OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], tEnd,
            new SolverOptions { Method = method, RelativeTolerance = rtol, AbsoluteTolerance = rtol, Output = OutputTimes.Uniform(2 * Math.PI) }, sink);
        Assert.Equal(1001, sink.Count);
        Assert.True(sink.WorstDriftPerPeriod < perPeriod * rtol, $"{method}: energy drift {sink.WorstDriftPerPeriod / rtol:F2} rtol per period");
        Assert.True(Math.Abs(sink.LastDrift) < perPeriod * periods * rtol, $"{method}: final |ΔE| = {Math.Abs(sink.LastDrift):E2}");
    }

    private sealed class EnergySink : IOutputSink
    {
        public int Count;
        public double WorstDriftPerPeriod, LastDrift;

        public void Write(double t, ReadOnlySpan<double> y)
        {
            double drift = 0.5 * (y[0] * y[0] + y[1] * y[1]) - 0.5;
            if (Count > 0) WorstDriftPerPeriod = Math.Max(WorstDriftPerPeriod, Math.Abs(drift) / Math.Round(t / (2 * Math.PI)));
            LastDrift = drift;
            Count++;
        }
    }

    // ------------------------------------------------------------------ events

    [Theory]
    [InlineData(OdeMethod.DormandPrince54)]
    [InlineData(OdeMethod.Rodas4)]
    [InlineData(OdeMethod.BogackiShampine32)]
    public void EventCrossingsOfTheHarmonicOscillatorAreLocatedTo1e10(OdeMethod method)
    {
        // y1 = cos t (closed form) falls through zero at π/2 + 2kπ and rises at 3π/2 + 2kπ.
        var events = new[]
        {
            new OdeEvent { Name = "cos-zero", Function = (t, y) => y[0] },
            new OdeEvent { Name = "cos-rising", Function = (t, y) => y[0], Direction = EventDirection.Rising },
        };
        var r = OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 20,
            new SolverOptions { Method = method, RelativeTolerance = 1e-13, AbsoluteTolerance = 1e-14, Output = OutputTimes.FinalOnly }, null, events);
        var all = r.Events.Where(e => e.EventIndex == 0).ToList();
        Assert.Equal(6, all.Count); // π/2 + kπ < 20 for k = 0..5
        for (int k = 0; k < all.Count; k++)
        {
            Assert.True(Math.Abs(all[k].Time - (Math.PI / 2 + k * Math.PI)) < 1e-10, $"{method}: crossing {k} at {all[k].Time:R}");
            Assert.Equal(k % 2 == 1, all[k].Rising);
            Assert.True(Math.Abs(all[k].State[0]) < 1e-10);
        }
        var rising = r.Events.Where(e => e.EventIndex == 1).ToList();
        Assert.Equal(3, rising.Count);
        Assert.All(rising, e => Assert.True(e.Rising));
        Assert.True(Math.Abs(rising[0].Time - 1.5 * Math.PI) < 1e-10);
        Assert.Equal(SolveStatus.Completed, r.Status);
    }

    [Fact]
    public void TerminalEventStopsAtTheClosedFormCrossing()
    {
        // y2 = e^(sin t) reaches 2 when sin t = ln 2, first at t* = asin(ln 2) (closed form of NonlinearSystem).
        double tStar = Math.Asin(Math.Log(2));
        var sink = new RecordingSink();
        var ev = new OdeEvent { Name = "y2 = 2", Function = (t, y) => y[1] - 2, Direction = EventDirection.Rising, Terminal = true };
        var r = OdeSolver.Solve(new NonlinearSystem(), 0, [1, 1], 10,
            new SolverOptions { Method = OdeMethod.DormandPrince54, RelativeTolerance = 1e-13, AbsoluteTolerance = 1e-14 }, sink, [ev]);
        Assert.Equal(SolveStatus.TerminatedByEvent, r.Status);
        Assert.True(Math.Abs(r.FinalTime - tStar) < 1e-10, $"stopped at {r.FinalTime:R}, exact {tStar:R}");
        Assert.Equal(2.0, r.FinalState[1], 1e-10);
        Assert.Equal(NonlinearSystem.Exact(tStar)[0], r.FinalState[0], 1e-10);
        Assert.Equal(r.FinalTime, sink.Times[^1]);
        Assert.True(sink.Times.All(t => t <= r.FinalTime));
        Assert.Single(r.Events);
    }

    [Fact]
    public void RecordingEventBeforeTerminalIsKeptAndLaterOnesAreNot()
    {
        // cos t falls through 0.5 at π/3 and through 0 at π/2; the terminal event at π/2 ends the run before cos t rises through 0.5 at 5π/3.
        var events = new[]
        {
            new OdeEvent { Name = "half", Function = (t, y) => y[0] - 0.5 },
            new OdeEvent { Name = "zero", Function = (t, y) => y[0], Terminal = true },
        };
        var r = OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 10, Tight with { Method = OdeMethod.DormandPrince54, RelativeTolerance = 1e-12, AbsoluteTolerance = 1e-14 }, null, events);
        Assert.Equal(2, r.Events.Count);
        Assert.Equal("half", r.Events[0].Name);
        Assert.True(Math.Abs(r.Events[0].Time - Math.PI / 3) < 1e-10);
        Assert.Equal("zero", r.Events[1].Name);
        Assert.True(Math.Abs(r.FinalTime - Math.PI / 2) < 1e-10);
    }

    // ------------------------------------------------------------------ output

    [Fact]
    public void UniformOutputHitsTheGridExactlyAndMatchesTheClosedForm()
    {
        var sink = new RecordingSink();
        OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 10, Tight with { Method = OdeMethod.DormandPrince54, Output = OutputTimes.Uniform(0.1) }, sink);
        Assert.Equal(101, sink.Times.Count);
        for (int k = 0; k < 101; k++)
        {
            Assert.Equal(k == 100 ? 10.0 : 0.1 * k, sink.Times[k]); // t0 + kΔ, last clamped to tEnd
            Assert.Equal(Math.Cos(sink.Times[k]), sink.States[k][0], 1e-8);
            Assert.Equal(-Math.Sin(sink.Times[k]), sink.States[k][1], 1e-8);
        }
    }

    [Fact]
    public void ListedOutputTimesAreWrittenInOrder()
    {
        double[] times = [0, 0.5, 1.25, 7, 10];
        var sink = new RecordingSink();
        OdeSolver.Solve(new DecaySystem(0.3), 0, [2], 10, Tight with { Method = OdeMethod.Rodas4, Output = OutputTimes.At(times) }, sink);
        Assert.Equal(times, sink.Times);
        for (int k = 0; k < times.Length; k++) Assert.Equal(2 * Math.Exp(-0.3 * times[k]), sink.States[k][0], 1e-9);
    }

    [Fact]
    public void EveryStepWritesTheStartAndEachAcceptedStep()
    {
        var sink = new RecordingSink();
        var r = OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], 10, new SolverOptions { Method = OdeMethod.BogackiShampine32, MaxStep = 0.05 }, sink);
        Assert.Equal(r.Statistics.AcceptedSteps + 1, sink.Times.Count);
        Assert.Equal(0.0, sink.Times[0]);
        Assert.Equal(10.0, sink.Times[^1]);
        for (int k = 1; k < sink.Times.Count; k++) Assert.True(sink.Times[k] - sink.Times[k - 1] <= 0.05 * (1 + 1e-12));
    }

    [Fact]
    public void FinalOnlyWritesOneRow()
    {
        var sink = new RecordingSink();
        var r = OdeSolver.Solve(new DecaySystem(1), 0, [1], 3, new SolverOptions { Output = OutputTimes.FinalOnly }, sink);
        Assert.Equal([3.0], sink.Times);
        Assert.Equal(r.FinalState[0], sink.States[0][0]);
    }

    // ------------------------------------------------------------------ statistics and memory

    [Fact]
    public void StatisticsCountTheWorkExactly()
    {
        // DOPRI5 is FSAL: 6 new evaluations per attempt, plus f(t0) and one for the initial-step estimate.
        var dp = OdeSolver.Solve(new NonlinearSystem(), 0, [1, 1], 5, Tight with { Method = OdeMethod.DormandPrince54, Output = OutputTimes.FinalOnly });
        var s = dp.Statistics;
        Assert.Equal(2 + 6 * (s.AcceptedSteps + s.RejectedSteps), s.FunctionEvaluations);
        Assert.Equal(0, s.JacobianEvaluations);

        // RODAS4 (autonomous): one Jacobian per accepted step (reused on rejection), one LU per attempt, 5 new f per attempt
        // (the first stage's f comes with the dual-number Jacobian), 6 substitutions per attempt.
        var ro = OdeSolver.Solve(new RobertsonSystem(), 0, [1, 0, 0], 40,
            new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-14, IsAutonomous = true, Output = OutputTimes.FinalOnly });
        var q = ro.Statistics;
        long attempts = q.AcceptedSteps + q.RejectedSteps;
        Assert.Equal(q.AcceptedSteps, q.JacobianEvaluations);
        Assert.Equal(attempts, q.LuFactorizations);
        Assert.Equal(6 * attempts, q.LinearSolves);
        Assert.Equal(2 + 5 * attempts, q.FunctionEvaluations);

        // Non-autonomous: one more evaluation per Jacobian for ∂f/∂t.
        var pr = OdeSolver.Solve(new ProtheroRobinsonSystem(-1e3), 0, [0], 1, new SolverOptions { Method = OdeMethod.Rodas4, Output = OutputTimes.FinalOnly });
        var p = pr.Statistics;
        Assert.Equal(2 + 5 * (p.AcceptedSteps + p.RejectedSteps) + p.JacobianEvaluations, p.FunctionEvaluations);
    }

    [Theory]
    [InlineData(OdeMethod.DormandPrince54)]
    [InlineData(OdeMethod.Rodas4)]
    [InlineData(OdeMethod.EulerMaruyama)]
    public void MemoryDoesNotGrowWithRunLength(OdeMethod method)
    {
        // Every allocation of a solve happens at its start: 100 and 10 000 steps allocate the same bytes.
        var sink = new NullSink();
        var noise = new AdditiveNoise(0.01);
        long Allocated(double tEnd)
        {
            var options = new SolverOptions { Method = method, MaxStep = 0.01, FixedStep = method == OdeMethod.EulerMaruyama ? 0.01 : null, Noise = noise };
            OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], tEnd, options, sink);
            long before = GC.GetAllocatedBytesForCurrentThread();
            OdeSolver.Solve(new HarmonicSystem(), 0, [1, 0], tEnd, options, sink);
            return GC.GetAllocatedBytesForCurrentThread() - before;
        }
        long shortRun = Allocated(1), longRun = Allocated(100);
        Assert.Equal(shortRun, longRun);
    }

    private sealed class NullSink : IOutputSink
    {
        public double Last;
        public void Write(double t, ReadOnlySpan<double> y) => Last = y[0];
    }

    // ------------------------------------------------------------------ systems and variants

    [Fact]
    public void StructAndParametricSystemsGiveTheSameSolution()
    {
        var a = OdeSolver.Solve(new DecaySystem(0.7), 0, [1], 2, Tight with { Method = OdeMethod.Rodas4, Output = OutputTimes.FinalOnly });
        var b = OdeSolver.Solve(new DecayStruct(0.7), 0, [1], 2, Tight with { Method = OdeMethod.Rodas4, Output = OutputTimes.FinalOnly });
        Assert.Equal(a.FinalState[0], b.FinalState[0]);
        Assert.Equal(Math.Exp(-1.4), a.FinalState[0], 1e-9);

        // Lotka–Volterra with parameters passed explicitly equals the same system with those parameters set.
        var lv = new LotkaVolterraSystem();
        double[] p = new double[3];
        lv.GetParameters(p);
        var c = OdeSolver.Solve(lv, p, 0, [1, 1], 5, Tight with { Method = OdeMethod.DormandPrince54, Output = OutputTimes.FinalOnly });
        var d = OdeSolver.Solve(lv, 0, [1, 1], 5, Tight with { Method = OdeMethod.DormandPrince54, Output = OutputTimes.FinalOnly });
        Assert.Equal(d.FinalState, c.FinalState);
        p[0] *= 1.1;
        var e = OdeSolver.Solve(lv, p, 0, [1, 1], 5, Tight with { Method = OdeMethod.DormandPrince54, Output = OutputTimes.FinalOnly });
        Assert.NotEqual(d.FinalState[0], e.FinalState[0]);
    }

    [Fact]
    public void FiniteDifferenceJacobianGivesTheSameStiffSolution()
    {
        double[] reference = [0.7158270687, 9.185534764e-6, 0.2841637457]; // CHECK-VALUES.md
        var r = OdeSolver.Solve(new RobertsonSystem(), 0, [1, 0, 0], 40,
            new SolverOptions { Method = OdeMethod.Rodas4, Jacobian = JacobianSource.FiniteDifference, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-14, Output = OutputTimes.FinalOnly });
        for (int i = 0; i < 3; i++) Assert.True(Math.Abs(r.FinalState[i] - reference[i]) / reference[i] < 1e-6);
        Assert.Equal(r.Statistics.JacobianEvaluations, r.Statistics.AcceptedSteps);
    }
}

/// <summary>
/// A Stommel (1961)-type two-box model in the common nondimensional form T' = η1 − T − |T − S| T, S' = η2(t) − η3 S − |T − S| S
/// (form from memory), with invented periodic forcing η2(t) = η2 + a sin(2πt/P).
/// </summary>
internal sealed class StommelSystem(double eta1, double eta2, double amplitude, double period, double eta3) : Thermostrat.Model.Numerics.IOdeSystem
{
    public int Dimension => 2;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, System.Numerics.IFloatingPointIeee754<T>
    {
        T q = T.Abs(y[0] - y[1]);
        dydt[0] = T.CreateChecked(eta1) - y[0] - q * y[0];
        dydt[1] = T.CreateChecked(eta2 + amplitude * Math.Sin(2 * Math.PI * t / period)) - T.CreateChecked(eta3) * y[1] - q * y[1];
    }
}
