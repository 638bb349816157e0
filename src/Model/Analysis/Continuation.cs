using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// Pseudo-arclength continuation of equilibria in one parameter (Keller 1977; Allgower and Georg,
/// Introduction to Numerical Continuation Methods, SIAM 2003), with step adaptation, both
/// directions, bounds on the parameter and the state, and detection and location of folds, Hopf
/// points, branch points and corners of non-smooth right-hand sides. The branch continues through
/// folds and corners.
/// </summary>
public static class Continuation
{
    /// <summary>Traces the branch of equilibria through <paramref name="startState"/> in parameter <paramref name="parameterName"/>.</summary>
    /// <exception cref="ArgumentException">Unknown parameter name (the message suggests the closest), bad ranges or settings.</exception>
    /// <exception cref="SteadyStateNotFoundException">The start does not converge to an equilibrium; the diagnosis is attached.</exception>
    public static Branch Trace(IParametricSystem system, string parameterName, ReadOnlySpan<double> startState, ReadOnlySpan<double> parameters, ContinuationOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        int k = ParameterLookup.IndexOf(system, parameterName, nameof(parameterName));
        return Trace(system, k, startState, parameters, options);
    }

    /// <summary>As <see cref="Trace(IParametricSystem, string, ReadOnlySpan{double}, ReadOnlySpan{double}, ContinuationOptions)"/>, with the system's current parameter values.</summary>
    public static Branch Trace(IParametricSystem system, string parameterName, ReadOnlySpan<double> startState, ContinuationOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        var p = new double[system.ParameterCount];
        system.GetParameters(p);
        return Trace(system, parameterName, startState, p, options);
    }

    /// <summary>
    /// Traces the branch of equilibria through <paramref name="startState"/> (polished by Newton's method
    /// first) in parameter <paramref name="parameterIndex"/>, starting at parameters[parameterIndex].
    /// </summary>
    /// <param name="system">The model.</param>
    /// <param name="parameterIndex">Index of the continuation parameter.</param>
    /// <param name="startState">An equilibrium, or a guess close to one.</param>
    /// <param name="parameters">All parameter values; the continuation parameter starts at its entry.</param>
    /// <param name="options">Range, direction, steps, bounds.</param>
    /// <returns>The branch; if tracing stopped early the computed part is kept and <see cref="Branch.EndedEarly"/> is set with the reason.</returns>
    public static Branch Trace(IParametricSystem system, int parameterIndex, ReadOnlySpan<double> startState, ReadOnlySpan<double> parameters, ContinuationOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(options);
        ParameterLookup.CheckIndex(system, parameterIndex);
        int n = system.Dimension;
        if (startState.Length != n)
            throw new ArgumentException($"The start state has {startState.Length} entries; the system has {n} state variables.", nameof(startState));
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"Got {parameters.Length} parameter values; the system has {system.ParameterCount} parameters.", nameof(parameters));
        string name = system.GetParameterName(parameterIndex);
        options.Validate(n, parameters[parameterIndex], name);

        var d = new SystemDerivatives(system, options.Time, parameters);
        var polished = SteadyState.Solve(d, startState, options.StartNewton with { Time = options.Time });
        if (!polished.Converged)
            throw new SteadyStateNotFoundException($"Cannot start continuation in '{name}': {polished.Diagnosis}", polished);

        var stateNames = (system as Models.IDescribedModel)?.Description.StateVariables.Select(v => v.Name).ToList();
        var tracer = new EquilibriumTracer(d, parameterIndex, options, stateNames);
        var u0 = new double[n + 1];
        polished.State.CopyTo(u0);
        u0[n] = parameters[parameterIndex];
        if (CheckStart(u0, parameters, options) is string bad)
            throw new ArgumentException($"The starting equilibrium is outside the allowed range: {bad}", nameof(startState));
        var t0 = new double[n + 1];
        if (!tracer.Stepper.InitialTangent(u0, n, t0, out int det))
            throw new SteadyStateNotFoundException($"Cannot start continuation in '{name}': the Jacobian [∂f/∂x ∂f/∂p] is rank-deficient at the start (a branch point?). Start from a nearby parameter value.", polished);
        if (t0[n] < 0) { Vec.Scale(t0, -1); det = -det; }
        var start = tracer.StartNode(u0, t0, det);
        var work = (double[])parameters.ToArray();
        switch (options.Direction)
        {
            case ContinuationDirection.Increasing:
                return tracer.Assemble(tracer.Run(start, +1), null, work);
            case ContinuationDirection.Decreasing:
                return tracer.Assemble(tracer.Run(start, -1), null, work);
            default:
                var reverse = tracer.Run(start, -1);
                var forward = tracer.Run(start, +1);
                return tracer.Assemble(forward, reverse, work);
        }
    }

    private static string? CheckStart(double[] u0, ReadOnlySpan<double> parameters, ContinuationOptions o)
    {
        int n = u0.Length - 1;
        for (int i = 0; i < n; i++)
        {
            if (o.StateMin is not null && u0[i] < o.StateMin[i]) return $"state variable {i} = {u0[i]:G6} is below StateMin = {o.StateMin[i]:G6}.";
            if (o.StateMax is not null && u0[i] > o.StateMax[i]) return $"state variable {i} = {u0[i]:G6} is above StateMax = {o.StateMax[i]:G6}.";
        }
        return o.Validity is null ? null : o.Validity(u0.AsSpan(0, n), parameters);
    }
}
