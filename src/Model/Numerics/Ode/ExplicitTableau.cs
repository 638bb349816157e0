namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// An explicit Runge–Kutta method as data: Butcher coefficients c, A, b in "first same as last" form (the last
/// stage is f(t + h, y_{n+1}), which is the next step's first stage), the error weights E = b − b̂ of its embedded
/// formula, and the dense-output polynomials. One stepping loop (<see cref="ExplicitRungeKuttaStepper"/>) runs them all.
/// </summary>
internal sealed class ExplicitTableau
{
    /// <summary>Method name for messages.</summary>
    public required OdeMethod Method { get; init; }

    /// <summary>Where the coefficients come from.</summary>
    public required string Source { get; init; }

    /// <summary>Order of the propagated solution.</summary>
    public required int Order { get; init; }

    /// <summary>Order of the embedded formula (the error estimate is O(h^(ErrorOrder+1))); 0 if there is none.</summary>
    public required int ErrorOrder { get; init; }

    /// <summary>Nodes c_s, one per stage including the final f(t + h, y_{n+1}) stage.</summary>
    public required double[] C { get; init; }

    /// <summary>Row s holds a_{s,0..s−1}; the last row equals <see cref="B"/> without its last entry.</summary>
    public required double[][] A { get; init; }

    /// <summary>Solution weights b_s (the last, the FSAL stage, is 0).</summary>
    public required double[] B { get; init; }

    /// <summary>Error weights b_s − b̂_s, or null for a method without an embedded estimate.</summary>
    public double[]? E { get; init; }

    /// <summary>
    /// Dense output: y(t + θh) = y_n + h Σ_s K_s Σ_m P[s][m] θ^(m+1), for θ ∈ [0, 1].
    /// </summary>
    public required double[][] P { get; init; }

    /// <summary>Stages (j, k) with equal nodes whose difference gives the Hairer–Wanner stiffness estimate, or null.</summary>
    public (int First, int Second)? StiffnessStages { get; init; }

    /// <summary>Where the real negative axis leaves the stability region, |hλ| (used by the stiffness test).</summary>
    public double StabilityBoundary { get; init; }

    public int Stages => C.Length;

    /// <summary>
    /// Dormand–Prince 5(4), "DOPRI5": Dormand and Prince (1980), J. Comput. Appl. Math. 6, 19, Table 2 (the RK5(4)7M pair);
    /// dense output of order 4 from Shampine (1986), Math. Comp. 46, 135, with the coefficients as tabulated in SciPy's
    /// <c>scipy/integrate/_ivp/rk.py</c>. Stiffness test on stages 6 and 7 (c = 1 for both) with |hλ| boundary 3.25
    /// (Hairer and Wanner, Solving ODEs II, Sect. IV.2, and their DOPRI5 code).
    /// </summary>
    public static ExplicitTableau DormandPrince54 { get; } = new()
    {
        Method = OdeMethod.DormandPrince54,
        Source = "Dormand & Prince (1980), J. Comput. Appl. Math. 6, 19; dense output Shampine (1986), Math. Comp. 46, 135",
        Order = 5,
        ErrorOrder = 4,
        C = [0, 1.0 / 5, 3.0 / 10, 4.0 / 5, 8.0 / 9, 1, 1],
        A =
        [
            [],
            [1.0 / 5],
            [3.0 / 40, 9.0 / 40],
            [44.0 / 45, -56.0 / 15, 32.0 / 9],
            [19372.0 / 6561, -25360.0 / 2187, 64448.0 / 6561, -212.0 / 729],
            [9017.0 / 3168, -355.0 / 33, 46732.0 / 5247, 49.0 / 176, -5103.0 / 18656],
            [35.0 / 384, 0, 500.0 / 1113, 125.0 / 192, -2187.0 / 6784, 11.0 / 84],
        ],
        B = [35.0 / 384, 0, 500.0 / 1113, 125.0 / 192, -2187.0 / 6784, 11.0 / 84, 0],
        E = [-71.0 / 57600, 0, 71.0 / 16695, -71.0 / 1920, 17253.0 / 339200, -22.0 / 525, 1.0 / 40],
        P =
        [
            [1, -8048581381.0 / 2820520608, 8663915743.0 / 2820520608, -12715105075.0 / 11282082432],
            [0, 0, 0, 0],
            [0, 131558114200.0 / 32700410799, -68118460800.0 / 10900136933, 87487479700.0 / 32700410799],
            [0, -1754552775.0 / 470086768, 14199869525.0 / 1410260304, -10690763975.0 / 1880347072],
            [0, 127303824393.0 / 49829197408, -318862633887.0 / 49829197408, 701980252875.0 / 199316789632],
            [0, -282668133.0 / 205662961, 2019193451.0 / 616988883, -1453857185.0 / 822651844],
            [0, 40617522.0 / 29380423, -110615467.0 / 29380423, 69997945.0 / 29380423],
        ],
        StiffnessStages = (5, 6),
        StabilityBoundary = 3.25,
    };

