using System.Globalization;
using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>
/// TEOS-10 (75-term polynomial) against outside references: the official TEOS-10 check cast and
/// tolerances, the GSW reference values of the seawater README, and a 402-point fixture from GSW.
/// </summary>
public sealed class Teos10Tests
{
    // Source: gsw/tests/gsw_cv_v3_0.npz shipped by Debian's python3-gsw 3.6.16, exported to
    // Fixtures/Seawater/gsw_check_cast.csv and gsw_check_tolerances.csv by export_gsw_check_values.py.
    private static readonly SeawaterFixture Cast = SeawaterFixture.Load("gsw_check_cast.csv");
    private static readonly SeawaterFixture Tolerances = SeawaterFixture.Load("gsw_check_tolerances.csv");

    private static double Tolerance(string name) =>
        Tolerances.Rows.Where(r => r[0] == name).Select(r => Tolerances.Value(r, "tolerance")).Single();

    private static IEnumerable<(string Where, double Expected, double Actual)> OverCast(string expectedColumn, Func<string[], double> actual) =>
        Cast.Rows.Select((r, i) => ($"cast point {i} (SA {Cast.Text(r, "SA_chck_cast")}, CT {Cast.Text(r, "CT_chck_cast")}, p {Cast.Text(r, "p_chck_cast")})",
            Cast.Value(r, expectedColumn), actual(r)));

    private static double SA(string[] r) => Cast.Value(r, "SA_chck_cast");
    private static double CT(string[] r) => Cast.Value(r, "CT_chck_cast");
    private static double P(string[] r) => Cast.Value(r, "p_chck_cast");

    [Fact]
    public void CheckCastCoversTheThreeCasts()
    {
        // gsw_cv_v3_0.npz (python3-gsw 3.6.16): 45 + 45 + 8 finite points.
        Assert.Equal(98, Cast.Rows.Count);
        Assert.Contains(Cast.Comments, c => c.Contains("python3-gsw 3.6.16", StringComparison.Ordinal));
    }

    [Fact]
    public void DensityMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'rho' with tolerance 'rho_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("rho", OverCast("rho", r => Teos10.Density(SA(r), CT(r), P(r))), Tolerance("rho_ca"));

    [Fact]
    public void SpecificVolumeMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'specvol' with tolerance 'specvol_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("specvol", OverCast("specvol", r => Teos10.SpecificVolume(SA(r), CT(r), P(r))), Tolerance("specvol_ca"));

    [Fact]
    public void ThermalExpansionMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'alpha' with tolerance 'alpha_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("alpha", OverCast("alpha", r => Teos10.ThermalExpansion(SA(r), CT(r), P(r))), Tolerance("alpha_ca"));

    [Fact]
    public void HalineContractionMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'beta' with tolerance 'beta_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("beta", OverCast("beta", r => Teos10.HalineContraction(SA(r), CT(r), P(r))), Tolerance("beta_ca"));

    [Fact]
    public void EquationOfStateAdapterIsTeos10ItselfOnCheckCast()
    {
        // Same check values through IEquationOfState (the box model's variables are SA, CT, p).
        IEquationOfState eos = EquationsOfState.Create("teos10");
        Assertions.AllWithin("rho via interface", OverCast("rho", r => eos.Density(SA(r), CT(r), P(r))), Tolerance("rho_ca"));
        Assertions.AllWithin("alpha via interface", OverCast("alpha", r => eos.ThermalExpansion(SA(r), CT(r), P(r))), Tolerance("alpha_ca"));
        Assertions.AllWithin("beta via interface", OverCast("beta", r => eos.HalineContraction(SA(r), CT(r), P(r))), Tolerance("beta_ca"));
    }

    [Fact]
    public void ReferenceSalinityFromPracticalMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'SR_from_SP' with 'SR_from_SP_ca' (python3-gsw 3.6.16): SA = SR when the anomaly is zero.
        Assertions.AllWithin("SR_from_SP",
            OverCast("SR_from_SP", r => SalinityConversions.AbsoluteFromPractical(Cast.Value(r, "SP_chck_cast"))), Tolerance("SR_from_SP_ca"));

