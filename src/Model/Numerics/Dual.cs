using System.Diagnostics;
using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Numerics;

/// <summary>
/// A forward-mode dual number a + b·ε with ε² = 0: a <see cref="Value"/> and one directional
/// <see cref="Derivative"/>. Evaluating any function written against
/// <see cref="IFloatingPointIeee754{TSelf}"/> on duals gives its value and, exactly (to rounding),
/// its derivative along the seeded direction.
/// </summary>
/// <remarks>
/// <para>Rules: (a, a′)·(b, b′) = (ab, a′b + ab′); f(a, a′) = (f(a), f′(a)·a′) for every elementary
/// function (chain rule; e.g. Griewank and Walther, <i>Evaluating Derivatives</i>, 2nd ed., SIAM 2008, ch. 3).</para>
/// <para>Comparisons, equality, hashing, classification (<see cref="IsNaN"/>, <see cref="IsFinite"/>, ...),
/// parsing and formatting act on the value alone, so branches in model code behave exactly as they
/// do for <see cref="double"/>. <see cref="Max"/>/<see cref="Min"/> and relatives return the selected
/// operand whole (value and derivative). Piecewise-constant functions (floor, round, sign, bit
/// increments) and other members with no meaningful derivative act on the value and carry a zero
/// derivative. <see cref="Abs"/> uses the derivative of the branch selected by the sign bit
/// (+a′ for +0, −a′ for −0).</para>
/// </remarks>
[DebuggerDisplay("{Value} + {Derivative}ε")]
public readonly struct Dual : IFloatingPointIeee754<Dual>, IMinMaxValue<Dual>
{
    /// <summary>The value a.</summary>
    public double Value { get; }

    /// <summary>The directional derivative a′ (the coefficient of ε).</summary>
    public double Derivative { get; }

    /// <summary>Creates a + b·ε.</summary>
    /// <param name="value">The value a.</param>
    /// <param name="derivative">The derivative b.</param>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public Dual(double value, double derivative)
    {
        Value = value;
        Derivative = derivative;
    }

    /// <summary>An independent variable: value <paramref name="x"/>, derivative 1.</summary>
    public static Dual Variable(double x) => new(x, 1.0);

    /// <summary>A constant: value <paramref name="x"/>, derivative 0.</summary>
    public static Dual Constant(double x) => new(x, 0.0);

    /// <summary>A constant dual (derivative 0).</summary>
    public static implicit operator Dual(double x) => new(x, 0.0);

    /// <summary>The value part (the derivative is dropped).</summary>
    public static explicit operator double(Dual x) => x.Value;

    // ---------------------------------------------------------------- constants

    /// <inheritdoc/>
    public static Dual One => new(1.0, 0.0);
    /// <inheritdoc/>
    public static Dual Zero => new(0.0, 0.0);
    /// <inheritdoc/>
    public static Dual NegativeOne => new(-1.0, 0.0);
    /// <inheritdoc/>
    public static int Radix => 2;
    /// <inheritdoc/>
    public static Dual AdditiveIdentity => Zero;
    /// <inheritdoc/>
    public static Dual MultiplicativeIdentity => One;
    /// <inheritdoc/>
    public static Dual E => new(Math.E, 0.0);
    /// <inheritdoc/>
    public static Dual Pi => new(Math.PI, 0.0);
    /// <inheritdoc/>
    public static Dual Tau => new(Math.Tau, 0.0);
    /// <inheritdoc/>
    public static Dual Epsilon => new(double.Epsilon, 0.0);
    /// <inheritdoc/>
    public static Dual NaN => new(double.NaN, 0.0);
    /// <inheritdoc/>
    public static Dual NegativeInfinity => new(double.NegativeInfinity, 0.0);
    /// <inheritdoc/>
    public static Dual PositiveInfinity => new(double.PositiveInfinity, 0.0);
    /// <inheritdoc/>
    public static Dual NegativeZero => new(-0.0, 0.0);
    /// <inheritdoc/>
    public static Dual MaxValue => new(double.MaxValue, 0.0);
    /// <inheritdoc/>
    public static Dual MinValue => new(double.MinValue, 0.0);

    // ---------------------------------------------------------------- arithmetic

    /// <inheritdoc/>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator +(Dual a, Dual b) => new(a.Value + b.Value, a.Derivative + b.Derivative);
    /// <summary>Adds a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator +(Dual a, double b) => new(a.Value + b, a.Derivative);
    /// <summary>Adds a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator +(double a, Dual b) => new(a + b.Value, b.Derivative);
    /// <inheritdoc/>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator -(Dual a, Dual b) => new(a.Value - b.Value, a.Derivative - b.Derivative);
    /// <summary>Subtracts a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator -(Dual a, double b) => new(a.Value - b, a.Derivative);
    /// <summary>Subtracts from a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator -(double a, Dual b) => new(a - b.Value, -b.Derivative);
    /// <inheritdoc/>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator *(Dual a, Dual b) => new(a.Value * b.Value, a.Derivative * b.Value + a.Value * b.Derivative);
    /// <summary>Multiplies by a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator *(Dual a, double b) => new(a.Value * b, a.Derivative * b);
    /// <summary>Multiplies by a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator *(double a, Dual b) => new(a * b.Value, a * b.Derivative);
    /// <inheritdoc/>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator /(Dual a, Dual b)
    {
        double q = a.Value / b.Value;
        return new(q, (a.Derivative - q * b.Derivative) / b.Value);
    }
    /// <summary>Divides by a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator /(Dual a, double b) => new(a.Value / b, a.Derivative / b);
    /// <summary>Divides a constant.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator /(double a, Dual b)
    {
        double q = a / b.Value;
        return new(q, -q * b.Derivative / b.Value);
    }
    /// <summary>Truncated remainder a − b·trunc(a/b), as for <see cref="double"/>; derivative a′ − trunc(a/b)·b′.</summary>
    public static Dual operator %(Dual a, Dual b)
    {
        double r = a.Value % b.Value;
        double n = Math.Round((a.Value - r) / b.Value); // the integer quotient trunc(a/b)
        return new(r, a.Derivative - n * b.Derivative);
    }
    /// <inheritdoc/>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static Dual operator -(Dual a) => new(-a.Value, -a.Derivative);
    /// <inheritdoc/>
    public static Dual operator +(Dual a) => a;
    /// <inheritdoc/>
    public static Dual operator ++(Dual a) => new(a.Value + 1.0, a.Derivative);
    /// <inheritdoc/>
    public static Dual operator --(Dual a) => new(a.Value - 1.0, a.Derivative);

    // ---------------------------------------------------------------- comparison (by value)

    /// <summary>Equality of values (derivatives are ignored).</summary>
    public static bool operator ==(Dual a, Dual b) => a.Value == b.Value;
    /// <summary>Inequality of values (derivatives are ignored).</summary>
    public static bool operator !=(Dual a, Dual b) => a.Value != b.Value;
    /// <inheritdoc/>
    public static bool operator <(Dual a, Dual b) => a.Value < b.Value;
    /// <inheritdoc/>
    public static bool operator >(Dual a, Dual b) => a.Value > b.Value;
    /// <inheritdoc/>
    public static bool operator <=(Dual a, Dual b) => a.Value <= b.Value;
    /// <inheritdoc/>
    public static bool operator >=(Dual a, Dual b) => a.Value >= b.Value;

    /// <summary>Compares values, as <see cref="double.CompareTo(double)"/>.</summary>
    public int CompareTo(Dual other) => Value.CompareTo(other.Value);

    /// <summary>Compares values; <paramref name="obj"/> must be a <see cref="Dual"/>, a <see cref="double"/> or null.</summary>
    public int CompareTo(object? obj) => obj switch
    {
        null => 1,
        Dual d => CompareTo(d),
        double x => Value.CompareTo(x),
        _ => throw new ArgumentException($"Cannot compare a Dual with an object of type {obj.GetType().FullName}; allowed: Dual, Double or null.", nameof(obj)),
    };

    /// <summary>Equality of values, as <see cref="double.Equals(double)"/> (NaN equals NaN).</summary>
    public bool Equals(Dual other) => Value.Equals(other.Value);

    /// <inheritdoc/>
    public override bool Equals(object? obj) => obj is Dual d && Equals(d);

    /// <inheritdoc/>
    public override int GetHashCode() => Value.GetHashCode();

    // ---------------------------------------------------------------- classification (by value)

    /// <inheritdoc/>
    public static bool IsCanonical(Dual value) => true;
    /// <inheritdoc/>
    public static bool IsComplexNumber(Dual value) => false;
    /// <inheritdoc/>
    public static bool IsEvenInteger(Dual value) => double.IsEvenInteger(value.Value);
    /// <inheritdoc/>
    public static bool IsFinite(Dual value) => double.IsFinite(value.Value);
    /// <inheritdoc/>
    public static bool IsImaginaryNumber(Dual value) => false;
    /// <inheritdoc/>
    public static bool IsInfinity(Dual value) => double.IsInfinity(value.Value);
    /// <inheritdoc/>
    public static bool IsInteger(Dual value) => double.IsInteger(value.Value);
    /// <inheritdoc/>
    public static bool IsNaN(Dual value) => double.IsNaN(value.Value);
    /// <inheritdoc/>
    public static bool IsNegative(Dual value) => double.IsNegative(value.Value);
    /// <inheritdoc/>
    public static bool IsNegativeInfinity(Dual value) => double.IsNegativeInfinity(value.Value);
    /// <inheritdoc/>
    public static bool IsNormal(Dual value) => double.IsNormal(value.Value);
    /// <inheritdoc/>
    public static bool IsOddInteger(Dual value) => double.IsOddInteger(value.Value);
    /// <inheritdoc/>
    public static bool IsPositive(Dual value) => double.IsPositive(value.Value);
    /// <inheritdoc/>
    public static bool IsPositiveInfinity(Dual value) => double.IsPositiveInfinity(value.Value);
    /// <inheritdoc/>
    public static bool IsRealNumber(Dual value) => double.IsRealNumber(value.Value);
    /// <inheritdoc/>
    public static bool IsSubnormal(Dual value) => double.IsSubnormal(value.Value);
    /// <inheritdoc/>
    public static bool IsZero(Dual value) => value.Value == 0.0;
    /// <inheritdoc/>
    public static bool IsPow2(Dual value) => double.IsPow2(value.Value);

    // ---------------------------------------------------------------- selection

    /// <summary>|a|, derivative sign(a)·a′ with the sign taken from the sign bit.</summary>
    public static Dual Abs(Dual value) => double.IsNegative(value.Value) ? -value : value;

    /// <summary>The larger operand (whole); NaN if either is NaN, +0 preferred over −0, as <see cref="double.Max"/>.</summary>
    public static Dual Max(Dual x, Dual y) => Pick(double.Max(x.Value, y.Value), x, y);
    /// <summary>The smaller operand (whole); NaN if either is NaN, −0 preferred over +0, as <see cref="double.Min"/>.</summary>
    public static Dual Min(Dual x, Dual y) => Pick(double.Min(x.Value, y.Value), x, y);
    /// <summary>The larger operand (whole), ignoring a NaN operand, as <see cref="double.MaxNumber"/>.</summary>
    public static Dual MaxNumber(Dual x, Dual y) => Pick(double.MaxNumber(x.Value, y.Value), x, y);
    /// <summary>The smaller operand (whole), ignoring a NaN operand, as <see cref="double.MinNumber"/>.</summary>
    public static Dual MinNumber(Dual x, Dual y) => Pick(double.MinNumber(x.Value, y.Value), x, y);
    /// <summary>The operand of larger magnitude (whole), as <see cref="double.MaxMagnitude"/>.</summary>
    public static Dual MaxMagnitude(Dual x, Dual y) => Pick(double.MaxMagnitude(x.Value, y.Value), x, y);
    /// <summary>The operand of smaller magnitude (whole), as <see cref="double.MinMagnitude"/>.</summary>
    public static Dual MinMagnitude(Dual x, Dual y) => Pick(double.MinMagnitude(x.Value, y.Value), x, y);
    /// <summary>The operand of larger magnitude (whole), ignoring NaN, as <see cref="double.MaxMagnitudeNumber"/>.</summary>
    public static Dual MaxMagnitudeNumber(Dual x, Dual y) => Pick(double.MaxMagnitudeNumber(x.Value, y.Value), x, y);
    /// <summary>The operand of smaller magnitude (whole), ignoring NaN, as <see cref="double.MinMagnitudeNumber"/>.</summary>
    public static Dual MinMagnitudeNumber(Dual x, Dual y) => Pick(double.MinMagnitudeNumber(x.Value, y.Value), x, y);

    /// <summary><paramref name="value"/> clamped to [<paramref name="min"/>, <paramref name="max"/>]; the selected operand is returned whole.</summary>
    public static Dual Clamp(Dual value, Dual min, Dual max)
    {
        if (min.Value > max.Value)
            throw new ArgumentException($"Clamp needs min <= max; got min = {min.Value}, max = {max.Value}.", nameof(min));
        return Min(Max(value, min), max);
    }

    /// <summary>Magnitude of <paramref name="value"/> with the sign of <paramref name="sign"/>; derivative flips with the value.</summary>
    public static Dual CopySign(Dual value, Dual sign)
    {
        double v = double.CopySign(value.Value, sign.Value);
        bool flipped = double.IsNegative(v) != double.IsNegative(value.Value);
        return new(v, flipped ? -value.Derivative : value.Derivative);
    }

    /// <summary>Sign of the value (−1, 0, +1); throws <see cref="ArithmeticException"/> for NaN, as <see cref="double.Sign(double)"/>.</summary>
    public static int Sign(Dual value) => Math.Sign(value.Value);

    private static Dual Pick(double chosen, Dual x, Dual y)
    {
        if (double.IsNaN(chosen)) return NaN;
        // Compare bit patterns so that +0/−0 picks the operand the double routine picked.
        if (BitConverter.DoubleToInt64Bits(chosen) == BitConverter.DoubleToInt64Bits(x.Value)) return x;
        return y;
    }

    // ---------------------------------------------------------------- rounding (zero derivative)

    /// <inheritdoc/>
    public static Dual Ceiling(Dual x) => new(Math.Ceiling(x.Value), 0.0);
    /// <inheritdoc/>
    public static Dual Floor(Dual x) => new(Math.Floor(x.Value), 0.0);
    /// <inheritdoc/>
    public static Dual Truncate(Dual x) => new(Math.Truncate(x.Value), 0.0);
    /// <inheritdoc/>
    public static Dual Round(Dual x) => new(Math.Round(x.Value), 0.0);
    /// <inheritdoc/>
    public static Dual Round(Dual x, int digits) => new(Math.Round(x.Value, digits), 0.0);
    /// <inheritdoc/>
    public static Dual Round(Dual x, MidpointRounding mode) => new(Math.Round(x.Value, mode), 0.0);
    /// <inheritdoc/>
    public static Dual Round(Dual x, int digits, MidpointRounding mode) => new(Math.Round(x.Value, digits, mode), 0.0);
    /// <summary>Next representable value above; zero derivative.</summary>
    public static Dual BitIncrement(Dual x) => new(double.BitIncrement(x.Value), 0.0);
    /// <summary>Next representable value below; zero derivative.</summary>
    public static Dual BitDecrement(Dual x) => new(double.BitDecrement(x.Value), 0.0);
    /// <inheritdoc/>
    public static int ILogB(Dual x) => double.ILogB(x.Value);

    /// <summary>x·2ⁿ, derivative x′·2ⁿ.</summary>
    public static Dual ScaleB(Dual x, int n) => new(double.ScaleB(x.Value, n), double.ScaleB(x.Derivative, n));

    /// <summary>(a·b) + c rounded once; derivative a′b + ab′ + c′.</summary>
    public static Dual FusedMultiplyAdd(Dual left, Dual right, Dual addend) =>
        new(Math.FusedMultiplyAdd(left.Value, right.Value, addend.Value),
            Math.FusedMultiplyAdd(left.Derivative, right.Value, Math.FusedMultiplyAdd(left.Value, right.Derivative, addend.Derivative)));

    /// <summary>a·b + c (not necessarily fused).</summary>
    public static Dual MultiplyAddEstimate(Dual left, Dual right, Dual addend) => left * right + addend;

    /// <summary>IEEE remainder x − y·n with n = round-to-even(x/y); derivative x′ − n·y′.</summary>
    public static Dual Ieee754Remainder(Dual left, Dual right)
    {
        double r = Math.IEEERemainder(left.Value, right.Value);
        double n = Math.Round((left.Value - r) / right.Value);
        return new(r, left.Derivative - n * right.Derivative);
    }

    /// <summary>Linear interpolation a(1 − w) + b·w.</summary>
    public static Dual Lerp(Dual value1, Dual value2, Dual amount) => value1 * (1.0 - amount) + value2 * amount;

    /// <summary>1/x.</summary>
    public static Dual ReciprocalEstimate(Dual x) => 1.0 / x;

    /// <summary>1/√x.</summary>
    public static Dual ReciprocalSqrtEstimate(Dual x) => 1.0 / Sqrt(x);

    /// <summary>Degrees to radians.</summary>
    public static Dual DegreesToRadians(Dual degrees) => degrees * (Math.PI / 180.0);

    /// <summary>Radians to degrees.</summary>
    public static Dual RadiansToDegrees(Dual radians) => radians * (180.0 / Math.PI);

    // ---------------------------------------------------------------- exponentials and logarithms

    /// <summary>eˣ, derivative eˣ·x′.</summary>
    public static Dual Exp(Dual x)
    {
        double e = Math.Exp(x.Value);
        return new(e, e * x.Derivative);
    }
    /// <summary>2ˣ, derivative 2ˣ ln 2·x′.</summary>
    public static Dual Exp2(Dual x)
    {
        double e = double.Exp2(x.Value);
        return new(e, e * Ln2 * x.Derivative);
    }
    /// <summary>10ˣ, derivative 10ˣ ln 10·x′.</summary>
    public static Dual Exp10(Dual x)
    {
        double e = double.Exp10(x.Value);
        return new(e, e * Ln10 * x.Derivative);
    }
    /// <summary>eˣ − 1, derivative eˣ·x′.</summary>
    public static Dual ExpM1(Dual x) => new(double.ExpM1(x.Value), Math.Exp(x.Value) * x.Derivative);
    /// <summary>2ˣ − 1, derivative 2ˣ ln 2·x′.</summary>
    public static Dual Exp2M1(Dual x) => new(double.Exp2M1(x.Value), double.Exp2(x.Value) * Ln2 * x.Derivative);
    /// <summary>10ˣ − 1, derivative 10ˣ ln 10·x′.</summary>
    public static Dual Exp10M1(Dual x) => new(double.Exp10M1(x.Value), double.Exp10(x.Value) * Ln10 * x.Derivative);

    /// <summary>ln x, derivative x′/x.</summary>
    public static Dual Log(Dual x) => new(Math.Log(x.Value), x.Derivative / x.Value);
    /// <summary>log_b x = ln x / ln b (both may carry derivatives).</summary>
    public static Dual Log(Dual x, Dual newBase) => Log(x) / Log(newBase);
    /// <summary>log₂ x, derivative x′/(x ln 2).</summary>
    public static Dual Log2(Dual x) => new(Math.Log2(x.Value), x.Derivative / (x.Value * Ln2));
    /// <summary>log₁₀ x, derivative x′/(x ln 10).</summary>
    public static Dual Log10(Dual x) => new(Math.Log10(x.Value), x.Derivative / (x.Value * Ln10));
    /// <summary>ln(1 + x), derivative x′/(1 + x).</summary>
    public static Dual LogP1(Dual x) => new(double.LogP1(x.Value), x.Derivative / (1.0 + x.Value));
    /// <summary>log₂(1 + x).</summary>
    public static Dual Log2P1(Dual x) => new(double.Log2P1(x.Value), x.Derivative / ((1.0 + x.Value) * Ln2));
    /// <summary>log₁₀(1 + x).</summary>
    public static Dual Log10P1(Dual x) => new(double.Log10P1(x.Value), x.Derivative / ((1.0 + x.Value) * Ln10));

    private const double Ln2 = 0.693147180559945309417232121458176568;
    private const double Ln10 = 2.30258509299404568401799145468436421;

    // ---------------------------------------------------------------- powers and roots

    /// <summary>
    /// xʸ, derivative y·x^(y−1)·x′ + xʸ ln x·y′. Each term is included only when its seed is nonzero,
    /// so a constant exponent works for negative or zero bases and a constant base needs no logarithm of the exponent.
    /// </summary>
    public static Dual Pow(Dual x, Dual y)
    {
        double v = Math.Pow(x.Value, y.Value);
        double d = 0.0;
        if (x.Derivative != 0.0)
            d += y.Value * Math.Pow(x.Value, y.Value - 1.0) * x.Derivative;
        if (y.Derivative != 0.0 && v != 0.0)
            d += v * Math.Log(x.Value) * y.Derivative;
        return new(v, d);
    }

    /// <summary>√x, derivative x′/(2√x).</summary>
    public static Dual Sqrt(Dual x)
    {
        double s = Math.Sqrt(x.Value);
        return new(s, x.Derivative / (2.0 * s));
    }
    /// <summary>∛x, derivative x′/(3∛x²).</summary>
    public static Dual Cbrt(Dual x)
    {
        double c = Math.Cbrt(x.Value);
        return new(c, x.Derivative / (3.0 * c * c));
    }
    /// <summary>√(x² + y²), derivative (x x′ + y y′)/√(x² + y²) (zero at the origin).</summary>
    public static Dual Hypot(Dual x, Dual y)
    {
        double h = double.Hypot(x.Value, y.Value);
        double d = h == 0.0 ? 0.0 : (x.Value * x.Derivative + y.Value * y.Derivative) / h;
        return new(h, d);
    }
    /// <summary>The n-th root x^(1/n), derivative x^(1/n)/(n x)·x′.</summary>
    public static Dual RootN(Dual x, int n)
    {
        double r = double.RootN(x.Value, n);
        return new(r, r / (n * x.Value) * x.Derivative);
    }

    // ---------------------------------------------------------------- trigonometric

    /// <summary>sin x, derivative cos x·x′.</summary>
    public static Dual Sin(Dual x)
    {
        var (s, c) = Math.SinCos(x.Value);
        return new(s, c * x.Derivative);
    }
    /// <summary>cos x, derivative −sin x·x′.</summary>
    public static Dual Cos(Dual x)
    {
        var (s, c) = Math.SinCos(x.Value);
        return new(c, -s * x.Derivative);
    }
    /// <summary>(sin x, cos x).</summary>
    public static (Dual Sin, Dual Cos) SinCos(Dual x)
    {
        var (s, c) = Math.SinCos(x.Value);
        return (new(s, c * x.Derivative), new(c, -s * x.Derivative));
    }
    /// <summary>tan x, derivative x′/cos²x.</summary>
    public static Dual Tan(Dual x)
    {
        double c = Math.Cos(x.Value);
        return new(Math.Tan(x.Value), x.Derivative / (c * c));
    }
    /// <summary>sin πx, derivative π cos πx·x′.</summary>
    public static Dual SinPi(Dual x) => new(double.SinPi(x.Value), Math.PI * double.CosPi(x.Value) * x.Derivative);
    /// <summary>cos πx, derivative −π sin πx·x′.</summary>
    public static Dual CosPi(Dual x) => new(double.CosPi(x.Value), -Math.PI * double.SinPi(x.Value) * x.Derivative);
    /// <summary>(sin πx, cos πx).</summary>
    public static (Dual SinPi, Dual CosPi) SinCosPi(Dual x)
    {
        double s = double.SinPi(x.Value), c = double.CosPi(x.Value);
        return (new(s, Math.PI * c * x.Derivative), new(c, -Math.PI * s * x.Derivative));
    }
    /// <summary>tan πx, derivative π x′/cos²πx.</summary>
    public static Dual TanPi(Dual x)
    {
        double c = double.CosPi(x.Value);
        return new(double.TanPi(x.Value), Math.PI * x.Derivative / (c * c));
    }
    /// <summary>arcsin x, derivative x′/√(1 − x²).</summary>
    public static Dual Asin(Dual x) => new(Math.Asin(x.Value), x.Derivative / Math.Sqrt(1.0 - x.Value * x.Value));
    /// <summary>arccos x, derivative −x′/√(1 − x²).</summary>
    public static Dual Acos(Dual x) => new(Math.Acos(x.Value), -x.Derivative / Math.Sqrt(1.0 - x.Value * x.Value));
    /// <summary>arctan x, derivative x′/(1 + x²).</summary>
    public static Dual Atan(Dual x) => new(Math.Atan(x.Value), x.Derivative / (1.0 + x.Value * x.Value));
    /// <summary>arcsin(x)/π.</summary>
    public static Dual AsinPi(Dual x) => new(double.AsinPi(x.Value), x.Derivative / (Math.PI * Math.Sqrt(1.0 - x.Value * x.Value)));
    /// <summary>arccos(x)/π.</summary>
    public static Dual AcosPi(Dual x) => new(double.AcosPi(x.Value), -x.Derivative / (Math.PI * Math.Sqrt(1.0 - x.Value * x.Value)));
    /// <summary>arctan(x)/π.</summary>
    public static Dual AtanPi(Dual x) => new(double.AtanPi(x.Value), x.Derivative / (Math.PI * (1.0 + x.Value * x.Value)));
    /// <summary>The angle of (x, y), derivative (x y′ − y x′)/(x² + y²) (zero at the origin).</summary>
    public static Dual Atan2(Dual y, Dual x)
    {
        double r2 = x.Value * x.Value + y.Value * y.Value;
        double d = r2 == 0.0 ? 0.0 : (x.Value * y.Derivative - y.Value * x.Derivative) / r2;
        return new(Math.Atan2(y.Value, x.Value), d);
    }
    /// <summary>atan2(y, x)/π.</summary>
    public static Dual Atan2Pi(Dual y, Dual x)
    {
        var a = Atan2(y, x);
        return new(double.Atan2Pi(y.Value, x.Value), a.Derivative / Math.PI);
    }

    // ---------------------------------------------------------------- hyperbolic

    /// <summary>sinh x, derivative cosh x·x′.</summary>
    public static Dual Sinh(Dual x) => new(Math.Sinh(x.Value), Math.Cosh(x.Value) * x.Derivative);
    /// <summary>cosh x, derivative sinh x·x′.</summary>
    public static Dual Cosh(Dual x) => new(Math.Cosh(x.Value), Math.Sinh(x.Value) * x.Derivative);
    /// <summary>tanh x, derivative (1 − tanh²x)·x′.</summary>
    public static Dual Tanh(Dual x)
    {
        double t = Math.Tanh(x.Value);
        return new(t, (1.0 - t * t) * x.Derivative);
    }
    /// <summary>arsinh x, derivative x′/√(x² + 1).</summary>
    public static Dual Asinh(Dual x) => new(Math.Asinh(x.Value), x.Derivative / Math.Sqrt(x.Value * x.Value + 1.0));
    /// <summary>arcosh x, derivative x′/√(x² − 1).</summary>
    public static Dual Acosh(Dual x) => new(Math.Acosh(x.Value), x.Derivative / Math.Sqrt(x.Value * x.Value - 1.0));
    /// <summary>artanh x, derivative x′/(1 − x²).</summary>
    public static Dual Atanh(Dual x) => new(Math.Atanh(x.Value), x.Derivative / (1.0 - x.Value * x.Value));

    // ---------------------------------------------------------------- conversions

    private static bool IsRealPrimitive<TOther>() =>
        typeof(TOther) == typeof(double) || typeof(TOther) == typeof(float) || typeof(TOther) == typeof(Half) ||
        typeof(TOther) == typeof(decimal) ||
        typeof(TOther) == typeof(sbyte) || typeof(TOther) == typeof(short) || typeof(TOther) == typeof(int) ||
        typeof(TOther) == typeof(long) || typeof(TOther) == typeof(Int128) || typeof(TOther) == typeof(nint) ||
        typeof(TOther) == typeof(byte) || typeof(TOther) == typeof(ushort) || typeof(TOther) == typeof(uint) ||
        typeof(TOther) == typeof(ulong) || typeof(TOther) == typeof(UInt128) || typeof(TOther) == typeof(nuint) ||
        typeof(TOther) == typeof(char) || typeof(TOther) == typeof(BigInteger);

    /// <summary>Converts any real number type (or a <see cref="Dual"/>, kept whole) to a constant dual; throws <see cref="OverflowException"/> if out of range.</summary>
    public static Dual CreateChecked<TOther>(TOther value) where TOther : INumberBase<TOther>
    {
        if (typeof(TOther) == typeof(Dual)) return (Dual)(object)value;
        return new(double.CreateChecked(value), 0.0);
    }

    /// <summary>Converts any real number type (or a <see cref="Dual"/>, kept whole) to a constant dual, saturating out-of-range values.</summary>
    public static Dual CreateSaturating<TOther>(TOther value) where TOther : INumberBase<TOther>
    {
        if (typeof(TOther) == typeof(Dual)) return (Dual)(object)value;
        return new(double.CreateSaturating(value), 0.0);
    }

    /// <summary>Converts any real number type (or a <see cref="Dual"/>, kept whole) to a constant dual, truncating out-of-range values.</summary>
    public static Dual CreateTruncating<TOther>(TOther value) where TOther : INumberBase<TOther>
    {
        if (typeof(TOther) == typeof(Dual)) return (Dual)(object)value;
        return new(double.CreateTruncating(value), 0.0);
    }

    /// <inheritdoc/>
    static bool INumberBase<Dual>.TryConvertFromChecked<TOther>(TOther value, out Dual result)
    {
        if (IsRealPrimitive<TOther>()) { result = new(double.CreateChecked(value), 0.0); return true; }
        result = default;
        return false;
    }
    /// <inheritdoc/>
    static bool INumberBase<Dual>.TryConvertFromSaturating<TOther>(TOther value, out Dual result)
    {
        if (IsRealPrimitive<TOther>()) { result = new(double.CreateSaturating(value), 0.0); return true; }
        result = default;
        return false;
    }
    /// <inheritdoc/>
    static bool INumberBase<Dual>.TryConvertFromTruncating<TOther>(TOther value, out Dual result)
    {
        if (IsRealPrimitive<TOther>()) { result = new(double.CreateTruncating(value), 0.0); return true; }
        result = default;
        return false;
    }
    /// <inheritdoc/>
    static bool INumberBase<Dual>.TryConvertToChecked<TOther>(Dual value, out TOther result)
    {
        if (IsRealPrimitive<TOther>()) { result = TOther.CreateChecked(value.Value); return true; }
        result = default!;
        return false;
    }
    /// <inheritdoc/>
    static bool INumberBase<Dual>.TryConvertToSaturating<TOther>(Dual value, out TOther result)
    {
        if (IsRealPrimitive<TOther>()) { result = TOther.CreateSaturating(value.Value); return true; }
        result = default!;
        return false;
    }
    /// <inheritdoc/>
    static bool INumberBase<Dual>.TryConvertToTruncating<TOther>(Dual value, out TOther result)
    {
        if (IsRealPrimitive<TOther>()) { result = TOther.CreateTruncating(value.Value); return true; }
        result = default!;
        return false;
    }

    // ---------------------------------------------------------------- IEEE layout (of the value)

    /// <inheritdoc/>
    public int GetExponentByteCount() => ExponentByteCount(Value);
    /// <inheritdoc/>
    public int GetExponentShortestBitLength() => ExponentShortestBitLength(Value);
    /// <inheritdoc/>
    public int GetSignificandBitLength() => SignificandBitLength(Value);
    /// <inheritdoc/>
    public int GetSignificandByteCount() => SignificandByteCount(Value);
    /// <inheritdoc/>
    public bool TryWriteExponentBigEndian(Span<byte> destination, out int bytesWritten) => WriteExponentBigEndian(Value, destination, out bytesWritten);
    /// <inheritdoc/>
    public bool TryWriteExponentLittleEndian(Span<byte> destination, out int bytesWritten) => WriteExponentLittleEndian(Value, destination, out bytesWritten);
    /// <inheritdoc/>
    public bool TryWriteSignificandBigEndian(Span<byte> destination, out int bytesWritten) => WriteSignificandBigEndian(Value, destination, out bytesWritten);
    /// <inheritdoc/>
    public bool TryWriteSignificandLittleEndian(Span<byte> destination, out int bytesWritten) => WriteSignificandLittleEndian(Value, destination, out bytesWritten);

    // Constrained generic calls reach double's explicit interface implementations without boxing.
    private static int ExponentByteCount<T>(T x) where T : IFloatingPoint<T> => x.GetExponentByteCount();
    private static int ExponentShortestBitLength<T>(T x) where T : IFloatingPoint<T> => x.GetExponentShortestBitLength();
    private static int SignificandBitLength<T>(T x) where T : IFloatingPoint<T> => x.GetSignificandBitLength();
    private static int SignificandByteCount<T>(T x) where T : IFloatingPoint<T> => x.GetSignificandByteCount();
    private static bool WriteExponentBigEndian<T>(T x, Span<byte> d, out int n) where T : IFloatingPoint<T> => x.TryWriteExponentBigEndian(d, out n);
    private static bool WriteExponentLittleEndian<T>(T x, Span<byte> d, out int n) where T : IFloatingPoint<T> => x.TryWriteExponentLittleEndian(d, out n);
    private static bool WriteSignificandBigEndian<T>(T x, Span<byte> d, out int n) where T : IFloatingPoint<T> => x.TryWriteSignificandBigEndian(d, out n);
    private static bool WriteSignificandLittleEndian<T>(T x, Span<byte> d, out int n) where T : IFloatingPoint<T> => x.TryWriteSignificandLittleEndian(d, out n);

    // ---------------------------------------------------------------- parsing and formatting (value only)

    /// <summary>Parses a <see cref="double"/>; the result has zero derivative.</summary>
    public static Dual Parse(string s, IFormatProvider? provider) => double.Parse(s, provider);
    /// <summary>Parses a <see cref="double"/>; the result has zero derivative.</summary>
    public static Dual Parse(string s, NumberStyles style, IFormatProvider? provider) => double.Parse(s, style, provider);
    /// <summary>Parses a <see cref="double"/>; the result has zero derivative.</summary>
    public static Dual Parse(ReadOnlySpan<char> s, IFormatProvider? provider) => double.Parse(s, provider);
    /// <summary>Parses a <see cref="double"/>; the result has zero derivative.</summary>
    public static Dual Parse(ReadOnlySpan<char> s, NumberStyles style, IFormatProvider? provider) => double.Parse(s, style, provider);
    /// <summary>Parses UTF-8 text as a <see cref="double"/>; the result has zero derivative.</summary>
    public static Dual Parse(ReadOnlySpan<byte> utf8Text, IFormatProvider? provider) => double.Parse(utf8Text, provider);
    /// <summary>Parses UTF-8 text as a <see cref="double"/>; the result has zero derivative.</summary>
    public static Dual Parse(ReadOnlySpan<byte> utf8Text, NumberStyles style, IFormatProvider? provider) => double.Parse(utf8Text, style, provider);

    /// <summary>Tries to parse a <see cref="double"/>; the result has zero derivative.</summary>
    public static bool TryParse(string? s, IFormatProvider? provider, out Dual result) => Wrap(double.TryParse(s, provider, out double v), v, out result);
    /// <summary>Tries to parse a <see cref="double"/>; the result has zero derivative.</summary>
    public static bool TryParse(string? s, NumberStyles style, IFormatProvider? provider, out Dual result) => Wrap(double.TryParse(s, style, provider, out double v), v, out result);
    /// <summary>Tries to parse a <see cref="double"/>; the result has zero derivative.</summary>
    public static bool TryParse(ReadOnlySpan<char> s, IFormatProvider? provider, out Dual result) => Wrap(double.TryParse(s, provider, out double v), v, out result);
    /// <summary>Tries to parse a <see cref="double"/>; the result has zero derivative.</summary>
    public static bool TryParse(ReadOnlySpan<char> s, NumberStyles style, IFormatProvider? provider, out Dual result) => Wrap(double.TryParse(s, style, provider, out double v), v, out result);
    /// <summary>Tries to parse UTF-8 text as a <see cref="double"/>; the result has zero derivative.</summary>
    public static bool TryParse(ReadOnlySpan<byte> utf8Text, IFormatProvider? provider, out Dual result) => Wrap(double.TryParse(utf8Text, provider, out double v), v, out result);
    /// <summary>Tries to parse UTF-8 text as a <see cref="double"/>; the result has zero derivative.</summary>
    public static bool TryParse(ReadOnlySpan<byte> utf8Text, NumberStyles style, IFormatProvider? provider, out Dual result) => Wrap(double.TryParse(utf8Text, style, provider, out double v), v, out result);

    private static bool Wrap(bool ok, double v, out Dual result)
    {
        result = ok ? new(v, 0.0) : default;
        return ok;
    }

    /// <summary>The value, formatted as a <see cref="double"/> (invariant culture, round-trippable).</summary>
    public override string ToString() => Value.ToString(CultureInfo.InvariantCulture);
    /// <summary>The value, formatted as a <see cref="double"/>.</summary>
    public string ToString(string? format, IFormatProvider? formatProvider) => Value.ToString(format, formatProvider);
    /// <summary>The value, formatted as a <see cref="double"/>.</summary>
    public bool TryFormat(Span<char> destination, out int charsWritten, ReadOnlySpan<char> format, IFormatProvider? provider) =>
        Value.TryFormat(destination, out charsWritten, format, provider);
    /// <summary>The value, formatted as a <see cref="double"/> in UTF-8.</summary>
    public bool TryFormat(Span<byte> utf8Destination, out int bytesWritten, ReadOnlySpan<char> format, IFormatProvider? provider) =>
        Value.TryFormat(utf8Destination, out bytesWritten, format, provider);
}
