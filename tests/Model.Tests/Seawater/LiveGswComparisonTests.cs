using System.Diagnostics;
using System.Globalization;
using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>
/// TEOS-10 against the GSW library itself, computed live (Debian's python3-gsw, installed by
/// .ci/run): 300 random points over the oceanographic funnel, a fresh set on each run's seed.
/// The committed fixture checks the same to the same tolerances without Python.
/// </summary>
public sealed class LiveGswComparisonTests
{
    private const string Script = """
import sys, numpy as np, gsw
rng = np.random.default_rng(int(sys.argv[1]))
n = 300
SA = rng.uniform(0.5, 42, n); CT = rng.uniform(-2, 40, n); p = rng.uniform(0, 8000, n)
CT = np.maximum(CT, gsw.CT_freezing(SA, p, 0) + 0.1)
print(gsw.__version__)
for a, b, c, r, al, be in zip(SA, CT, p, gsw.rho(SA, CT, p), gsw.alpha(SA, CT, p), gsw.beta(SA, CT, p)):
    print(repr(a), repr(b), repr(c), repr(r), repr(al), repr(be))
""";

    [Fact]
    public void Teos10_matches_gsw_computed_now()
    {
        const string python = "/usr/bin/python3";
        Assert.True(File.Exists(python), "Debian's /usr/bin/python3 with python3-gsw is needed (apt-get install python3-gsw; .ci/run installs it)");
        int seed = Environment.TickCount & 0x7fffffff;
        var psi = new ProcessStartInfo(python, ["-c", Script, seed.ToString(CultureInfo.InvariantCulture)])
        {
            RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
        };
        using var proc = Process.Start(psi)!;
        string stdout = proc.StandardOutput.ReadToEnd();
        string stderr = proc.StandardError.ReadToEnd();
        proc.WaitForExit();
        Assert.True(proc.ExitCode == 0, $"python3-gsw failed (install it: apt-get install python3-gsw): {stderr}");
        var lines = stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("3.", lines[0]); // gsw version
        var eos = new Teos10EquationOfState();
        int n = 0;
        foreach (var line in lines.Skip(1))
        {
            var v = line.Split(' ').Select(x => double.Parse(x, CultureInfo.InvariantCulture)).ToArray();
            // Tolerances as for the committed fixture: 1e-9 kg/m³ for ρ, 1e-10 relative for α and β.
            Assert.True(Math.Abs(eos.Density(v[0], v[1], v[2]) - v[3]) < 1e-9, $"ρ at SA={v[0]}, CT={v[1]}, p={v[2]} (seed {seed})");
            Assert.True(Math.Abs(eos.ThermalExpansion(v[0], v[1], v[2]) / v[4] - 1) < 1e-10 || Math.Abs(v[4]) < 1e-9 && Math.Abs(eos.ThermalExpansion(v[0], v[1], v[2]) - v[4]) < 1e-15,
                $"α at SA={v[0]}, CT={v[1]}, p={v[2]} (seed {seed})");
            Assert.True(Math.Abs(eos.HalineContraction(v[0], v[1], v[2]) / v[5] - 1) < 1e-10, $"β at SA={v[0]}, CT={v[1]}, p={v[2]} (seed {seed})");
            n++;
        }
        Assert.Equal(300, n);
    }
}
