using System.Diagnostics;
using System.Globalization;
using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>The embedded coefficient table and the unrolled Horner kernels that evaluate it.</summary>
public sealed class Teos10PolynomialTests
{
    private static List<(int I, int J, int K, double C)> ReadEmbeddedTable()
    {
        using Stream s = typeof(Teos10).Assembly.GetManifestResourceStream(Teos10Polynomial.ResourceName)!;
        using var reader = new StreamReader(s);
        return reader.ReadToEnd().Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).Skip(1)
            .Select(l => l.Split(','))
            .Select(f => (int.Parse(f[0], CultureInfo.InvariantCulture), int.Parse(f[1], CultureInfo.InvariantCulture),
                int.Parse(f[2], CultureInfo.InvariantCulture), double.Parse(f[3], CultureInfo.InvariantCulture)))
            .ToList();
    }

    [Fact]
    public void EmbeddedTableIsTheSeventyFiveTermPolynomial()
    {
        // Roquet et al. (2015): 75 terms, total degree ≤ 6; v000 = 1.0769995862e-3 m³/kg (the table's first row).
        var table = ReadEmbeddedTable();
        Assert.Equal(75, table.Count);
        Assert.All(table, t => Assert.InRange(t.I + t.J + t.K, 0, 6));
        Assert.Equal(1.0769995862e-3, table.Single(t => (t.I, t.J, t.K) == (0, 0, 0)).C);
        Assert.Equal(75, Teos10Polynomial.Coefficients.Count(c => c != 0));
    }

    [Fact]
    public void KernelsEqualATermByTermSum()
    {
        // The Horner kernels against Σ c xs^i ys^j z^k and its term-by-term derivatives, to rounding (1e-16 m³/kg on
        // values of order 1e-3: a relative 1e-13, the error of the term-by-term sum itself).
        var table = ReadEmbeddedTable();
        var rng = new Random(75);
        for (int n = 0; n < 200; n++)
        {
            double xs = Math.Sqrt(Teos10Polynomial.SalinityFactor * 42 * rng.NextDouble() + Teos10Polynomial.SalinityOffset);
            double ys = 0.025 * (-2 + 42 * rng.NextDouble());
            double z = 0.8 * rng.NextDouble();
            double v = 0, vx = 0, vy = 0;
            foreach (var (i, j, k, c) in table)
            {
                v += c * Math.Pow(xs, i) * Math.Pow(ys, j) * Math.Pow(z, k);
                if (i > 0) vx += i * c * Math.Pow(xs, i - 1) * Math.Pow(ys, j) * Math.Pow(z, k);
                if (j > 0) vy += j * c * Math.Pow(xs, i) * Math.Pow(ys, j - 1) * Math.Pow(z, k);
            }
            Assert.Equal(v, Teos10Polynomial.SpecificVolume(xs, ys, z), 1e-16);
            Assert.Equal(v, Teos10Polynomial.SpecificVolumeAndYDerivative(xs, ys, z, out double dy), 1e-16);
            Assert.Equal(vy, dy, 1e-16);
            Assert.Equal(v, Teos10Polynomial.SpecificVolumeAndXDerivative(xs, ys, z, out double dx), 1e-16);
            Assert.Equal(vx, dx, 1e-16);
        }
    }

    [Fact]
    public void GeneratedKernelsAreUpToDateWithTheirGenerator()
    {
        // tools/generate-teos10-kernels.py --check regenerates Teos10Kernels.g.cs in memory and compares (Debian's
        // /usr/bin/python3, which .ci/run provides for python3-gsw).
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Thermostrat.slnx"))) dir = dir.Parent;
        Assert.NotNull(dir);
        var psi = new ProcessStartInfo("/usr/bin/python3", [Path.Combine(dir.FullName, "tools", "generate-teos10-kernels.py"), "--check"])
        {
            RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
        };
        using var proc = Process.Start(psi)!;
        string stdout = proc.StandardOutput.ReadToEnd();
        string stderr = proc.StandardError.ReadToEnd();
        proc.WaitForExit();
        Assert.True(proc.ExitCode == 0, stderr);
        Assert.Contains("up to date", stdout);
    }

    [Theory]
    [InlineData("i,j,k,coefficient\n0,0,0,1e-3\n0,0,0,2e-3\n", "appears twice")]
    [InlineData("i,j,k,coefficient\n0,0,7,1e-3\n", "exceed total degree")]
    [InlineData("i,j,k,coefficient\n3,0,3,1e-3\n", "not a monomial of the 75-term polynomial")]
    [InlineData("i,j,k,coefficient\n0,0,x,1e-3\n", "line 2")]
    [InlineData("a,b,c\n", "expected the header")]
    [InlineData("i,j,k,coefficient\n0,0,0,1e-3\n", "found 1 terms, expected 75")]
    public void MalformedTablesAreRejectedSayingWhere(string text, string message)
    {
        var ex = Assert.Throws<InvalidDataException>(() => Teos10Polynomial.Parse(new StringReader(text), "test.csv"));
        Assert.Contains("test.csv", ex.Message);
        Assert.Contains(message, ex.Message);
    }
}
