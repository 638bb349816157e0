using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// Steady states f(x; p) = 0 by damped Newton with the exact Jacobian: from a guess, from the end
/// state of a transient run, or from several starting states to reveal coexisting equilibria.
/// </summary>
/// <remarks>
/// Each iteration solves J Δ = −f by LU with partial pivoting and backtracks on ½‖f‖² with the
/// Armijo condition (sufficient decrease 1e-4, step halving), the globalised Newton method of
/// Dennis and Schnabel, Numerical Methods for Unconstrained Optimization and Nonlinear
/// Equations (SIAM 1996), §6.3.
/// </remarks>
public static class SteadyState
{
    /// <summary>Armijo sufficient-decrease constant (Dennis and Schnabel's recommended 1e-4).</summary>
    private const double ArmijoConstant = 1e-4;

    /// <summary>Solves f(x; p) = 0 from <paramref name="guess"/>.</summary>
    /// <param name="system">The model.</param>
    /// <param name="guess">Starting state (length Dimension).</param>
    /// <param name="parameters">Parameter values (length ParameterCount).</param>
    /// <param name="options">Newton settings; <see cref="NewtonOptions.Default"/> when null.</param>
    /// <returns>The result, converged or not; never throws for non-convergence.</returns>
    public static SteadyStateResult Solve(IParametricSystem system, ReadOnlySpan<double> guess, ReadOnlySpan<double> parameters, NewtonOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        options ??= NewtonOptions.Default;
        options.Validate();
        CheckLengths(system, guess, parameters);
        var d = new SystemDerivatives(system, options.Time, parameters);
        return Solve(d, guess, options);
    }

    /// <summary>Solves f(x; p) = 0 with the system's current parameter values.</summary>
    public static SteadyStateResult Solve(IParametricSystem system, ReadOnlySpan<double> guess, NewtonOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        var p = new double[system.ParameterCount];
        system.GetParameters(p);
        return Solve(system, guess, p, options);
    }

    /// <summary>
    /// Runs the model for <paramref name="duration"/> time units from <paramref name="initialState"/>
    /// with <paramref name="integrator"/>, then polishes the end state with Newton's method: the way to
    /// find the attractor a run settles on.
    /// </summary>
    public static SteadyStateResult FromRunEnd(IParametricSystem system, TransientIntegrator integrator, ReadOnlySpan<double> initialState,
        ReadOnlySpan<double> parameters, double duration, NewtonOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(integrator);
        if (!(duration > 0) || !double.IsFinite(duration))
            throw new ArgumentOutOfRangeException(nameof(duration), duration, "The run duration must be a positive finite number of time units.");
        CheckLengths(system, initialState, parameters);
        options ??= NewtonOptions.Default;
        var state = initialState.ToArray();
        var view = new ParameterOverrideSystem(system, parameters);
        integrator(view, options.Time, options.Time + duration, state);
        return Solve(system, state, parameters, options);
    }

