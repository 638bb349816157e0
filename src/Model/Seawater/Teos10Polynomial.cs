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
/// <para>The kernels are nested Horner schemes, xs innermost, then ys, then z, written out so
/// that the JIT sees straight-line code: 84 fused multiply-adds for v; ∂v/∂ys reuses the 28 xs
/// polynomials (each P_k and its ys-derivative by the simultaneous Horner scheme), ∂v/∂xs adds one
/// more Horner pass over the i·c_ijk. The z-polynomial is
/// accumulated from its highest power down, each ys-polynomial P_k being formed just before it
/// is needed, which keeps few values alive at once (no register spills). Each step is one fused
/// multiply-add, Fma(a, x, b) = a·x + b rounded once: half the instructions of a multiply then an
/// add, with results that differ from a plain evaluation by a few units in the last place.</para>
/// </remarks>
internal static class Teos10Polynomial
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
        T q06 = c[83];
        T v = q06;
        T q05 = Fma(c[81], xs, c[80]);
        T q15 = c[82];
        v = Fma(v, z, Fma(q15, ys, q05));
        T q04 = Fma(Fma(c[76], xs, c[75]), xs, c[74]);
        T q14 = Fma(c[78], xs, c[77]);
        T q24 = c[79];
        v = Fma(v, z, Fma(Fma(q24, ys, q14), ys, q04));
        T q03 = Fma(Fma(Fma(c[67], xs, c[66]), xs, c[65]), xs, c[64]);
        T q13 = Fma(Fma(c[70], xs, c[69]), xs, c[68]);
        T q23 = Fma(c[72], xs, c[71]);
        T q33 = c[73];
        v = Fma(v, z, Fma(Fma(Fma(q33, ys, q23), ys, q13), ys, q03));
        T q02 = Fma(Fma(Fma(Fma(c[53], xs, c[52]), xs, c[51]), xs, c[50]), xs, c[49]);
        T q12 = Fma(Fma(Fma(c[57], xs, c[56]), xs, c[55]), xs, c[54]);
        T q22 = Fma(Fma(c[60], xs, c[59]), xs, c[58]);
        T q32 = Fma(c[62], xs, c[61]);
        T q42 = c[63];
        v = Fma(v, z, Fma(Fma(Fma(Fma(q42, ys, q32), ys, q22), ys, q12), ys, q02));
        T q01 = Fma(Fma(Fma(Fma(Fma(c[33], xs, c[32]), xs, c[31]), xs, c[30]), xs, c[29]), xs, c[28]);
        T q11 = Fma(Fma(Fma(Fma(c[38], xs, c[37]), xs, c[36]), xs, c[35]), xs, c[34]);
        T q21 = Fma(Fma(Fma(c[42], xs, c[41]), xs, c[40]), xs, c[39]);
        T q31 = Fma(Fma(c[45], xs, c[44]), xs, c[43]);
        T q41 = Fma(c[47], xs, c[46]);
        T q51 = c[48];
        v = Fma(v, z, Fma(Fma(Fma(Fma(Fma(q51, ys, q41), ys, q31), ys, q21), ys, q11), ys, q01));
        T q00 = Fma(Fma(Fma(Fma(Fma(Fma(c[6], xs, c[5]), xs, c[4]), xs, c[3]), xs, c[2]), xs, c[1]), xs, c[0]);
        T q10 = Fma(Fma(Fma(Fma(Fma(c[12], xs, c[11]), xs, c[10]), xs, c[9]), xs, c[8]), xs, c[7]);
        T q20 = Fma(Fma(Fma(Fma(c[17], xs, c[16]), xs, c[15]), xs, c[14]), xs, c[13]);
        T q30 = Fma(Fma(Fma(c[21], xs, c[20]), xs, c[19]), xs, c[18]);
        T q40 = Fma(Fma(c[24], xs, c[23]), xs, c[22]);
        T q50 = Fma(c[26], xs, c[25]);
        T q60 = c[27];
        v = Fma(v, z, Fma(Fma(Fma(Fma(Fma(Fma(q60, ys, q50), ys, q40), ys, q30), ys, q20), ys, q10), ys, q00));
        return v;
    }

    /// <summary>Specific volume v and its derivative ∂v/∂ys (m³/kg per unit ys = Θ/40 °C).</summary>
    internal static T SpecificVolumeAndYDerivative<T>(T xs, T ys, T z, out T dvdys) where T : struct, IFloatingPointIeee754<T>
    {
        ReadOnlySpan<T> c = Teos10Coefficients<T>.Values;
        _ = c[DenseTermCount - 1];
        T q06 = c[83];
        T v = q06;
        T q05 = Fma(c[81], xs, c[80]);
        T q15 = c[82];
        T b5 = q15, d5 = b5;
        b5 = Fma(b5, ys, q05);
        v = Fma(v, z, b5);
        T dv = d5;
        T q04 = Fma(Fma(c[76], xs, c[75]), xs, c[74]);
        T q14 = Fma(c[78], xs, c[77]);
        T q24 = c[79];
        T b4 = q24, d4 = b4;
        b4 = Fma(b4, ys, q14); d4 = Fma(d4, ys, b4);
        b4 = Fma(b4, ys, q04);
        v = Fma(v, z, b4);
        dv = Fma(dv, z, d4);
        T q03 = Fma(Fma(Fma(c[67], xs, c[66]), xs, c[65]), xs, c[64]);
        T q13 = Fma(Fma(c[70], xs, c[69]), xs, c[68]);
        T q23 = Fma(c[72], xs, c[71]);
        T q33 = c[73];
        T b3 = q33, d3 = b3;
        b3 = Fma(b3, ys, q23); d3 = Fma(d3, ys, b3);
        b3 = Fma(b3, ys, q13); d3 = Fma(d3, ys, b3);
        b3 = Fma(b3, ys, q03);
        v = Fma(v, z, b3);
        dv = Fma(dv, z, d3);
        T q02 = Fma(Fma(Fma(Fma(c[53], xs, c[52]), xs, c[51]), xs, c[50]), xs, c[49]);
        T q12 = Fma(Fma(Fma(c[57], xs, c[56]), xs, c[55]), xs, c[54]);
        T q22 = Fma(Fma(c[60], xs, c[59]), xs, c[58]);
        T q32 = Fma(c[62], xs, c[61]);
        T q42 = c[63];
        T b2 = q42, d2 = b2;
        b2 = Fma(b2, ys, q32); d2 = Fma(d2, ys, b2);
        b2 = Fma(b2, ys, q22); d2 = Fma(d2, ys, b2);
        b2 = Fma(b2, ys, q12); d2 = Fma(d2, ys, b2);
        b2 = Fma(b2, ys, q02);
        v = Fma(v, z, b2);
        dv = Fma(dv, z, d2);
        T q01 = Fma(Fma(Fma(Fma(Fma(c[33], xs, c[32]), xs, c[31]), xs, c[30]), xs, c[29]), xs, c[28]);
        T q11 = Fma(Fma(Fma(Fma(c[38], xs, c[37]), xs, c[36]), xs, c[35]), xs, c[34]);
        T q21 = Fma(Fma(Fma(c[42], xs, c[41]), xs, c[40]), xs, c[39]);
        T q31 = Fma(Fma(c[45], xs, c[44]), xs, c[43]);
        T q41 = Fma(c[47], xs, c[46]);
        T q51 = c[48];
        T b1 = q51, d1 = b1;
        b1 = Fma(b1, ys, q41); d1 = Fma(d1, ys, b1);
        b1 = Fma(b1, ys, q31); d1 = Fma(d1, ys, b1);
        b1 = Fma(b1, ys, q21); d1 = Fma(d1, ys, b1);
        b1 = Fma(b1, ys, q11); d1 = Fma(d1, ys, b1);
        b1 = Fma(b1, ys, q01);
        v = Fma(v, z, b1);
        dv = Fma(dv, z, d1);
        T q00 = Fma(Fma(Fma(Fma(Fma(Fma(c[6], xs, c[5]), xs, c[4]), xs, c[3]), xs, c[2]), xs, c[1]), xs, c[0]);
        T q10 = Fma(Fma(Fma(Fma(Fma(c[12], xs, c[11]), xs, c[10]), xs, c[9]), xs, c[8]), xs, c[7]);
        T q20 = Fma(Fma(Fma(Fma(c[17], xs, c[16]), xs, c[15]), xs, c[14]), xs, c[13]);
        T q30 = Fma(Fma(Fma(c[21], xs, c[20]), xs, c[19]), xs, c[18]);
        T q40 = Fma(Fma(c[24], xs, c[23]), xs, c[22]);
        T q50 = Fma(c[26], xs, c[25]);
        T q60 = c[27];
        T b0 = q60, d0 = b0;
        b0 = Fma(b0, ys, q50); d0 = Fma(d0, ys, b0);
        b0 = Fma(b0, ys, q40); d0 = Fma(d0, ys, b0);
        b0 = Fma(b0, ys, q30); d0 = Fma(d0, ys, b0);
        b0 = Fma(b0, ys, q20); d0 = Fma(d0, ys, b0);
        b0 = Fma(b0, ys, q10); d0 = Fma(d0, ys, b0);
        b0 = Fma(b0, ys, q00);
        v = Fma(v, z, b0);
        dv = Fma(dv, z, d0);
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
        T q06 = c[83];
        T v = q06;
        T q05 = Fma(c[81], xs, c[80]);
        T q15 = c[82];
        v = Fma(v, z, Fma(q15, ys, q05));
        T r05 = cx[81];
        T vx = r05;
        T q04 = Fma(Fma(c[76], xs, c[75]), xs, c[74]);
        T q14 = Fma(c[78], xs, c[77]);
        T q24 = c[79];
        v = Fma(v, z, Fma(Fma(q24, ys, q14), ys, q04));
        T r04 = Fma(cx[76], xs, cx[75]);
        T r14 = cx[78];
        vx = Fma(vx, z, Fma(r14, ys, r04));
        T q03 = Fma(Fma(Fma(c[67], xs, c[66]), xs, c[65]), xs, c[64]);
        T q13 = Fma(Fma(c[70], xs, c[69]), xs, c[68]);
        T q23 = Fma(c[72], xs, c[71]);
        T q33 = c[73];
        v = Fma(v, z, Fma(Fma(Fma(q33, ys, q23), ys, q13), ys, q03));
        T r03 = Fma(Fma(cx[67], xs, cx[66]), xs, cx[65]);
        T r13 = Fma(cx[70], xs, cx[69]);
        T r23 = cx[72];
        vx = Fma(vx, z, Fma(Fma(r23, ys, r13), ys, r03));
        T q02 = Fma(Fma(Fma(Fma(c[53], xs, c[52]), xs, c[51]), xs, c[50]), xs, c[49]);
        T q12 = Fma(Fma(Fma(c[57], xs, c[56]), xs, c[55]), xs, c[54]);
        T q22 = Fma(Fma(c[60], xs, c[59]), xs, c[58]);
        T q32 = Fma(c[62], xs, c[61]);
        T q42 = c[63];
        v = Fma(v, z, Fma(Fma(Fma(Fma(q42, ys, q32), ys, q22), ys, q12), ys, q02));
        T r02 = Fma(Fma(Fma(cx[53], xs, cx[52]), xs, cx[51]), xs, cx[50]);
        T r12 = Fma(Fma(cx[57], xs, cx[56]), xs, cx[55]);
        T r22 = Fma(cx[60], xs, cx[59]);
        T r32 = cx[62];
        vx = Fma(vx, z, Fma(Fma(Fma(r32, ys, r22), ys, r12), ys, r02));
        T q01 = Fma(Fma(Fma(Fma(Fma(c[33], xs, c[32]), xs, c[31]), xs, c[30]), xs, c[29]), xs, c[28]);
        T q11 = Fma(Fma(Fma(Fma(c[38], xs, c[37]), xs, c[36]), xs, c[35]), xs, c[34]);
        T q21 = Fma(Fma(Fma(c[42], xs, c[41]), xs, c[40]), xs, c[39]);
        T q31 = Fma(Fma(c[45], xs, c[44]), xs, c[43]);
        T q41 = Fma(c[47], xs, c[46]);
        T q51 = c[48];
        v = Fma(v, z, Fma(Fma(Fma(Fma(Fma(q51, ys, q41), ys, q31), ys, q21), ys, q11), ys, q01));
        T r01 = Fma(Fma(Fma(Fma(cx[33], xs, cx[32]), xs, cx[31]), xs, cx[30]), xs, cx[29]);
        T r11 = Fma(Fma(Fma(cx[38], xs, cx[37]), xs, cx[36]), xs, cx[35]);
        T r21 = Fma(Fma(cx[42], xs, cx[41]), xs, cx[40]);
        T r31 = Fma(cx[45], xs, cx[44]);
        T r41 = cx[47];
        vx = Fma(vx, z, Fma(Fma(Fma(Fma(r41, ys, r31), ys, r21), ys, r11), ys, r01));
        T q00 = Fma(Fma(Fma(Fma(Fma(Fma(c[6], xs, c[5]), xs, c[4]), xs, c[3]), xs, c[2]), xs, c[1]), xs, c[0]);
        T q10 = Fma(Fma(Fma(Fma(Fma(c[12], xs, c[11]), xs, c[10]), xs, c[9]), xs, c[8]), xs, c[7]);
        T q20 = Fma(Fma(Fma(Fma(c[17], xs, c[16]), xs, c[15]), xs, c[14]), xs, c[13]);
        T q30 = Fma(Fma(Fma(c[21], xs, c[20]), xs, c[19]), xs, c[18]);
        T q40 = Fma(Fma(c[24], xs, c[23]), xs, c[22]);
        T q50 = Fma(c[26], xs, c[25]);
        T q60 = c[27];
        v = Fma(v, z, Fma(Fma(Fma(Fma(Fma(Fma(q60, ys, q50), ys, q40), ys, q30), ys, q20), ys, q10), ys, q00));
        T r00 = Fma(Fma(Fma(Fma(Fma(cx[6], xs, cx[5]), xs, cx[4]), xs, cx[3]), xs, cx[2]), xs, cx[1]);
        T r10 = Fma(Fma(Fma(Fma(cx[12], xs, cx[11]), xs, cx[10]), xs, cx[9]), xs, cx[8]);
        T r20 = Fma(Fma(Fma(cx[17], xs, cx[16]), xs, cx[15]), xs, cx[14]);
        T r30 = Fma(Fma(cx[21], xs, cx[20]), xs, cx[19]);
        T r40 = Fma(cx[24], xs, cx[23]);
        T r50 = cx[26];
        vx = Fma(vx, z, Fma(Fma(Fma(Fma(Fma(r50, ys, r40), ys, r30), ys, r20), ys, r10), ys, r00));
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
