namespace Thermostrat.Model.Analysis;

/// <summary>An accepted point of a traced curve, with the tangent it arrived with and the one it leaves with (they differ only at corners).</summary>
internal sealed class CurveNode
{
    public required double[] U { get; init; }
    public required double[] T { get; set; }
    public required double[] TIn { get; set; }
    public int DetSign { get; set; }
    public int DetSignIn { get; set; }
    public double Arclength { get; set; }
    public int Iterations { get; init; }
    /// <summary>Problem-specific data at the point (eigenvalues, test functions), on the outgoing side.</summary>
    public object? Data { get; set; }
    /// <summary>The same on the incoming side (differs only at corners).</summary>
    public object? DataIn { get; set; }
    public SpecialPointKind? Corner { get; set; }
    public double CornerResidual { get; set; }
    public int CornerIterations { get; set; }
}

/// <summary>A bound or validity limit crossed by a new point.</summary>
internal readonly record struct Outside(EndReason Reason, string Message, int BoundIndex, double BoundValue);

/// <summary>One direction of a traced curve.</summary>
internal sealed class HalfTrace
{
    public List<CurveNode> Nodes { get; } = [];
    public List<SpecialPoint> Specials { get; } = [];
    public BranchTermination Termination { get; set; } = new(EndReason.MaxPointsReached, "");
}

/// <summary>
/// The pseudo-arclength stepping loop shared by branches of equilibria and curves of folds and Hopf
/// points: tangent predictor, Newton corrector on the hyperplane orthogonal to the tangent, step
/// adaptation by corrector effort and turning angle, landing exactly on parameter and state bounds,
/// passage of corners of non-smooth right-hand sides, and detection of special points between
/// consecutive points by the problem-specific subclass.
/// </summary>
internal abstract class CurveTracer
{
    /// <summary>Step shrink factor after a corrector that needed many iterations.</summary>
    private const double SlowCorrectorShrink = 0.6;

    /// <summary>Corrector iterations at or below which the step grows.</summary>
    private const int EasyIterations = 2;

    /// <summary>Corrector iterations at or above which the step shrinks.</summary>
    private const int HardIterations = 5;

    /// <summary>
    /// Two kernels whose directions differ by more than this (1 − |cos|) across a bracket of width ~1e-13
    /// show a jump of the Jacobian, i.e. a corner (≈ 0.08° of turning).
    /// </summary>
    private const double JumpThreshold = 1e-6;

    /// <summary>Relative bracket width at which corner bisections stop.</summary>
    private const double BisectionWidth = 1e-13;

    protected CurveTracer(ExtendedSystem system, double[] weights, ArclengthSettings settings)
    {
        Settings = settings;
        Stepper = new ArclengthStepper(system, weights, settings.CorrectorTolerance, settings.MaxCorrectorIterations);
        M = system.Unknowns;
    }

    protected ArclengthSettings Settings { get; }

    protected ArclengthStepper Stepper { get; }

    protected int M { get; }

    /// <summary>The bound or limit u crosses, or null if inside.</summary>
    protected abstract Outside? CheckOutside(ReadOnlySpan<double> u);

    /// <summary>Problem-specific data at an accepted point.</summary>
    protected abstract object? Describe(ReadOnlySpan<double> u);

    /// <summary>Finds special points between two consecutive accepted points.</summary>
    protected abstract void Detect(CurveNode a, CurveNode b, HalfTrace trace, double direction);

    /// <summary>Kind of corner given the tangents before and after it.</summary>
    protected abstract SpecialPointKind ClassifyCorner(ReadOnlySpan<double> tIn, ReadOnlySpan<double> tOut);

    /// <summary>Describes a curve point in words (for messages).</summary>
    protected abstract string Where(ReadOnlySpan<double> u);

    /// <summary>Whether to look for corners when the corrector fails.</summary>
    protected virtual bool PassCorners => true;

    /// <summary>Builds the starting node (tangent oriented by the caller).</summary>
    public CurveNode StartNode(double[] u, double[] t, int detSign)
    {
        var data = Describe(u);
        return new CurveNode { U = u, T = t, TIn = t, DetSign = detSign, DetSignIn = detSign, Data = data, DataIn = data };
    }

