using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models;
using Xunit;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>Bad input gets a clear message naming the key, the bad value and what is allowed; partial branches are kept.</summary>
public class BadInputTests
{
    private static ContinuationOptions Range(double min, double max) => new() { ParameterMin = min, ParameterMax = max };

    [Fact]
    public void EditDistanceIsLevenshtein()
    {
        // Classic textbook examples (Levenshtein distance, e.g. Jurafsky and Martin, Speech and Language Processing, §2.5).
        Assert.Equal(3, EditDistance.Levenshtein("kitten", "sitting"));
        Assert.Equal(0, EditDistance.Levenshtein("Eta2", "ETA2", ignoreCase: true));
        Assert.Equal(4, EditDistance.Levenshtein("", "abcd"));
        Assert.Equal(2, EditDistance.Levenshtein("flaw", "lawn"));
        Assert.Equal("Eta2", EditDistance.Closest("Eta22", ["Eta1", "Eta2", "Eta3"]));
    }

    [Fact]
    public void UnknownParameterNameSuggestsTheClosestValidName()
    {
        var model = new StommelBoxModel();
        var e = Assert.Throws<ArgumentException>(() => Continuation.Trace(model, "Etta2", [2.5, 1.8], Range(0, 3)));
        Assert.Contains("'Etta2'", e.Message);
        Assert.Contains("did you mean 'Eta2'", e.Message);
        Assert.Contains("Eta1, Eta2, Eta3", e.Message);
        Assert.Equal(2, ParameterLookup.IndexOf(model, "eta3")); // unique case-insensitive match accepted
        var m = Assert.Throws<ArgumentException>(() => ReferenceModels.Create("stomel"));
        Assert.Contains("did you mean 'stommel'", m.Message);
    }

    [Theory]
    [InlineData(1.0, 1.0)]
    [InlineData(2.0, 0.5)]
    [InlineData(double.NaN, 1.0)]
    public void EmptyOrInvertedRangeIsRejected(double min, double max)
    {
        var e = Assert.Throws<ArgumentException>(() => Continuation.Trace(new SaddleNodeNormalForm(1), "mu", [1.0], Range(min, max)));
        Assert.Contains("empty or inverted", e.Message);
        Assert.Contains("'mu'", e.Message);
        Assert.Equal("ParameterMin", e.ParamName);
    }

    [Fact]
    public void StartOutsideTheRangeIsRejected()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => Continuation.Trace(new SaddleNodeNormalForm(5), "mu", [2.0], Range(-1, 2)));
        Assert.Contains("outside its range", e.Message);
    }

    [Fact]
    public void NonConvergingStartIsDiagnosed()
    {
        // No equilibrium of x' = μ − x² at μ = −1.
        var e = Assert.Throws<SteadyStateNotFoundException>(() => Continuation.Trace(new SaddleNodeNormalForm(-1), "mu", [0.3], Range(-2, 2)));
        Assert.Contains("Cannot start continuation in 'mu'", e.Message);
        Assert.Contains("residual", e.Message);
        Assert.False(e.Result.Converged);
        Assert.True(e.Result.Iterations > 0);
        Assert.True(e.Result.Residual >= 1);
    }

    [Fact]
    public void BranchLeavingTheValidRangeIsKeptAndMarkedAsEndingEarly()
    {
        // Validity predicate: x must stay above 0.5 (standing in for, e.g., an equation of state's range).
        var options = Range(-1, 4) with
        {
            Direction = ContinuationDirection.Decreasing,
            Validity = (state, p) => state[0] < 0.5 ? $"x = {state[0]:G4} is below 0.5, outside the valid range" : null,
        };
        var branch = Continuation.Trace(new SaddleNodeNormalForm(4), "mu", [2.0], options);
        Assert.True(branch.EndedEarly);
        Assert.Equal(EndReason.InvalidState, branch.Forward.Reason);
        Assert.Contains("outside the valid range", branch.Forward.Message);
        Assert.Contains("mu ≈", branch.Forward.Message);
        Assert.True(branch.Points.Count > 5);
        Assert.All(branch.Points, p => Assert.True(p.State[0] >= 0.5));
        var end = branch.OfKind(SpecialPointKind.End).Single();
        Assert.Equal(branch.Forward.Message, end.Description);
        Assert.Equal(BranchPointType.End, branch.Points[^1].Type);
    }

    [Fact]
    public void StateBoundIsLandedOnExactly()
    {
        var options = Range(-1, 4) with { Direction = ContinuationDirection.Decreasing, StateMin = [0.5] };
        var branch = Continuation.Trace(new SaddleNodeNormalForm(4), "mu", [2.0], options);
        Assert.False(branch.EndedEarly);
        Assert.Equal(EndReason.StateBoundReached, branch.Forward.Reason);
        Assert.Equal(0.5, branch.Points[^1].State[0], 10);
        Assert.Equal(0.25, branch.Points[^1].Parameter, 10); // μ = x² on the branch
    }

    [Fact]
    public void PointBudgetEndsEarlyWithTheComputedPartKept()
    {
        var options = Range(-1, 100) with { Direction = ContinuationDirection.Increasing, MaxPoints = 10, MaxStep = 0.01 };
        var branch = Continuation.Trace(new SaddleNodeNormalForm(1), "mu", [1.0], options);
        Assert.True(branch.EndedEarly);
        Assert.Equal(EndReason.MaxPointsReached, branch.Forward.Reason);
        Assert.Equal(10, branch.Points.Count);
        Assert.Null(branch.Reverse);
    }

    [Fact]
    public void BadStepSettingsAreRejectedByName()
    {
        var e = Assert.Throws<ArgumentException>(() => Continuation.Trace(new SaddleNodeNormalForm(1), "mu", [1.0], Range(-1, 2) with { MinStep = 0.5, InitialStep = 0.1 }));
        Assert.Contains("MinStep", e.Message);
        var s = Assert.Throws<ArgumentException>(() => Continuation.Trace(new SaddleNodeNormalForm(1), "mu", [1.0], Range(-1, 2) with { StateScale = [1.0, 2.0] }));
        Assert.Contains("StateScale", s.Message);
    }
}
