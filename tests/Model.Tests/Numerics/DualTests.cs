using System.Globalization;
using System.Numerics;
using Thermostrat.Model.Numerics;
using Xunit;

namespace Thermostrat.Model.Tests.Numerics;

public class DualTests
{
    // Closed-form derivatives: standard tables (Abramowitz and Stegun, Handbook of Mathematical Functions,
    // ch. 4: logarithmic, exponential, circular, inverse circular, hyperbolic and inverse hyperbolic functions; from memory of the
    // standard table of derivatives, each also derivable in one line).
    public static TheoryData<string, double> Points => new()
    {
        { "exp", 0.7 }, { "exp2", -1.3 }, { "exp10", 0.4 }, { "expm1", 1e-3 }, { "log", 2.5 }, { "log2", 0.3 }, { "log10", 7.0 },
        { "logp1", 0.2 }, { "sqrt", 3.0 }, { "cbrt", -8.5 }, { "sin", 1.2 }, { "cos", -0.4 }, { "tan", 0.9 }, { "asin", 0.3 },
        { "acos", -0.6 }, { "atan", 2.0 }, { "sinh", 0.8 }, { "cosh", -1.1 }, { "tanh", 0.5 }, { "asinh", -2.0 }, { "acosh", 1.7 },
        { "atanh", 0.45 }, { "sinpi", 0.3 }, { "cospi", 0.2 }, { "tanpi", 0.1 }, { "powconst", 1.9 }, { "powbase", 0.8 },
        { "rootn", 5.0 }, { "recip", -3.0 }, { "abs", -2.0 }, { "abs", 2.0 },
    };

    private static (Func<Dual, Dual> F, Func<double, double> Value, Func<double, double> Derivative) Case(string name) => name switch
    {
        "exp" => (Dual.Exp, Math.Exp, Math.Exp),
        "exp2" => (Dual.Exp2, x => Math.Pow(2, x), x => Math.Pow(2, x) * Math.Log(2)),
        "exp10" => (Dual.Exp10, x => Math.Pow(10, x), x => Math.Pow(10, x) * Math.Log(10)),
        "expm1" => (Dual.ExpM1, x => Math.Exp(x) - 1, Math.Exp),
        "log" => (Dual.Log, Math.Log, x => 1 / x),
        "log2" => (Dual.Log2, Math.Log2, x => 1 / (x * Math.Log(2))),
        "log10" => (Dual.Log10, Math.Log10, x => 1 / (x * Math.Log(10))),
        "logp1" => (Dual.LogP1, x => Math.Log(1 + x), x => 1 / (1 + x)),
        "sqrt" => (Dual.Sqrt, Math.Sqrt, x => 0.5 / Math.Sqrt(x)),
        "cbrt" => (Dual.Cbrt, Math.Cbrt, x => 1 / (3 * Math.Pow(Math.Abs(x), 2.0 / 3.0))),
        "sin" => (Dual.Sin, Math.Sin, Math.Cos),
        "cos" => (Dual.Cos, Math.Cos, x => -Math.Sin(x)),
        "tan" => (Dual.Tan, Math.Tan, x => 1 + Math.Tan(x) * Math.Tan(x)),
        "asin" => (Dual.Asin, Math.Asin, x => 1 / Math.Sqrt(1 - x * x)),
        "acos" => (Dual.Acos, Math.Acos, x => -1 / Math.Sqrt(1 - x * x)),
        "atan" => (Dual.Atan, Math.Atan, x => 1 / (1 + x * x)),
        "sinh" => (Dual.Sinh, Math.Sinh, Math.Cosh),
        "cosh" => (Dual.Cosh, Math.Cosh, Math.Sinh),
        "tanh" => (Dual.Tanh, Math.Tanh, x => 1 / (Math.Cosh(x) * Math.Cosh(x))),
        "asinh" => (Dual.Asinh, Math.Asinh, x => 1 / Math.Sqrt(x * x + 1)),
        "acosh" => (Dual.Acosh, Math.Acosh, x => 1 / Math.Sqrt(x * x - 1)),
        "atanh" => (Dual.Atanh, Math.Atanh, x => 1 / (1 - x * x)),
        "sinpi" => (Dual.SinPi, x => Math.Sin(Math.PI * x), x => Math.PI * Math.Cos(Math.PI * x)),
        "cospi" => (Dual.CosPi, x => Math.Cos(Math.PI * x), x => -Math.PI * Math.Sin(Math.PI * x)),
        "tanpi" => (Dual.TanPi, x => Math.Tan(Math.PI * x), x => Math.PI / (Math.Cos(Math.PI * x) * Math.Cos(Math.PI * x))),
        "powconst" => (x => Dual.Pow(x, 3.7), x => Math.Pow(x, 3.7), x => 3.7 * Math.Pow(x, 2.7)),
        "powbase" => (x => Dual.Pow(2.3, x), x => Math.Pow(2.3, x), x => Math.Pow(2.3, x) * Math.Log(2.3)),
        "rootn" => (x => Dual.RootN(x, 5), x => Math.Pow(x, 0.2), x => 0.2 * Math.Pow(x, -0.8)),
        "recip" => (x => 1.0 / x, x => 1 / x, x => -1 / (x * x)),
        "abs" => (Dual.Abs, Math.Abs, x => Math.Sign(x)),
        _ => throw new ArgumentOutOfRangeException(nameof(name), name, "unknown case"),
    };

