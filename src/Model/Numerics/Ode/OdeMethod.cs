namespace Thermostrat.Model.Numerics.Ode;

/// <summary>Integration method of <see cref="OdeSolver"/>.</summary>
public enum OdeMethod
{
    /// <summary>
    /// Starts with <see cref="DormandPrince54"/> and switches to <see cref="Rodas4"/> when the Hairer–Wanner
    /// stiffness test fires; the switch is reported in <see cref="SolveResult.MethodSwitches"/>.
    /// </summary>
    Auto = 0,

    /// <summary>
    /// Explicit Runge–Kutta 5(4) of Dormand and Prince (1980), J. Comput. Appl. Math. 6, 19, with local
    /// extrapolation, a PI step-size controller, Shampine's (1986) fourth-order continuous extension and
    /// the Hairer–Wanner stiffness detection (Solving ODEs II, Sect. IV.2). The default for non-stiff problems.
    /// </summary>
    DormandPrince54 = 1,

    /// <summary>
    /// Explicit Runge–Kutta 3(2) of Bogacki and Shampine (1989), Appl. Math. Lett. 2, 321, with cubic Hermite
    /// dense output: cheaper than <see cref="DormandPrince54"/> at loose tolerances (rtol ≳ 1e-4). No stiffness test.
    /// </summary>
    BogackiShampine32 = 2,

    /// <summary>
    /// Rosenbrock–Wanner method RODAS4 of Hairer and Wanner (Solving ODEs II, Sect. VI.4): order 4 with an
    /// embedded order-3 estimate, L-stable and stiffly accurate, order-3 dense output, using the exact
    /// Jacobian (dual numbers) and a dense LU factorisation per step, with Gustafsson's predictive step-size controller. For stiff problems.
    /// On stiff problems its steps can grow far beyond the output spacing while the step ends stay accurate; its continuous
    /// extension is then only O(h³) on the stiff components (measured on Prothero–Robinson), so bound
    /// <see cref="SolverOptions.MaxStep"/> when values between steps must meet the tolerance.
    /// </summary>
    Rodas4 = 3,

    /// <summary>Classical fourth-order Runge–Kutta with a fixed step (<see cref="SolverOptions.FixedStep"/> required); cubic Hermite dense output.</summary>
    RungeKutta4 = 4,

    /// <summary>
    /// Euler–Maruyama for dy = f dt + σ(t, y) dW (Itô, diagonal noise from <see cref="SolverOptions.Noise"/>), fixed step,
    /// strong order 1/2 and weak order 1 (Kloeden and Platen, Numerical Solution of SDEs, Sect. 9.1, 14.1);
    /// increments from a seeded generator (<see cref="SolverOptions.Seed"/>); linear interpolation between steps.
    /// </summary>
    EulerMaruyama = 5,
}
