namespace Thermostrat.Model.Orbital;

/// <summary>A real function of one variable (an integrand or an equation); a struct so that calls are inlined and allocate nothing.</summary>
internal interface IRealFunction
{
    double Evaluate(double x);
}

/// <summary>
/// Adaptive 7-point Gauss / 15-point Kronrod quadrature (Piessens, de Doncker-Kapenga, Überhuber and
/// Kahaner, QUADPACK, 1983; nodes and weights as in its routine QK15). An interval whose Gauss and
/// Kronrod estimates differ by more than its share of the tolerance is bisected.
/// </summary>
internal static class GaussKronrod
{
    // Kronrod nodes (positive half, descending) and weights; nodes 1, 3, 5 and 7 are the Gauss nodes.
    private static ReadOnlySpan<double> Nodes =>
    [
        0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
        0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
        0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
        0.207784955007898467600689403773245, 0.0,
    ];

    private static ReadOnlySpan<double> KronrodWeights =>
    [
        0.022935322010529224963732008058970, 0.063092092629978553290700663189204,
        0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
        0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
        0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
    ];

    private static ReadOnlySpan<double> GaussWeights =>
    [
        0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
        0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
    ];

    /// <summary>Default relative tolerance: near double precision, limited by rounding in the sums.</summary>
    public const double DefaultRelativeTolerance = 1e-11;

    /// <summary>Deepest bisection; 2⁻⁴⁰ of the interval is far below any feature of the integrands here.</summary>
    private const int MaxDepth = 40;

    /// <summary>One 15-point Kronrod estimate on [a, b] and its difference from the 7-point Gauss estimate.</summary>
    public static double Rule<TF>(in TF f, double a, double b, out double errorEstimate) where TF : struct, IRealFunction
    {
        double center = 0.5 * (a + b), half = 0.5 * (b - a);
        double fc = f.Evaluate(center);
        double kronrod = fc * KronrodWeights[7];
        double gauss = fc * GaussWeights[3];
        for (int j = 0; j < 7; j++)
        {
            double dxj = half * Nodes[j];
            double sum = f.Evaluate(center - dxj) + f.Evaluate(center + dxj);
            kronrod += KronrodWeights[j] * sum;
            if ((j & 1) == 1) gauss += GaussWeights[j >> 1] * sum;
        }
        errorEstimate = Math.Abs((kronrod - gauss) * half);
        return kronrod * half;
    }

    /// <summary>
    /// ∫ f over [a, b] to about max(<paramref name="absoluteTolerance"/>, <paramref name="relativeTolerance"/>·|I|).
    /// </summary>
    public static double Integrate<TF>(in TF f, double a, double b, double absoluteTolerance, double relativeTolerance = DefaultRelativeTolerance)
        where TF : struct, IRealFunction
    {
        if (b == a) return 0.0;
        double whole = Rule(f, a, b, out double err);
        double tolerance = Math.Max(absoluteTolerance, relativeTolerance * Math.Abs(whole));
        if (err <= tolerance) return whole;
        return Refine(f, a, b, tolerance, 0);
    }

    private static double Refine<TF>(in TF f, double a, double b, double tolerance, int depth) where TF : struct, IRealFunction
    {
        double mid = 0.5 * (a + b);
        double left = Rule(f, a, mid, out double errLeft);
        double right = Rule(f, mid, b, out double errRight);
        if (errLeft + errRight <= tolerance || depth >= MaxDepth || mid <= a || mid >= b)
            return left + right;
        double half = 0.5 * tolerance;
        double l = errLeft <= half ? left : Refine(f, a, mid, half, depth + 1);
        double r = errRight <= half ? right : Refine(f, mid, b, half, depth + 1);
        return l + r;
    }
}