    [Theory]
    [MemberData(nameof(Points))]
    public void ElementaryDerivativeMatchesClosedForm(string name, double x)
    {
        var (f, value, derivative) = Case(name);
        Dual r = f(Dual.Variable(x));
        Assert.Equal(value(x), r.Value, 1e-14 * Math.Max(1, Math.Abs(value(x))));
        Assert.Equal(derivative(x), r.Derivative, 1e-13 * Math.Max(1, Math.Abs(derivative(x))));
    }

    [Theory]
    [MemberData(nameof(Points))]
    public void DerivativeScalesWithSeed(string name, double x)
    {
        // Chain rule: seeding with derivative s multiplies the result derivative by s (linearity of the tangent map).
        var (f, _, _) = Case(name);
        double d1 = f(Dual.Variable(x)).Derivative;
        double d3 = f(new Dual(x, -3.0)).Derivative;
        Assert.Equal(-3.0 * d1, d3, 1e-13 * Math.Max(1, Math.Abs(d3)));
    }

    public static TheoryData<string> ComplexCases => new() { "exp", "log", "sqrt", "sin", "cos", "tan", "sinh", "cosh", "tanh", "asin", "acos" };
    // (Complex.Atan is left out: its log formula loses an imaginary part of 1e-20 to cancellation, so it is no complex-step reference.)

    [Theory]
    [MemberData(nameof(ComplexCases))]
    public void DerivativeMatchesComplexStep(string name)
    {
        // Complex-step differentiation (Squire and Trapp 1998, SIAM Review 40, 110): f'(x) = Im f(x + ih)/h + O(h²),
        // with no cancellation, so h = 1e-20 gives f' to machine precision. Reference: System.Numerics.Complex.
        Func<Complex, Complex> g = name switch
        {
            "exp" => Complex.Exp, "log" => Complex.Log, "sqrt" => Complex.Sqrt, "sin" => Complex.Sin, "cos" => Complex.Cos,
            "tan" => Complex.Tan, "sinh" => Complex.Sinh, "cosh" => Complex.Cosh, "tanh" => Complex.Tanh,
            "asin" => Complex.Asin, "acos" => Complex.Acos,
            _ => throw new ArgumentOutOfRangeException(nameof(name)),
        };
        var (f, _, _) = Case(name);
        foreach (double x in new[] { 0.15, 0.55, 0.85 })
        {
            const double h = 1e-20;
            double reference = g(new Complex(x, h)).Imaginary / h;
            Assert.Equal(reference, f(Dual.Variable(x)).Derivative, 1e-13 * Math.Max(1, Math.Abs(reference)));
        }
    }

