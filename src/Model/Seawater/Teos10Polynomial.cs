using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// The TEOS-10 75-term specific-volume polynomial of Roquet et al. (2015), Ocean Modelling 90, 29:
/// v(S_A, Θ, p) = Σ c_ijk xs^i ys^j z^k, with xs = √(sfac·S_A + offset), ys = Θ/40 °C,
/// z = p/10⁴ dbar, and its exact derivatives in xs and ys.
/// </summary>
/// <remarks>
/// <para>The coefficients are read once from the embedded resource
/// <c>Data/Seawater/teos10_specvol75.csv</c> (its README names the source) into a dense
/// triangular layout over all 84 monomials of total degree ≤ 6 (the 9 absent from the
/// polynomial are zero). Index order: k outermost, then j, then i.</para>
/// <para>The kernels (<c>Teos10Kernels.g.cs</c>, written by <c>tools/generate-teos10-kernels.py</c>
/// from the table's monomials) are nested Horner schemes in straight-line code that skip the 9
/// absent monomials: 74 fused multiply-adds for v. A derivative is taken by putting its variable
/// outermost and running the simultaneous Horner scheme (value and derivative together) over that
/// variable's coefficient polynomials: 79 fused multiply-adds for v with ∂v/∂ys, and the same for
/// v with ∂v/∂xs, instead of a second pass over the table. Each coefficient polynomial is formed
/// just before it is needed, which keeps few values alive at once. Each step is one fused
/// multiply-add, Fma(a, x, b) = a·x + b rounded once: half the instructions of a multiply then an
/// add, with results that differ from a plain evaluation by a few units in the last place.</para>
/// </remarks>
internal static partial class Teos10Polynomial
{
    /// <summary>a·x + b with one rounding (<see cref="IFloatingPointIeee754{TSelf}"/>'s fused multiply-add).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T Fma<T>(T a, T x, T b) where T : struct, IFloatingPointIeee754<T> => T.FusedMultiplyAdd(a, x, b);

    /// <summary>Total degree of the polynomial.</summary>
    internal const int Degree = 6;

    /// <summary>Number of monomials of total degree ≤ 6 in three variables.</summary>
    internal const int DenseTermCount = (Degree + 1) * (Degree + 2) * (Degree + 3) / 6;

    /// <summary>Number of non-zero terms the resource must hold.</summary>
    internal const int PublishedTermCount = 75;

    /// <summary>sfac = 1/(40 u_PS), kg/g: scales S_A in xs (TEOS-10 <c>gsw_sfac</c>).</summary>
    internal const double SalinityFactor = 0.0248826675584615;

    /// <summary>Offset of xs² = sfac·S_A + offset (Roquet et al. 2015, from the polynomial's README).</summary>
    internal const double SalinityOffset = 5.971840214030754e-1;

    /// <summary>Name of the embedded coefficient table.</summary>
    internal const string ResourceName = "Thermostrat.Model.Data.Seawater.teos10_specvol75.csv";

    /// <summary>The coefficients c_ijk in the dense layout (see <see cref="Index"/>), m³/kg.</summary>
    internal static readonly double[] Coefficients = Load();

    /// <summary>Position of the monomial xs^i ys^j z^k in the dense layout.</summary>
    internal static int Index(int i, int j, int k)
    {
        if (i < 0 || j < 0 || k < 0 || i + j + k > Degree)
            throw new ArgumentOutOfRangeException(nameof(i), $"({i}, {j}, {k}) is not a monomial of total degree ≤ {Degree}.");
        int n = 0;
        for (int kk = 0; kk < k; kk++) n += Triangle(Degree - kk + 1);
        for (int jj = 0; jj < j; jj++) n += Degree - k - jj + 1;
        return n + i;
    }

    private static int Triangle(int m) => m * (m + 1) / 2;

    /// <summary>Reads and checks the embedded table: 75 distinct terms, each of total degree ≤ 6.</summary>
    /// <exception cref="InvalidDataException">The resource is missing or malformed; the message says where.</exception>
    internal static double[] Load()
    {
        using Stream stream = typeof(Teos10Polynomial).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidDataException($"Embedded resource '{ResourceName}' is missing from {typeof(Teos10Polynomial).Assembly.GetName().Name}.");
        using var reader = new StreamReader(stream);
        return Parse(reader, ResourceName);
    }

    /// <summary>Parses a table of rows <c>i,j,k,coefficient</c> after a header line.</summary>
    internal static double[] Parse(TextReader reader, string sourceName)
    {
        var dense = new double[DenseTermCount];
        var seen = new bool[DenseTermCount];
        string? header = reader.ReadLine();
        if (header is null || header.Replace(" ", "", StringComparison.Ordinal) != "i,j,k,coefficient")
            throw new InvalidDataException($"{sourceName}: expected the header 'i,j,k,coefficient', found '{header}'.");
        int line = 1, terms = 0;
        for (string? text = reader.ReadLine(); text is not null; text = reader.ReadLine())
        {
            line++;
            if (string.IsNullOrWhiteSpace(text)) continue;
            string[] f = text.Split(',');
            if (f.Length != 4
                || !int.TryParse(f[0], NumberStyles.Integer, CultureInfo.InvariantCulture, out int i)
                || !int.TryParse(f[1], NumberStyles.Integer, CultureInfo.InvariantCulture, out int j)
                || !int.TryParse(f[2], NumberStyles.Integer, CultureInfo.InvariantCulture, out int k)
                || !double.TryParse(f[3], NumberStyles.Float, CultureInfo.InvariantCulture, out double c)
                || !double.IsFinite(c))
                throw new InvalidDataException($"{sourceName} line {line}: expected 'i,j,k,coefficient' with integer exponents and a finite number, found '{text}'.");
            if (i < 0 || j < 0 || k < 0 || i + j + k > Degree)
                throw new InvalidDataException($"{sourceName} line {line}: exponents ({i}, {j}, {k}) exceed total degree {Degree}.");
            int n = Index(i, j, k);
            if (!IsKernelTerm(i, j, k))
                throw new InvalidDataException($"{sourceName} line {line}: term ({i}, {j}, {k}) is not a monomial of the 75-term polynomial (the kernels would ignore it).");
            if (seen[n])
                throw new InvalidDataException($"{sourceName} line {line}: term ({i}, {j}, {k}) appears twice.");
            seen[n] = true;
            dense[n] = c;
            terms++;
        }
        if (terms != PublishedTermCount)
            throw new InvalidDataException($"{sourceName}: found {terms} terms, expected {PublishedTermCount}.");
        return dense;
    }
}

/// <summary>The polynomial's coefficients converted once to the number type <typeparamref name="T"/>.</summary>
internal static class Teos10Coefficients<T> where T : struct, IFloatingPointIeee754<T>
{
    /// <summary>c_ijk in the dense layout of <see cref="Teos10Polynomial.Index"/>.</summary>
    internal static readonly T[] Values = Convert();

    private static T[] Convert()
    {
        var result = new T[Teos10Polynomial.DenseTermCount];
        for (int n = 0; n < result.Length; n++) result[n] = T.CreateTruncating(Teos10Polynomial.Coefficients[n]);
        return result;
    }
}
