using FinWatch.Statistics.Shewhart;

namespace FinWatch.Statistics.Tests.Shewhart;

public class SummaryLimitsTests
{
    [Theory]
    // c4 from Montgomery, Introduction to Statistical Quality Control, Appendix VI (4 decimals printed).
    [InlineData(2, 0.7979)]
    [InlineData(5, 0.9400)]
    [InlineData(10, 0.9727)]
    [InlineData(25, 0.9896)]
    public void C4_MatchesThePrintedTable(int n, double printed) => Assert.Equal(printed, SummaryLimits.C4(n), 0.00005);

    [Fact]
    public void MeanStandardDeviation_FromSummaries_EqualsTheRawDataChart()
    {
        // docs/statistics.md §2.3 from summaries against the engine's own Xbar-S on the raw values (unequal sizes 1..13).
        var random = new Random(3);
        var groups = Enumerable.Range(0, 40).Select(i => Enumerable.Range(0, 1 + (i % 13)).Select(_ => 5 + random.NextDouble()).ToArray()).ToList();
        var chart = ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanStandardDeviation, LimitRequest.FromData);
        var means = groups.Select(g => g.Average()).ToArray();
        var sizes = groups.Select(g => g.Length).ToArray();
        var sds = groups.Select(g => g.Length < 2 ? 0 : Math.Sqrt(g.Sum(x => (x - g.Average()) * (x - g.Average())) / (g.Length - 1))).ToArray();
        var (centre, sigma) = SummaryLimits.MeanStandardDeviation(means, sizes, sds);
        Assert.Equal(chart.Center, centre, 1e-12);
        Assert.Equal(chart.Sigma!.Value, sigma!.Value, 1e-12);
    }

    [Fact]
    public void Individuals_EqualsTheEngineIChart()
    {
        var random = new Random(4);
        var values = Enumerable.Range(0, 50).Select(_ => random.NextDouble()).ToArray();
        var chart = ShewhartCharts.Individuals(values, LimitRequest.FromData);
        var (centre, sigma) = SummaryLimits.Individuals(values);
        Assert.Equal(chart.Center, centre, 1e-12);
        Assert.Equal(chart.Sigma!.Value, sigma!.Value, 1e-9);
    }

    [Fact]
    public void MeanStandardDeviation_OnlySingletons_HasNoSigma()
    {
        var (_, sigma) = SummaryLimits.MeanStandardDeviation([1.0, 2.0], [1, 1], [0.0, 0.0]);
        Assert.Null(sigma);
    }
}