    [Fact]
    public void ArithmeticFollowsProductAndQuotientRules()
    {
        var a = new Dual(3.0, 2.0);
        var b = new Dual(-1.5, 0.5);
        Assert.Equal(new[] { 1.5, 2.5 }, Parts(a + b));
        Assert.Equal(new[] { 4.5, 1.5 }, Parts(a - b));
        Assert.Equal(new[] { -4.5, 2 * -1.5 + 3 * 0.5 }, Parts(a * b)); // (ab)' = a'b + ab'
        Assert.Equal(-2.0, (a / b).Value);
        Assert.Equal((2.0 * -1.5 - 3.0 * 0.5) / (1.5 * 1.5), (a / b).Derivative, 1e-15); // (a/b)' = (a'b − ab')/b²
        Assert.Equal(new[] { -3.0, -2.0 }, Parts(-a));
        Assert.Equal(new[] { 6.0, 4.0 }, Parts(a * 2.0));
        Assert.Equal(new[] { 5.0, 2.0 }, Parts(2.0 + a));
        Assert.Equal(new[] { 4.0, 2.0 }, Parts(++a));
    }

    [Fact]
    public void BinaryFunctionsDifferentiateBothArguments()
    {
        // Partial derivatives by hand: ∂/∂y atan2(y, x) = x/(x²+y²), ∂/∂x = −y/(x²+y²);
        // ∂/∂x xʸ = y x^(y−1), ∂/∂y xʸ = xʸ ln x; ∂ hypot = x/h, y/h.
        double x = 1.3, y = -0.7, r2 = x * x + y * y;
        Assert.Equal(x / r2, Dual.Atan2(Dual.Variable(y), x).Derivative, 1e-15);
        Assert.Equal(-y / r2, Dual.Atan2(y, Dual.Variable(x)).Derivative, 1e-15);
        Assert.Equal(Math.Atan2(y, x), Dual.Atan2(y, x).Value);
        Assert.Equal(x / r2 / Math.PI, Dual.Atan2Pi(Dual.Variable(y), x).Derivative, 1e-15);
        Assert.Equal(2.5 * Math.Pow(x, 1.5), Dual.Pow(Dual.Variable(x), 2.5).Derivative, 1e-14);
        Assert.Equal(Math.Pow(x, 2.5) * Math.Log(x), Dual.Pow(x, Dual.Variable(2.5)).Derivative, 1e-14);
        // both seeded: total derivative is the sum of the partials
        Assert.Equal(2.5 * Math.Pow(x, 1.5) + Math.Pow(x, 2.5) * Math.Log(x), Dual.Pow(Dual.Variable(x), Dual.Variable(2.5)).Derivative, 1e-14);
        Assert.Equal(x / Math.Sqrt(r2), Dual.Hypot(Dual.Variable(x), y).Derivative, 1e-15);
        // Constant integer exponent works for a negative base (no logarithm taken).
        Assert.Equal(3 * 4.0, Dual.Pow(Dual.Variable(-2.0), 3.0).Derivative, 1e-14);
        Assert.Equal(0.0, Dual.Pow(Dual.Variable(0.0), 2.0).Derivative);
        var fma = Dual.FusedMultiplyAdd(new Dual(2, 1), new Dual(3, 4), new Dual(5, 6));
        Assert.Equal(new[] { 11.0, 1 * 3 + 2 * 4 + 6.0 }, Parts(fma));
        var rem = new Dual(7.5, 1.0) % new Dual(2.0, 1.0); // 7.5 − 3·2, derivative 1 − 3·1
        Assert.Equal(new[] { 1.5, -2.0 }, Parts(rem));
        var ieee = Dual.Ieee754Remainder(new Dual(7.5, 1.0), new Dual(2.0, 1.0)); // 7.5 − 4·2 (round half to even), derivative 1 − 4
        Assert.Equal(new[] { -0.5, -3.0 }, Parts(ieee));
        Assert.Equal(new[] { 12.0, 4.0 }, Parts(Dual.ScaleB(new Dual(3, 1), 2)));
    }

