using System.Globalization;
using System.Numerics;

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
/// <para>The kernels are nested Horner schemes, xs innermost, then ys, then z, written out so
/// that the JIT sees straight-line code: 84 multiply-adds for v; ∂v/∂ys reuses the 28 xs
/// polynomials, ∂v/∂xs adds one more Horner pass over the i·c_ijk. Plain multiply-then-add is
/// used, not fused multiply-add, so rounding matches a straightforward evaluation.</para>
/// </remarks>
internal static class Teos10Polynomial
{
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

    /// <summary>Specific volume v(xs, ys, z), m³/kg.</summary>
    internal static T SpecificVolume<T>(T xs, T ys, T z) where T : struct, IFloatingPointIeee754<T>
    {
        ReadOnlySpan<T> c = Teos10Coefficients<T>.Values;
        _ = c[DenseTermCount - 1];
        T q00 = c[0] + xs * (c[1] + xs * (c[2] + xs * (c[3] + xs * (c[4] + xs * (c[5] + xs * c[6])))));
        T q10 = c[7] + xs * (c[8] + xs * (c[9] + xs * (c[10] + xs * (c[11] + xs * c[12]))));
        T q20 = c[13] + xs * (c[14] + xs * (c[15] + xs * (c[16] + xs * c[17])));
        T q30 = c[18] + xs * (c[19] + xs * (c[20] + xs * c[21]));
        T q40 = c[22] + xs * (c[23] + xs * c[24]);
        T q50 = c[25] + xs * c[26];
        T q60 = c[27];
        T q01 = c[28] + xs * (c[29] + xs * (c[30] + xs * (c[31] + xs * (c[32] + xs * c[33]))));
        T q11 = c[34] + xs * (c[35] + xs * (c[36] + xs * (c[37] + xs * c[38])));
        T q21 = c[39] + xs * (c[40] + xs * (c[41] + xs * c[42]));
        T q31 = c[43] + xs * (c[44] + xs * c[45]);
        T q41 = c[46] + xs * c[47];
        T q51 = c[48];
        T q02 = c[49] + xs * (c[50] + xs * (c[51] + xs * (c[52] + xs * c[53])));
        T q12 = c[54] + xs * (c[55] + xs * (c[56] + xs * c[57]));
        T q22 = c[58] + xs * (c[59] + xs * c[60]);
        T q32 = c[61] + xs * c[62];
        T q42 = c[63];
        T q03 = c[64] + xs * (c[65] + xs * (c[66] + xs * c[67]));
        T q13 = c[68] + xs * (c[69] + xs * c[70]);
        T q23 = c[71] + xs * c[72];
        T q33 = c[73];
        T q04 = c[74] + xs * (c[75] + xs * c[76]);
        T q14 = c[77] + xs * c[78];
        T q24 = c[79];
        T q05 = c[80] + xs * c[81];
        T q15 = c[82];
        T q06 = c[83];

        T p0 = q00 + ys * (q10 + ys * (q20 + ys * (q30 + ys * (q40 + ys * (q50 + ys * q60)))));
        T p1 = q01 + ys * (q11 + ys * (q21 + ys * (q31 + ys * (q41 + ys * q51))));
        T p2 = q02 + ys * (q12 + ys * (q22 + ys * (q32 + ys * q42)));
        T p3 = q03 + ys * (q13 + ys * (q23 + ys * q33));
        T p4 = q04 + ys * (q14 + ys * q24);
        T p5 = q05 + ys * q15;
        T p6 = q06;
        T v = p0 + z * (p1 + z * (p2 + z * (p3 + z * (p4 + z * (p5 + z * p6)))));
        return v;
    }