    [Fact]
    public void PracticalFromReferenceSalinityMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'SP_from_SR' of 'SR_from_SP', tolerance 'SP_from_SR_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("SP_from_SR",
            OverCast("SP_from_SR", r => SalinityConversions.PracticalFromAbsolute(Cast.Value(r, "SR_from_SP"))), Tolerance("SP_from_SR_ca"));

    [Fact]
    public void PotentialFromConservativeTemperatureMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'pt_from_CT' with 'pt_from_CT_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("pt_from_CT",
            OverCast("pt_from_CT", r => TemperatureConversions.PotentialFromConservative(SA(r), CT(r))), Tolerance("pt_from_CT_ca"));

    [Fact]
    public void ConservativeFromPotentialTemperatureMatchesCheckCast() =>
        // gsw_cv_v3_0.npz 'CT_from_pt' of (SA, pt_from_CT), tolerance 'CT_from_pt_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("CT_from_pt",
            OverCast("CT_from_pt", r => TemperatureConversions.ConservativeFromPotential(SA(r), Cast.Value(r, "pt_from_CT"))), Tolerance("CT_from_pt_ca"));

    [Fact]
    public void ConservativeFromInSituTemperatureMatchesCheckCastThroughPotentialTemperature() =>
        // gsw_cv_v3_0.npz 'CT_from_t' is CT of (SA, t, p); from the check value of its potential temperature
        // 'pt0_from_t' the conversion must give it within 'CT_from_t_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("CT_from_t via pt0_from_t",
            OverCast("CT_from_t", r => TemperatureConversions.ConservativeFromPotential(SA(r), Cast.Value(r, "pt0_from_t"))), Tolerance("CT_from_t_ca"));

    [Fact]
    public void ConservativeFromInSituTemperatureAtTheSurfaceMatchesCheckCast()
    {
        // gsw_cv_v3_0.npz 'CT_from_t' at the cast points with p = 0 (one per cast), tolerance 'CT_from_t_ca'.
        var surface = Cast.Rows.Where(r => P(r) == 0).ToList();
        Assert.Equal(3, surface.Count);
        Assertions.AllWithin("CT_from_t at p = 0",
            surface.Select(r => ("surface", Cast.Value(r, "CT_from_t"),
                TemperatureConversions.ConservativeFromInSituAtSurface(SA(r), Cast.Value(r, "t_chck_cast")))),
            Tolerance("CT_from_t_ca"));
    }

    [Fact]
    public void T90FromT68MatchesCheckCast() =>
        // gsw_cv_v3_0.npz 't90_from_t68' of t_chck_cast, tolerance 't90_from_t68_ca' (python3-gsw 3.6.16).
        Assertions.AllWithin("t90_from_t68",
            OverCast("t90_from_t68", r => TemperatureConversions.T90FromT68(Cast.Value(r, "t_chck_cast"))), Tolerance("t90_from_t68_ca"));

    [Theory]
    // GSW reference values in src/Model/Data/Seawater/README.md (python3-gsw 3.6.16), to their printed digits.
    [InlineData(35.16504, 25.0, 0.0, 1023.3431336, 0.5e-7)]
    [InlineData(35.16504, 5.0, 0.0, 1027.6750088, 0.5e-7)]
    public void DensityMatchesReadmeReferenceValues(double sa, double ct, double p, double rho, double halfUnit) =>
        Assert.InRange(Teos10.Density(sa, ct, p), rho - halfUnit, rho + halfUnit);

    [Theory]
    // GSW reference values in src/Model/Data/Seawater/README.md (python3-gsw 3.6.16), to their printed digits.
    [InlineData(35.0, 25.0, 0.0, 2.9674e-4)]
    [InlineData(35.0, 5.0, 0.0, 1.1319e-4)]
    public void ThermalExpansionMatchesReadmeReferenceValues(double sa, double ct, double p, double alpha) =>
        Assert.InRange(Teos10.ThermalExpansion(sa, ct, p), alpha - 0.5e-8, alpha + 0.5e-8);

    [Fact]
    public void HalineContractionMatchesReadmeReferenceValue() =>
        // README: β(35, 25, 0) = 7.2362e-4 kg/g (python3-gsw 3.6.16).
        Assert.InRange(Teos10.HalineContraction(35.0, 25.0, 0.0), 7.2362e-4 - 0.5e-8, 7.2362e-4 + 0.5e-8);

    // Fixtures/Seawater/gsw_rho_alpha_beta.csv: gsw.rho, gsw.alpha, gsw.beta of python3-gsw 3.6.16 (Debian),
    // generated by generate_gsw_fixture.py (252 grid + 150 random points over SA 0–42, CT −2–40, p 0–8000).
    private static readonly SeawaterFixture Gsw = SeawaterFixture.Load("gsw_rho_alpha_beta.csv");

    private static IEnumerable<(string Where, double Expected, double Actual)> OverGsw(string column, Func<double, double, double, double> actual) =>
        Gsw.Rows.Select(r => (string.Create(CultureInfo.InvariantCulture, $"SA {Gsw.Text(r, "SA")}, CT {Gsw.Text(r, "CT")}, p {Gsw.Text(r, "p")}"),
            Gsw.Value(r, column), actual(Gsw.Value(r, "SA"), Gsw.Value(r, "CT"), Gsw.Value(r, "p"))));

    [Fact]
    public void GswFixtureSpansTheOceanographicRange()
    {
        Assert.True(Gsw.Rows.Count >= 200);
        Assert.Equal(0.0, Gsw.Column("SA").Min());
        Assert.Equal(42.0, Gsw.Column("SA").Max());
        Assert.Equal(-2.0, Gsw.Column("CT").Min());
        Assert.Equal(40.0, Gsw.Column("CT").Max());
        Assert.Equal(8000.0, Gsw.Column("p").Max());
        Assert.Contains(Gsw.Comments, c => c.Contains("python3-gsw 3.6.16", StringComparison.Ordinal));
    }

    [Fact]
    public void DensityMatchesGswFixtureTo1e9() =>
        // gsw.rho, python3-gsw 3.6.16: agreement to 1e-9 kg/m³.
        Assertions.AllWithin("rho vs gsw.rho", OverGsw("rho", Teos10.Density), 1e-9);

    [Fact]
    public void ThermalExpansionMatchesGswFixtureTo1e10Relative() =>
        // gsw.alpha, python3-gsw 3.6.16: agreement to 1e-10 relative.
        Assertions.AllWithin("alpha vs gsw.alpha", OverGsw("alpha", Teos10.ThermalExpansion), expected => 1e-10 * Math.Abs(expected));

    [Fact]
    public void HalineContractionMatchesGswFixtureTo1e10Relative() =>
        // gsw.beta, python3-gsw 3.6.16: agreement to 1e-10 relative.
        Assertions.AllWithin("beta vs gsw.beta", OverGsw("beta", Teos10.HalineContraction), expected => 1e-10 * Math.Abs(expected));
}