    [Fact]
    public void SelectionAndComparisonActOnValues()
    {
        var a = new Dual(1.0, 10.0);
        var b = new Dual(2.0, 20.0);
        Assert.Equal(20.0, Dual.Max(a, b).Derivative);
        Assert.Equal(10.0, Dual.Min(a, b).Derivative);
        Assert.Equal(10.0, Dual.Clamp(a, 0.0, 3.0).Derivative);
        Assert.Equal(0.0, Dual.Clamp(a, 1.5, 3.0).Derivative);
        Assert.True(a < b && b > a && a <= b && a != b);
        Assert.True(new Dual(1.0, 5.0) == new Dual(1.0, -5.0)); // equality by value, documented
        Assert.True(Dual.IsNaN(Dual.Max(Dual.NaN, a)));
        Assert.Equal(new[] { -1.0, -10.0 }, Parts(Dual.CopySign(a, -3.0)));
        Assert.Equal(-1, Dual.Sign(new Dual(-4.0, 1.0)));
        Assert.Equal(0.0, Dual.Floor(new Dual(2.7, 1.0)).Derivative);
        Assert.Equal(2.0, Dual.Floor(new Dual(2.7, 1.0)).Value);
        Assert.Equal(0.0, Dual.BitIncrement(a).Derivative);
        Assert.Equal(double.BitIncrement(1.0), Dual.BitIncrement(a).Value);
        Assert.Equal(-1, a.CompareTo(b));
        Assert.True(Dual.IsFinite(a) && !Dual.IsFinite(Dual.PositiveInfinity));
    }

    [Fact]
    public void ConversionsParsingAndFormattingUseTheValue()
    {
        Assert.Equal(new[] { 3.0, 0.0 }, Parts(Dual.CreateChecked(3)));
        Assert.Equal(new[] { 2.5, 0.0 }, Parts(Dual.CreateChecked(2.5f)));
        Assert.Equal(new[] { 1.25, 0.0 }, Parts(Dual.CreateTruncating(1.25m)));
        Assert.Equal(7, int.CreateChecked(new Dual(7.0, 3.0)));
        Assert.Equal(7, int.CreateTruncating(new Dual(7.9, 3.0)));
        Assert.Equal(int.MaxValue, int.CreateSaturating(new Dual(1e20, 0.0)));
        Assert.Equal(2.5, double.CreateChecked(new Dual(2.5, 1.0)));
        Assert.Throws<OverflowException>(() => int.CreateChecked(new Dual(1e20, 0.0)));
        Assert.Equal(new[] { 4.0, 1.0 }, Parts(Dual.CreateChecked(new Dual(4.0, 1.0))));
        Assert.Equal(new[] { -12.5, 0.0 }, Parts(Dual.Parse("-12.5", CultureInfo.InvariantCulture)));
        Assert.True(Dual.TryParse("1e-3".AsSpan(), NumberStyles.Float, CultureInfo.InvariantCulture, out var p) && p.Value == 1e-3);
        Assert.False(Dual.TryParse("abc", CultureInfo.InvariantCulture, out _));
        Assert.Equal("0.1", new Dual(0.1, 9.0).ToString());
        Assert.Equal("3.14", new Dual(Math.PI, 1.0).ToString("F2", CultureInfo.InvariantCulture));
        Assert.Equal("2", $"{new Dual(2.0, 1.0)}");
    }

    [Fact]
    public void GenericCodeGivesTheSameValueForDoubleAndDual()
    {
        // A generic function f(x) = x³ − 2x + exp(x)/(1 + x²); f'(x) = 3x² − 2 + eˣ(1 + x² − 2x)/(1 + x²)² by hand.
        static T F<T>(T x) where T : IFloatingPointIeee754<T> => x * x * x - T.CreateChecked(2) * x + T.Exp(x) / (T.One + x * x);
        double x = 0.9;
        Dual r = F(Dual.Variable(x));
        Assert.Equal(F(x), r.Value);
        double exact = 3 * x * x - 2 + Math.Exp(x) * (1 + x * x - 2 * x) / Math.Pow(1 + x * x, 2);
        Assert.Equal(exact, r.Derivative, 1e-14);
    }

    private static double[] Parts(Dual d) => [d.Value, d.Derivative];
}