    /// <summary>Specific volume v and its derivative ∂v/∂ys (m³/kg per unit ys = Θ/40 °C).</summary>
    internal static T SpecificVolumeAndYDerivative<T>(T xs, T ys, T z, out T dvdys) where T : struct, IFloatingPointIeee754<T>
    {
        ReadOnlySpan<T> c = Teos10Coefficients<T>.Values;
        _ = c[DenseTermCount - 1];
        T n2 = T.CreateTruncating(2.0), n3 = T.CreateTruncating(3.0), n4 = T.CreateTruncating(4.0),
          n5 = T.CreateTruncating(5.0), n6 = T.CreateTruncating(6.0);
        T q00 = c[0] + xs * (c[1] + xs * (c[2] + xs * (c[3] + xs * (c[4] + xs * (c[5] + xs * c[6])))));
        T q10 = c[7] + xs * (c[8] + xs * (c[9] + xs * (c[10] + xs * (c[11] + xs * c[12]))));
        T q20 = c[13] + xs * (c[14] + xs * (c[15] + xs * (c[16] + xs * c[17])));
        T q30 = c[18] + xs * (c[19] + xs * (c[20] + xs * c[21]));
        T q40 = c[22] + xs * (c[23] + xs * c[24]);
        T q50 = c[25] + xs * c[26];
        T q60 = c[27];
        T q01 = c[28] + xs * (c[29] + xs * (c[30] + xs * (c[31] + xs * (c[32] + xs * c[33]))));
        T q11 = c[34] + xs * (c[35] + xs * (c[36] + xs * (c[37] + xs * c[38])));
        T q21 = c[39] + xs * (c[40] + xs * (c[41] + xs * c[42]));
        T q31 = c[43] + xs * (c[44] + xs * c[45]);
        T q41 = c[46] + xs * c[47];
        T q51 = c[48];
        T q02 = c[49] + xs * (c[50] + xs * (c[51] + xs * (c[52] + xs * c[53])));
        T q12 = c[54] + xs * (c[55] + xs * (c[56] + xs * c[57]));
        T q22 = c[58] + xs * (c[59] + xs * c[60]);
        T q32 = c[61] + xs * c[62];
        T q42 = c[63];
        T q03 = c[64] + xs * (c[65] + xs * (c[66] + xs * c[67]));
        T q13 = c[68] + xs * (c[69] + xs * c[70]);
        T q23 = c[71] + xs * c[72];
        T q33 = c[73];
        T q04 = c[74] + xs * (c[75] + xs * c[76]);
        T q14 = c[77] + xs * c[78];
        T q24 = c[79];
        T q05 = c[80] + xs * c[81];
        T q15 = c[82];
        T q06 = c[83];

        T p0 = q00 + ys * (q10 + ys * (q20 + ys * (q30 + ys * (q40 + ys * (q50 + ys * q60)))));
        T p1 = q01 + ys * (q11 + ys * (q21 + ys * (q31 + ys * (q41 + ys * q51))));
        T p2 = q02 + ys * (q12 + ys * (q22 + ys * (q32 + ys * q42)));
        T p3 = q03 + ys * (q13 + ys * (q23 + ys * q33));
        T p4 = q04 + ys * (q14 + ys * q24);
        T p5 = q05 + ys * q15;
        T p6 = q06;
        T v = p0 + z * (p1 + z * (p2 + z * (p3 + z * (p4 + z * (p5 + z * p6)))));

        T dp0 = q10 + ys * (n2 * q20 + ys * (n3 * q30 + ys * (n4 * q40 + ys * (n5 * q50 + ys * (n6 * q60)))));
        T dp1 = q11 + ys * (n2 * q21 + ys * (n3 * q31 + ys * (n4 * q41 + ys * (n5 * q51))));
        T dp2 = q12 + ys * (n2 * q22 + ys * (n3 * q32 + ys * (n4 * q42)));
        T dp3 = q13 + ys * (n2 * q23 + ys * (n3 * q33));
        T dp4 = q14 + ys * (n2 * q24);
        T dp5 = q15;
        T dv = dp0 + z * (dp1 + z * (dp2 + z * (dp3 + z * (dp4 + z * dp5))));
        dvdys = dv;
        return v;
    }