    /// <summary>Traces from <paramref name="start"/> in the direction <paramref name="direction"/>·start.T (direction = ±1).</summary>
    public HalfTrace Run(CurveNode start, double direction)
    {
        var trace = new HalfTrace();
        var t0 = (double[])start.T.Clone();
        Vec.Scale(t0, direction);
        // Reversing the tangent reverses the border row, and with it the sign of the determinant test function.
        int detSign = direction < 0 ? -start.DetSign : start.DetSign;
        var first = new CurveNode
        {
            U = start.U, T = t0, TIn = t0, DetSign = detSign, DetSignIn = detSign,
            Data = start.Data, DataIn = start.Data, Arclength = 0,
        };
        trace.Nodes.Add(first);
        var prev = first;
        double ds = Settings.InitialStep;
        var row = new double[M];
        var u = new double[M];
        var t1 = new double[M];
        bool cornerTried = false;
        bool lastFailureNonFinite = false;
        double lastResidual = double.NaN;
        while (true)
        {
            if (trace.Nodes.Count >= Settings.MaxPoints)
            {
                trace.Termination = new BranchTermination(EndReason.MaxPointsReached,
                    $"Stopped after {trace.Nodes.Count} points (the MaxPoints limit) at {Where(prev.U)}.");
                break;
            }
            Stepper.WeightedRow(prev.T, row);
            for (int i = 0; i < M; i++) u[i] = prev.U[i] + ds * prev.T[i];
            double c = Vec.Dot(row, prev.U) + ds;
            var outcome = Stepper.Correct(u, row, c, ds);
            bool ok = outcome.Converged;
            detSign = 0;
            if (ok)
            {
                ok = Stepper.Tangent(u, row, t1, out detSign, evaluate: false);
                if (ok && Stepper.Dot(prev.T, t1) < Math.Cos(Settings.MaxTurningAngle) && ds > Settings.MinStep) ok = false;
            }
            if (!ok)
            {
                lastFailureNonFinite = outcome.NonFinite;
                lastResidual = outcome.Residual;
                if (!cornerTried && PassCorners)
                {
                    cornerTried = true;
                    var corner = TryCorner(prev, ds);
                    if (corner is not null)
                    {
                        corner.Arclength = prev.Arclength + direction * Stepper.Distance(corner.U, prev.U);
                        var outsideCorner = CheckOutside(corner.U);
                        if (outsideCorner is null)
                        {
                            Detect(prev, corner, trace, direction);
                            trace.Nodes.Add(corner);
                            prev = corner;
                            cornerTried = false;
                            continue;
                        }
                    }
                }
                ds *= 0.5;
                if (ds < Settings.MinStep)
                {
                    var reason = lastFailureNonFinite ? EndReason.NonFiniteState : EndReason.StepSizeTooSmall;
                    string why = lastFailureNonFinite
                        ? "the right-hand side became non-finite"
                        : $"the corrector did not converge (last residual {lastResidual:G3}, tolerance {Settings.CorrectorTolerance:G3}, {Settings.MaxCorrectorIterations} iterations) even with the smallest step {Settings.MinStep:G3}";
                    trace.Termination = new BranchTermination(reason,
                        $"Could not continue beyond {Where(prev.U)}: {why}. The branch may end at a singular point or leave the model's range; try a smaller MinStep, other scales, or a tighter MaxTurningAngle.");
                    break;
                }
                continue;
            }
            var outside = CheckOutside(u);
            if (outside is Outside o)
            {
                var landed = o.BoundIndex >= 0 ? Land(prev, u, o.BoundIndex, o.BoundValue) : null;
                if (landed is not null)
                {
                    landed.Arclength = prev.Arclength + direction * Stepper.Distance(landed.U, prev.U);
                    Detect(prev, landed, trace, direction);
                    trace.Nodes.Add(landed);
                }
                trace.Termination = new BranchTermination(o.Reason, landed is null && o.BoundIndex >= 0
                    ? o.Message + " (the point on the bound itself could not be computed; the last point is inside)"
                    : o.Message);
                break;
            }
            var node = new CurveNode
            {
                U = (double[])u.Clone(), T = (double[])t1.Clone(), TIn = null!, DetSign = detSign, DetSignIn = detSign,
                Iterations = outcome.Iterations,
            };
            if (Stepper.System.OnAccepted(node.U))
            {
                // Auxiliary unknowns were renormalised: recompute the tangent at the stored point.
                Stepper.WeightedRow(prev.T, row);
                if (!Stepper.Tangent(node.U, row, node.T, out detSign)) { ds *= 0.5; continue; }
                node.DetSign = node.DetSignIn = detSign;
            }
            node.TIn = node.T;
            node.Data = node.DataIn = Describe(node.U);
            node.Arclength = prev.Arclength + direction * Stepper.Distance(node.U, prev.U);
            Detect(prev, node, trace, direction);
            trace.Nodes.Add(node);
            double stepTaken = Stepper.Distance(node.U, prev.U);
            prev = node;
            cornerTried = false;
            if (trace.Nodes.Count > 3 && Stepper.Distance(node.U, first.U) < 0.5 * stepTaken
                && Math.Abs(node.Arclength) > 4 * stepTaken)
            {
                trace.Termination = new BranchTermination(EndReason.ClosedLoop, $"The curve closed on itself near its start at {Where(node.U)}.");
                break;
            }
            if (outcome.Iterations <= EasyIterations) ds = Math.Min(ds * Settings.StepGrowth, Settings.MaxStep);
            else if (outcome.Iterations >= HardIterations) ds = Math.Max(ds * SlowCorrectorShrink, Settings.MinStep);
        }
        return trace;
    }

