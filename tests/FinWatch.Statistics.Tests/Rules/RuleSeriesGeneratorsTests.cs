using FinWatch.Statistics.Rules;
using FsCheck.Fluent;
using Xunit.Abstractions;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>The generated series must make every rule fire, or the properties of <see cref="RunRulePropertyTests"/> would prove little.</summary>
public class RuleSeriesGeneratorsTests(ITestOutputHelper output)
{
    [Fact]
    public void Series_Sample_EveryRuleSignalsAndNullOccurs()
    {
        var counts = new int[12];
        var seriesWithNullZoneFlags = 0;
        foreach (var s in RuleSeriesGenerators.Series.Sample(500, 300))
        {
            var result = RunRuleEvaluation.Evaluate(s.Values, s.Z, Enum.GetValues<RunRule>());
            foreach (var signal in result.Signals)
            {
                counts[(int)signal.Rule]++;
            }

            seriesWithNullZoneFlags += result.Flags[RunRule.WE1] is null ? 1 : 0;
        }

        output.WriteLine(string.Join(", ", counts.Select((c, r) => $"{(RunRule)r}: {c}")) + $"; null zone flags: {seriesWithNullZoneFlags}");
        Assert.All(counts, c => Assert.True(c >= 5, $"a rule fired only {c} times in 300 series"));
        Assert.True(seriesWithNullZoneFlags > 0);
    }
}
