namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// A Rosenbrock–Wanner method as data, in the transformed form of Hairer and Wanner (Solving ODEs II, Sect. IV.7,
/// eq. 7.4'), which needs no matrix–vector products:
/// (I/(hγ) − J) U_i = f(t + α_i h, y + Σ_{j&lt;i} a_ij U_j) + Σ_{j&lt;i} (c_ij/h) U_j + h γ_i ∂f/∂t,
/// y_{n+1} = y_n + Σ m_i U_i, error estimate Σ e_i U_i.
/// </summary>
internal sealed class RosenbrockTableau
{
    public required OdeMethod Method { get; init; }
    public required string Source { get; init; }
    public required int Order { get; init; }
    public required int ErrorOrder { get; init; }

    /// <summary>The diagonal γ of the iteration matrix I/(hγ) − J.</summary>
    public required double Gamma { get; init; }

    /// <summary>Stage nodes α_i.</summary>
    public required double[] Alpha { get; init; }

    /// <summary>Row sums γ_i = Σ_j γ_ij, the weights of the ∂f/∂t term.</summary>
    public required double[] GammaSum { get; init; }

    /// <summary>Row i holds a_{i,0..i−1} (transformed).</summary>
    public required double[][] A { get; init; }

    /// <summary>Row i holds c_{i,0..i−1} (transformed).</summary>
    public required double[][] C { get; init; }

    /// <summary>Solution weights m_i.</summary>
    public required double[] M { get; init; }

    /// <summary>Error weights e_i.</summary>
    public required double[] E { get; init; }

    /// <summary>
    /// Dense output coefficients: k_r = Σ_i H[r][i] U_i for r = 0, 1, and
    /// y(t + θh) = (1 − θ) y_n + θ (y_{n+1} + (1 − θ)(k_0 + θ k_1)).
    /// </summary>
    public required double[][] H { get; init; }

    public int Stages => Alpha.Length;

    /// <summary>
    /// RODAS4: Hairer and Wanner, Solving ODEs II (2nd ed., Springer 1996), Sect. VI.4; 6 stages, order 4(3),
    /// L-stable, stiffly accurate (y_{n+1} = Y_6 + U_6, error U_6), order-3 dense output. Coefficients as distributed with
    /// the authors' RODAS code; A, C, α and γ_i cross-checked against the RODAS4 set in Sandu's FATODE (ROS_f90_Integrator.F90),
    /// and the order checked numerically by the convergence tests.
    /// </summary>
    public static RosenbrockTableau Rodas4 { get; } = CreateRodas4();

    private static RosenbrockTableau CreateRodas4()
    {
        double a51 = 1.221224509226641, a52 = 6.019134481288629, a53 = 12.53708332932087, a54 = -0.6878860361058950;
        return new RosenbrockTableau
        {
            Method = OdeMethod.Rodas4,
            Source = "Hairer & Wanner, Solving ODEs II, Sect. VI.4 (RODAS4)",
            Order = 4,
            ErrorOrder = 3,
            Gamma = 0.25,
            Alpha = [0, 0.386, 0.21, 0.63, 1, 1],
            GammaSum = [0.25, -0.1043, 0.1035, -0.03620000000000023, 0, 0],
            A =
            [
                [],
                [1.544000000000000],
                [0.9466785280815826, 0.2557011698983284],
                [3.314825187068521, 2.896124015972201, 0.9986419139977817],
                [a51, a52, a53, a54],
                [a51, a52, a53, a54, 1],
            ],
            C =
            [
                [],
                [-5.668800000000000],
                [-2.430093356833875, -0.2063599157091915],
                [-0.1073529058151375, -9.594562251023355, -20.47028614809616],
                [7.496443313967647, -10.24680431464352, -33.99990352819905, 11.70890893206160],
                [8.083246795921522, -7.981132988064893, -31.52159432874371, 16.31930543123136, -6.058818238834054],
            ],
            M = [a51, a52, a53, a54, 1, 1],
            E = [0, 0, 0, 0, 0, 1],
            H =
            [
                [10.12623508344586, -7.487995877610167, -34.80091861555747, -7.992771707568823, 1.025137723295662, 0],
                [-0.6762803392801253, 6.087714651680015, 16.43084320892478, 24.76722511418386, -6.594389125716872, 0],
            ],
        };
    }
}
