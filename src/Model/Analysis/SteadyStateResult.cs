using System.Collections.Immutable;

namespace Thermostrat.Model.Analysis;

/// <summary>Why a Newton iteration stopped without converging.</summary>
public enum NewtonFailure
{
    /// <summary>It converged.</summary>
    None,
    /// <summary>The iteration limit was reached.</summary>
    IterationLimit,
    /// <summary>The Jacobian was singular to working precision (a fold, a symmetric point, or a conserved quantity).</summary>
    SingularJacobian,
    /// <summary>No damped step reduced the residual (a local minimum of |f| that is not a root).</summary>
    LineSearchFailed,
    /// <summary>The right-hand side returned a non-finite value.</summary>
    NonFinite,
}

/// <summary>The outcome of a steady-state solve: the state, whether it converged, and a diagnosis if not.</summary>
public sealed record SteadyStateResult
{
    /// <summary>True when max |f| fell below the tolerance.</summary>
    public required bool Converged { get; init; }

    /// <summary>The final iterate (the equilibrium when converged).</summary>
    public required ImmutableArray<double> State { get; init; }

    /// <summary>The parameter values the equilibrium belongs to.</summary>
    public required ImmutableArray<double> Parameters { get; init; }

    /// <summary>max_i |f_i| at <see cref="State"/>.</summary>
    public required double Residual { get; init; }

    /// <summary>Newton iterations taken.</summary>
    public required int Iterations { get; init; }

    /// <summary>Why it failed (None when converged).</summary>
    public required NewtonFailure Failure { get; init; }

    /// <summary>The step fraction of the last line search (1 = full Newton step).</summary>
    public double LastDamping { get; init; } = 1;

    /// <summary>A sentence or two a user can act on: what happened and what to try. Empty when converged.</summary>
    public string Diagnosis { get; init; } = "";
}

/// <summary>Equilibria found from several starting states.</summary>
public sealed record MultiStartResult
{
    /// <summary>The distinct converged equilibria, in the order first found.</summary>
    public required IReadOnlyList<SteadyStateResult> Equilibria { get; init; }

    /// <summary>The result from every starting state, in input order.</summary>
    public required IReadOnlyList<SteadyStateResult> PerStart { get; init; }

    /// <summary>For each starting state, the index into <see cref="Equilibria"/> it converged to, or −1.</summary>
    public required IReadOnlyList<int> EquilibriumIndexPerStart { get; init; }
}

/// <summary>Thrown when an analysis needs an equilibrium to start from and Newton's method does not find one.</summary>
public sealed class SteadyStateNotFoundException : Exception
{
    /// <summary>Creates the exception with the failed solve attached.</summary>
    public SteadyStateNotFoundException(string message, SteadyStateResult result) : base(message) => Result = result;

    /// <summary>The failed solve: residual, iterations, reason.</summary>
    public SteadyStateResult Result { get; }
}