    /// <summary>Solves for the point where unknown <paramref name="index"/> equals <paramref name="value"/> between prev and the overshooting point.</summary>
    private CurveNode? Land(CurveNode prev, ReadOnlySpan<double> beyond, int index, double value)
    {
        double a = prev.U[index], b = beyond[index];
        double alpha = b == a ? 1 : Math.Clamp((value - a) / (b - a), 0, 1);
        var u = new double[M];
        for (int i = 0; i < M; i++) u[i] = prev.U[i] + alpha * (beyond[i] - prev.U[i]);
        var row = new double[M];
        row[index] = 1;
        double span = Stepper.Distance(beyond, prev.U);
        var outcome = Stepper.Correct(u, row, value, 2 * span + Settings.MinStep);
        if (!outcome.Converged) return null;
        var t = new double[M];
        var border = new double[M];
        Stepper.WeightedRow(prev.T, border);
        if (!Stepper.Tangent(u, border, t, out int det)) return null;
        Stepper.System.OnAccepted(u);
        var data = Describe(u);
        return new CurveNode { U = u, T = t, TIn = t, DetSign = det, DetSignIn = det, Data = data, DataIn = data, Iterations = outcome.Iterations };
    }

    /// <summary>
    /// After a failed step from <paramref name="prev"/>: looks for a jump of the Jacobian's kernel along the
    /// tangent line within the failed step, and if there is one, locates the corner on the curve by
    /// bisection and returns a node there whose outgoing tangent follows the other smooth piece.
    /// </summary>
    private CurveNode? TryCorner(CurveNode prev, double ds)
    {
        var border = new double[M];
        Stepper.WeightedRow(prev.T, border);
        var p = new double[M];
        var kHi = new double[M];
        for (int i = 0; i < M; i++) p[i] = prev.U[i] + ds * prev.T[i];
        if (!Stepper.KernelAt(p, border, kHi)) return null;
        if (1 - Math.Abs(Stepper.Dot(kHi, prev.T)) < JumpThreshold) return null;
        var kLo = (double[])prev.T.Clone();
        var k = new double[M];
        double lo = 0, hi = ds, width = BisectionWidth * (1 + Stepper.Norm(prev.U));
        for (int it = 0; it < 200 && hi - lo > width; it++)
        {
            double mid = 0.5 * (lo + hi);
            for (int i = 0; i < M; i++) p[i] = prev.U[i] + mid * prev.T[i];
            if (!Stepper.KernelAt(p, border, k)) { hi = mid; continue; }
            if (Math.Abs(Stepper.Dot(k, kLo)) >= Math.Abs(Stepper.Dot(k, kHi))) { lo = mid; k.CopyTo(kLo, 0); }
            else { hi = mid; k.CopyTo(kHi, 0); }
        }
        if (1 - Math.Abs(Stepper.Dot(kLo, kHi)) < JumpThreshold) return null;
        return LocateCorner(prev, kLo, kHi, hi);
    }

