using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>Rule sets, identifiers and classification (docs/statistics.md §3.1 lists WE1–4, §3.2 lists N1–8 and which need zones).</summary>
public class RunRulesTests
{
    public static TheoryData<string, RunRule> Ids => new()
    {
        { "WE1", RunRule.WE1 }, { "WE2", RunRule.WE2 }, { "WE3", RunRule.WE3 }, { "WE4", RunRule.WE4 },
        { "N1", RunRule.N1 }, { "N2", RunRule.N2 }, { "N3", RunRule.N3 }, { "N4", RunRule.N4 },
        { "N5", RunRule.N5 }, { "N6", RunRule.N6 }, { "N7", RunRule.N7 }, { "N8", RunRule.N8 },
    };

    [Theory]
    [MemberData(nameof(Ids))]
    public void TryParse_RuleId_ReturnsThatRule(string id, RunRule expected)
    {
        Assert.True(RunRules.TryParse(id, out var rules));
        Assert.Equal([expected], rules);
        Assert.True(RunRules.TryParse(id.ToLowerInvariant(), out var lower));
        Assert.Equal([expected], lower);
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void Id_EveryRule_ReturnsItsIdentifier(string expectedId, RunRule rule) =>
        Assert.Equal(expectedId, RunRules.Id(rule));

    [Fact]
    public void TryParse_WesternElectric_ReturnsWE1ToWE4()
    {
        Assert.True(RunRules.TryParse("westernElectric", out var rules));
        Assert.Equal([RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4], rules);
        Assert.Equal(rules, RunRules.WesternElectric);
    }

    [Fact]
    public void TryParse_Nelson_ReturnsN1ToN8()
    {
        Assert.True(RunRules.TryParse("nelson", out var rules));
        Assert.Equal([RunRule.N1, RunRule.N2, RunRule.N3, RunRule.N4, RunRule.N5, RunRule.N6, RunRule.N7, RunRule.N8], rules);
        Assert.Equal(rules, RunRules.Nelson);
    }

    [Theory]
    [InlineData("WE5")]
    [InlineData("N9")]
    [InlineData("N0")]
    [InlineData("")]
    [InlineData(" WE1")]
    [InlineData("western")]
    [InlineData(null)]
    public void TryParse_UnknownId_ReturnsFalseAndEmpty(string? id)
    {
        Assert.False(RunRules.TryParse(id, out var rules));
        Assert.Empty(rules);
    }

    // docs/statistics.md §3.2 / §3.3 item 9: N3 and N4 look at values only; every other rule needs zones.
    [Fact]
    public void IsZoneRule_AllRules_FalseOnlyForN3AndN4()
    {
        foreach (var rule in Enum.GetValues<RunRule>())
        {
            Assert.Equal(rule is not (RunRule.N3 or RunRule.N4), RunRules.IsZoneRule(rule));
        }
    }

    [Fact]
    public void IdAndIsZoneRule_UndefinedRule_Throw()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => RunRules.Id((RunRule)12));
        Assert.Throws<ArgumentOutOfRangeException>(() => RunRules.IsZoneRule((RunRule)(-1)));
    }

    [Fact]
    public void Sets_AreReadOnly_CannotBeMutatedThroughACast()
    {
        Assert.False(RunRules.WesternElectric is RunRule[]);
        Assert.False(RunRules.Nelson is RunRule[]);
        Assert.True(((ICollection<RunRule>)RunRules.Nelson).IsReadOnly);
    }
}