    /// <summary>
    /// Solves from each of <paramref name="starts"/> and keeps the distinct equilibria: two converged
    /// states are the same when max_i |x_i − y_i| ≤ <paramref name="distinctTolerance"/>·(1 + max_i |x_i|).
    /// </summary>
    public static MultiStartResult FindAll(IParametricSystem system, IEnumerable<double[]> starts, ReadOnlySpan<double> parameters,
        NewtonOptions? options = null, double distinctTolerance = 1e-6)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(starts);
        if (!(distinctTolerance > 0))
            throw new ArgumentOutOfRangeException(nameof(distinctTolerance), distinctTolerance, "The tolerance for telling equilibria apart must be positive.");
        options ??= NewtonOptions.Default;
        options.Validate();
        var d = new SystemDerivatives(system, options.Time, parameters);
        var all = new List<SteadyStateResult>();
        var distinct = new List<SteadyStateResult>();
        var index = new List<int>();
        int k = 0;
        foreach (var start in starts)
        {
            if (start is null || start.Length != system.Dimension)
                throw new ArgumentException($"Starting state {k} has {start?.Length ?? 0} entries; the system has {system.Dimension} state variables.", nameof(starts));
            var r = Solve(d, start, options);
            all.Add(r);
            int found = -1;
            if (r.Converged)
            {
                for (int j = 0; j < distinct.Count && found < 0; j++)
                    if (Same(distinct[j].State.AsSpan(), r.State.AsSpan(), distinctTolerance)) found = j;
                if (found < 0) { distinct.Add(r); found = distinct.Count - 1; }
            }
            index.Add(found);
            k++;
        }
        if (k == 0) throw new ArgumentException("At least one starting state is needed.", nameof(starts));
        return new MultiStartResult { Equilibria = distinct, PerStart = all, EquilibriumIndexPerStart = index };
    }

    private static bool Same(ReadOnlySpan<double> a, ReadOnlySpan<double> b, double tol)
    {
        double scale = 1 + Vec.NormInf(a);
        for (int i = 0; i < a.Length; i++) if (Math.Abs(a[i] - b[i]) > tol * scale) return false;
        return true;
    }

    private static void CheckLengths(IParametricSystem system, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters)
    {
        if (state.Length != system.Dimension)
            throw new ArgumentException($"The state has {state.Length} entries; the system has {system.Dimension} state variables.", nameof(state));
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"Got {parameters.Length} parameter values; the system has {system.ParameterCount} parameters.", nameof(parameters));
        if (!Vec.AllFinite(state)) throw new ArgumentException("The starting state contains a non-finite value.", nameof(state));
        if (!Vec.AllFinite(parameters)) throw new ArgumentException("The parameter values contain a non-finite value.", nameof(parameters));
    }

    internal static SteadyStateResult Solve(SystemDerivatives d, ReadOnlySpan<double> guess, NewtonOptions options)
    {
        int n = d.N;
        var x = guess.ToArray();
        var f = new double[n];
        var jac = new double[n * n];
        var dx = new double[n];
        var trial = new double[n];
        var fTrial = new double[n];
        var lu = new LuFactorization(n);
        double damping = 1;
        int it = 0;
        d.Jacobian(x, jac, f);
        double residual = Vec.NormInf(f);
        NewtonFailure failure = NewtonFailure.None;
        while (true)
        {
            if (!double.IsFinite(residual)) { failure = NewtonFailure.NonFinite; break; }
            if (residual <= options.ResidualTolerance) break;
            if (it >= options.MaxIterations) { failure = NewtonFailure.IterationLimit; break; }
            it++;
            if (!lu.Factor(jac, n)) { failure = NewtonFailure.SingularJacobian; break; }
            for (int i = 0; i < n; i++) dx[i] = -f[i];
            lu.Solve(dx);
            double phi0 = 0.5 * Vec.Dot(f, f);
            damping = 1;
            bool accepted = false;
            while (damping >= options.MinimumDamping)
            {
                for (int i = 0; i < n; i++) trial[i] = x[i] + damping * dx[i];
                d.Residual(trial, fTrial);
                double phi = 0.5 * Vec.Dot(fTrial, fTrial);
                if (double.IsFinite(phi) && phi <= (1 - 2 * ArmijoConstant * damping) * phi0) { accepted = true; break; }
                damping *= 0.5;
            }
            if (!accepted) { failure = NewtonFailure.LineSearchFailed; break; }
            trial.CopyTo(x, 0);
            d.Jacobian(x, jac, f);
            residual = Vec.NormInf(f);
        }
        var result = new SteadyStateResult
        {
            Converged = failure == NewtonFailure.None,
            State = ImmutableCollectionsMarshal.AsImmutableArray(x),
            Parameters = ImmutableCollectionsMarshal.AsImmutableArray(d.CopyParameters()),
            Residual = residual,
            Iterations = it,
            Failure = failure,
            LastDamping = damping,
        };
        return failure == NewtonFailure.None ? result : result with { Diagnosis = Diagnose(d.System, result, options) };
    }

    internal static string Diagnose(IParametricSystem system, SteadyStateResult r, NewtonOptions options)
    {
        string where = DescribeParameters(system, r.Parameters.AsSpan());
        string what = r.Failure switch
        {
            NewtonFailure.IterationLimit => $"Newton's method did not converge in {r.Iterations} iterations",
            NewtonFailure.SingularJacobian => $"the Jacobian became singular at iteration {r.Iterations} (the state may sit on a fold, at a symmetric point, or the model may conserve a quantity, which leaves a zero eigenvalue)",
            NewtonFailure.LineSearchFailed => $"no damped Newton step reduced the residual at iteration {r.Iterations} (step fraction below {options.MinimumDamping:G3}): the iterate is near a minimum of |f| that is not an equilibrium",
            NewtonFailure.NonFinite => $"the right-hand side became non-finite after {r.Iterations} iterations",
            _ => "the solve failed",
        };
        string suggestion = r.Failure == NewtonFailure.SingularJacobian
            ? "Perturb the guess, fix the conserved quantity, or start continuation from a nearby parameter value."
            : "Start from a run's end state (SteadyState.FromRunEnd), try several starting states (SteadyState.FindAll), or continue from a parameter value where an equilibrium is known.";
        return $"No steady state found{where}: {what}; residual max|f| = {r.Residual:G3} (tolerance {options.ResidualTolerance:G3}). {suggestion}";
    }

    internal static string DescribeParameters(IParametricSystem system, ReadOnlySpan<double> p)
    {
        if (p.Length == 0 || p.Length > 6) return "";
        var parts = new string[p.Length];
        for (int i = 0; i < p.Length; i++) parts[i] = $"{system.GetParameterName(i)} = {p[i]:G6}";
        return " at " + string.Join(", ", parts);
    }
}