    /// <summary>Specific volume v and its derivative ∂v/∂xs (m³/kg per unit xs).</summary>
    internal static T SpecificVolumeAndXDerivative<T>(T xs, T ys, T z, out T dvdxs) where T : struct, IFloatingPointIeee754<T>
    {
        ReadOnlySpan<T> c = Teos10Coefficients<T>.Values;
        ReadOnlySpan<T> cx = Teos10Coefficients<T>.XDerivativeValues;
        _ = c[DenseTermCount - 1];
        _ = cx[DenseTermCount - 1];
        T q00 = c[0] + xs * (c[1] + xs * (c[2] + xs * (c[3] + xs * (c[4] + xs * (c[5] + xs * c[6])))));
        T q10 = c[7] + xs * (c[8] + xs * (c[9] + xs * (c[10] + xs * (c[11] + xs * c[12]))));
        T q20 = c[13] + xs * (c[14] + xs * (c[15] + xs * (c[16] + xs * c[17])));
        T q30 = c[18] + xs * (c[19] + xs * (c[20] + xs * c[21]));
        T q40 = c[22] + xs * (c[23] + xs * c[24]);
        T q50 = c[25] + xs * c[26];
        T q60 = c[27];
        T q01 = c[28] + xs * (c[29] + xs * (c[30] + xs * (c[31] + xs * (c[32] + xs * c[33]))));
        T q11 = c[34] + xs * (c[35] + xs * (c[36] + xs * (c[37] + xs * c[38])));
        T q21 = c[39] + xs * (c[40] + xs * (c[41] + xs * c[42]));
        T q31 = c[43] + xs * (c[44] + xs * c[45]);
        T q41 = c[46] + xs * c[47];
        T q51 = c[48];
        T q02 = c[49] + xs * (c[50] + xs * (c[51] + xs * (c[52] + xs * c[53])));
        T q12 = c[54] + xs * (c[55] + xs * (c[56] + xs * c[57]));
        T q22 = c[58] + xs * (c[59] + xs * c[60]);
        T q32 = c[61] + xs * c[62];
        T q42 = c[63];
        T q03 = c[64] + xs * (c[65] + xs * (c[66] + xs * c[67]));
        T q13 = c[68] + xs * (c[69] + xs * c[70]);
        T q23 = c[71] + xs * c[72];
        T q33 = c[73];
        T q04 = c[74] + xs * (c[75] + xs * c[76]);
        T q14 = c[77] + xs * c[78];
        T q24 = c[79];
        T q05 = c[80] + xs * c[81];
        T q15 = c[82];
        T q06 = c[83];

        T p0 = q00 + ys * (q10 + ys * (q20 + ys * (q30 + ys * (q40 + ys * (q50 + ys * q60)))));
        T p1 = q01 + ys * (q11 + ys * (q21 + ys * (q31 + ys * (q41 + ys * q51))));
        T p2 = q02 + ys * (q12 + ys * (q22 + ys * (q32 + ys * q42)));
        T p3 = q03 + ys * (q13 + ys * (q23 + ys * q33));
        T p4 = q04 + ys * (q14 + ys * q24);
        T p5 = q05 + ys * q15;
        T p6 = q06;
        T v = p0 + z * (p1 + z * (p2 + z * (p3 + z * (p4 + z * (p5 + z * p6)))));

        T r00 = cx[1] + xs * (cx[2] + xs * (cx[3] + xs * (cx[4] + xs * (cx[5] + xs * cx[6]))));
        T r10 = cx[8] + xs * (cx[9] + xs * (cx[10] + xs * (cx[11] + xs * cx[12])));
        T r20 = cx[14] + xs * (cx[15] + xs * (cx[16] + xs * cx[17]));
        T r30 = cx[19] + xs * (cx[20] + xs * cx[21]);
        T r40 = cx[23] + xs * cx[24];
        T r50 = cx[26];
        T r01 = cx[29] + xs * (cx[30] + xs * (cx[31] + xs * (cx[32] + xs * cx[33])));
        T r11 = cx[35] + xs * (cx[36] + xs * (cx[37] + xs * cx[38]));
        T r21 = cx[40] + xs * (cx[41] + xs * cx[42]);
        T r31 = cx[44] + xs * cx[45];
        T r41 = cx[47];
        T r02 = cx[50] + xs * (cx[51] + xs * (cx[52] + xs * cx[53]));
        T r12 = cx[55] + xs * (cx[56] + xs * cx[57]);
        T r22 = cx[59] + xs * cx[60];
        T r32 = cx[62];
        T r03 = cx[65] + xs * (cx[66] + xs * cx[67]);
        T r13 = cx[69] + xs * cx[70];
        T r23 = cx[72];
        T r04 = cx[75] + xs * cx[76];
        T r14 = cx[78];
        T r05 = cx[81];

        T rp0 = r00 + ys * (r10 + ys * (r20 + ys * (r30 + ys * (r40 + ys * r50))));
        T rp1 = r01 + ys * (r11 + ys * (r21 + ys * (r31 + ys * r41)));
        T rp2 = r02 + ys * (r12 + ys * (r22 + ys * r32));
        T rp3 = r03 + ys * (r13 + ys * r23);
        T rp4 = r04 + ys * r14;
        T rp5 = r05;
        T vx = rp0 + z * (rp1 + z * (rp2 + z * (rp3 + z * (rp4 + z * rp5))));
        dvdxs = vx;
        return v;
    }
}

/// <summary>The polynomial's coefficients converted once to the number type <typeparamref name="T"/>.</summary>
internal static class Teos10Coefficients<T> where T : struct, IFloatingPointIeee754<T>
{
    /// <summary>c_ijk in the dense layout of <see cref="Teos10Polynomial.Index"/>.</summary>
    internal static readonly T[] Values = Convert(static (n, i) => Teos10Polynomial.Coefficients[n]);

    /// <summary>i·c_ijk in the same layout: the coefficients of ∂v/∂xs, each kept at the position of its parent term.</summary>
    internal static readonly T[] XDerivativeValues = Convert(static (n, i) => i * Teos10Polynomial.Coefficients[n]);

    private static T[] Convert(Func<int, int, double> value)
    {
        var result = new T[Teos10Polynomial.DenseTermCount];
        for (int k = 0; k <= Teos10Polynomial.Degree; k++)
            for (int j = 0; j <= Teos10Polynomial.Degree - k; j++)
                for (int i = 0; i <= Teos10Polynomial.Degree - j - k; i++)
                {
                    int n = Teos10Polynomial.Index(i, j, k);
                    result[n] = T.CreateTruncating(value(n, i));
                }
        return result;
    }
}