    /// <summary>
    /// Bisection on the curve (points at projected distance σ along prev.T) for where the kernel switches
    /// from <paramref name="kA"/>'s side to <paramref name="kB"/>'s; returns the corner node or null.
    /// </summary>
    protected CurveNode? LocateCorner(CurveNode prev, double[] kA, double[] kB, double sigmaHi)
    {
        var row = new double[M];
        Stepper.WeightedRow(prev.T, row);
        double c0 = Vec.Dot(row, prev.U);
        var zLo = (double[])prev.U.Clone();
        var tLo = (double[])prev.T.Clone();
        var u = new double[M];
        var k = new double[M];
        double lo = 0, hi = sigmaHi;
        double width = BisectionWidth * (1 + Stepper.Norm(prev.U));
        int iterations = 0;

        // Side test of the point at projected distance σ, corrected from the nearest accepted side-A point:
        // 0 if it converges to a point whose kernel is closer to kA (side A), else 1. Where both smooth
        // pieces cross the hyperplane, a converged side-B point says nothing about σ, so the end of side A
        // is confirmed only from a predictor close to the last side-A point.
        int Side(double sigma)
        {
            for (int i = 0; i < M; i++) u[i] = zLo[i] + (sigma - lo) * tLo[i];
            var outcome = Stepper.Correct(u, row, c0 + sigma, 4 * (sigma - lo) + width, minIterations: 1);
            if (!outcome.Converged) return 1;
            if (!Stepper.Tangent(u, row, k, out _, evaluate: false)) return 1;
            return Math.Abs(Stepper.Dot(k, kA)) >= Math.Abs(Stepper.Dot(k, kB)) ? 0 : 1;
        }

        void AcceptLo(double sigma)
        {
            u.CopyTo(zLo, 0);
            if (Stepper.Dot(k, tLo) < 0) Vec.Scale(k, -1);
            k.CopyTo(tLo, 0);
            lo = sigma;
        }

        for (int outer = 0; outer < 60 && iterations < 400; outer++)
        {
            while (hi - lo > width && iterations < 400)
            {
                iterations++;
                double mid = 0.5 * (lo + hi);
                if (Side(mid) == 0) AcceptLo(mid);
                else hi = mid;
            }
            iterations++;
            if (Side(hi) != 0) break;
            AcceptLo(hi);
            // Side A goes on beyond hi: search forward by doubling from the last side-A point.
            double d = 2 * width;
            while (iterations < 400 && lo < 4 * sigmaHi + width)
            {
                iterations++;
                if (Side(lo + d) != 0) break;
                AcceptLo(lo + d);
                d *= 2;
            }
            if (lo >= 4 * sigmaHi + width) return null;
            hi = lo + d;
        }
        if (lo == 0) return null;
        // Outgoing kernel just beyond the corner along the incoming tangent (on the other side of the switch).
        var beyond = new double[M];
        var tOut = new double[M];
        double eps = Math.Max(4 * (hi - lo), 1e-10 * (1 + Stepper.Norm(zLo)));
        for (int i = 0; i < M; i++) beyond[i] = zLo[i] + eps * tLo[i];
        if (!Stepper.KernelAt(beyond, row, tOut) || Math.Abs(Stepper.Dot(tOut, kA)) >= Math.Abs(Stepper.Dot(tOut, kB)))
            kB.CopyTo(tOut, 0);
        double nOut = Stepper.Norm(tOut);
        Vec.Scale(tOut, 1 / nOut);
        // Orient the outgoing tangent: along the true continuation the residual grows quadratically, backwards linearly.
        double h = 1e-5 * (1 + Stepper.Norm(zLo));
        for (int i = 0; i < M; i++) beyond[i] = zLo[i] + h * tOut[i];
        double rPlus = Stepper.ResidualAt(beyond);
        for (int i = 0; i < M; i++) beyond[i] = zLo[i] - h * tOut[i];
        double rMinus = Stepper.ResidualAt(beyond);
        if (!(rPlus <= rMinus)) Vec.Scale(tOut, -1);
        // Determinant signs on each side, with each side's own tangent as border.
        var border = new double[M];
        var scratch = new double[M];
        Stepper.WeightedRow(tLo, border);
        Stepper.Tangent(zLo, border, scratch, out int detIn);
        var dataIn = Describe(zLo);
        for (int i = 0; i < M; i++) beyond[i] = zLo[i] + eps * tOut[i];
        Stepper.WeightedRow(tOut, border);
        Stepper.Tangent(beyond, border, scratch, out int detOut);
        var dataOut = Describe(beyond);
        double residual = Stepper.ResidualAt(zLo);
        return new CurveNode
        {
            U = zLo, T = tOut, TIn = tLo, DetSign = detOut, DetSignIn = detIn, Data = dataOut, DataIn = dataIn,
            Corner = ClassifyCorner(tLo, tOut), CornerResidual = residual, CornerIterations = iterations,
        };
    }
}