    /// <summary>
    /// Bogacki–Shampine 3(2): Bogacki and Shampine (1989), Appl. Math. Lett. 2, 321; cubic Hermite dense output
    /// (Hairer, Nørsett and Wanner, Solving ODEs I, Sect. II.6), which for this FSAL pair is the interpolant the paper suggests.
    /// </summary>
    public static ExplicitTableau BogackiShampine32 { get; } = WithHermiteDense(new()
    {
        Method = OdeMethod.BogackiShampine32,
        Source = "Bogacki & Shampine (1989), Appl. Math. Lett. 2, 321",
        Order = 3,
        ErrorOrder = 2,
        C = [0, 1.0 / 2, 3.0 / 4, 1],
        A =
        [
            [],
            [1.0 / 2],
            [0, 3.0 / 4],
            [2.0 / 9, 1.0 / 3, 4.0 / 9],
        ],
        B = [2.0 / 9, 1.0 / 3, 4.0 / 9, 0],
        E = [5.0 / 72, -1.0 / 12, -1.0 / 9, 1.0 / 8],
        P = [],
    });

    /// <summary>
    /// The classical fourth-order Runge–Kutta method (Kutta 1901; Hairer, Nørsett and Wanner I, Sect. II.1, Table 1.2),
    /// written with an extra stage f(t + h, y_{n+1}) that is reused as the next step's first stage (no extra cost), which
    /// gives cubic Hermite dense output.
    /// </summary>
    public static ExplicitTableau RungeKutta4 { get; } = WithHermiteDense(new()
    {
        Method = OdeMethod.RungeKutta4,
        Source = "Kutta (1901); Hairer, Nørsett & Wanner, Solving ODEs I, Sect. II.1",
        Order = 4,
        ErrorOrder = 0,
        C = [0, 1.0 / 2, 1.0 / 2, 1, 1],
        A =
        [
            [],
            [1.0 / 2],
            [0, 1.0 / 2],
            [0, 0, 1],
            [1.0 / 6, 1.0 / 3, 1.0 / 3, 1.0 / 6],
        ],
        B = [1.0 / 6, 1.0 / 3, 1.0 / 3, 1.0 / 6, 0],
        P = [],
    });

    /// <summary>
    /// Cubic Hermite interpolation through (y_n, f_n) and (y_{n+1}, f_{n+1}), written in stage form: with y_{n+1} − y_n = hΣ b_s K_s,
    /// K_0 = f_n and K_last = f_{n+1}, y(θ) − y_n = h Σ_s K_s [b_s(3θ² − 2θ³) + δ_{s,0}(θ − 2θ² + θ³) + δ_{s,last}(θ³ − θ²)].
    /// </summary>
    private static ExplicitTableau WithHermiteDense(ExplicitTableau t)
    {
        int s = t.Stages;
        var p = new double[s][];
        for (int j = 0; j < s; j++)
        {
            double first = j == 0 ? 1 : 0, last = j == s - 1 ? 1 : 0;
            p[j] = [first, 3 * t.B[j] - 2 * first - last, -2 * t.B[j] + first + last];
        }
        return new ExplicitTableau
        {
            Method = t.Method, Source = t.Source, Order = t.Order, ErrorOrder = t.ErrorOrder,
            C = t.C, A = t.A, B = t.B, E = t.E, P = p, StiffnessStages = t.StiffnessStages, StabilityBoundary = t.StabilityBoundary,
        };
    }
}
