using FinWatch.Statistics.Constants;
using FinWatch.Statistics.Shewhart;

namespace FinWatch.Statistics.Tests.Shewhart;

public class ShewhartChartsTests
{
    // NIST/SEMATECH e-Handbook of Statistical Methods §6.3.2.2, individuals chart of 10 batch flow rates (docs/statistics.md case 17):
    // x̄ = 50.81, MR̄ = 1.8778, UCL = 55.8041, LCL = 45.8159 with d2 = 1.128 (table mode); in control.
    private static readonly double[] FlowRate = [49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1];

    [Fact]
    public void Individuals_NistFlowRateTableMode_ReproducesThePublishedLimits()
    {
        var chart = ShewhartCharts.Individuals(FlowRate, LimitRequest.FromData, ConstantsMode.Table);
        Assert.Equal(50.81, chart.Center, 10);
        Assert.Equal(1.8778, chart.Secondary!.Center[1], 4);
        Assert.Equal(55.8041, chart.Primary.Upper[0], 4);
        Assert.Equal(45.8159, chart.Primary.Lower[0], 4);
        Assert.Equal([2.0, 2.3, 1.4, 3.5, 3.4, 1.4, 0.2, 1.2, 1.5], chart.Secondary.Values.Skip(1).Select(v => Math.Round(v, 10)));
        Assert.True(double.IsNaN(chart.Secondary.Values[0]));
        Assert.Empty(chart.Primary.BeyondLimits());
        Assert.Empty(chart.Secondary.BeyondLimits());
        // MR chart UCL = D4(2)·MR̄ = 3.267·1.8778 (printed D4, docs/statistics.md §2.1).
        Assert.Equal(3.267 * (16.9 / 9), chart.Secondary.Upper[1], 10);
        Assert.Equal(0, chart.Secondary.Lower[1]);
    }

    [Fact]
    public void Individuals_NistFlowRateExactMode_GivesTheExactD2Limit()
    {
        // docs/statistics.md §1.4 quotes 55.8025 for d2 = 2/√π; the arithmetic x̄ + 3·MR̄/(2/√π) = 50.81 + 3·1.87778/1.128379 gives
        // 55.80241, so the check is the formula (exact) and the figure of docs/statistics.md to within 2e-4.
        var chart = ShewhartCharts.Individuals(FlowRate, LimitRequest.FromData);
        Assert.Equal(50.81 + (3 * (16.9 / 9) / (2 / Math.Sqrt(Math.PI))), chart.Primary.Upper[0], 10);
        Assert.Equal(55.8025, chart.Primary.Upper[0], 0.0002);
        Assert.Equal((16.9 / 9) / (2 / Math.Sqrt(Math.PI)), chart.Sigma!.Value, 10);
    }

    [Fact]
    public void Individuals_GapInTheSeries_TakesTheMovingRangeAcrossIt()
    {
        // docs/statistics.md §3.3 item 8: the moving range after a gap is taken between the values either side of it.
        var chart = ShewhartCharts.Individuals([1.0, double.NaN, 4.0, 2.0], LimitRequest.FromData);
        Assert.True(double.IsNaN(chart.Secondary!.Values[1]));
        Assert.Equal(3.0, chart.Secondary.Values[2]);
        Assert.Equal(2.0, chart.Secondary.Values[3]);
        Assert.Equal(7.0 / 3, chart.Center, 12);
        Assert.True(double.IsNaN(chart.ZoneScores[1]));
    }

    [Fact]
    public void Individuals_Baseline_EstimatesFromTheFirstPositionsOnly()
    {
        double[] values = [10, 11, 10, 11, 30, 31];
        var chart = ShewhartCharts.Individuals(values, new LimitRequest(LimitSource.Baseline, BaselineCount: 4));
        // Baseline mean of 10, 11, 10, 11 is 10.5; the three moving ranges inside it are 1 (docs/statistics.md §2.4).
        Assert.Equal(10.5, chart.Center, 12);
        Assert.Equal(1 / (2 / Math.Sqrt(Math.PI)), chart.Sigma!.Value, 12);
        Assert.Equal([4, 5], chart.Primary.BeyondLimits());
        Assert.Equal(LimitSource.Baseline, chart.Source);
    }

    [Fact]
    public void Individuals_ExcludedPoint_IsLeftOutOfTheEstimateButStillJudged()
    {
        double[] values = [10, 11, 10, 25, 11, 10];
        var chart = ShewhartCharts.Individuals(values, new LimitRequest(LimitSource.Data, Excluded: new HashSet<int> { 3 }));
        Assert.Equal(10.4, chart.Center, 12);
        // Moving ranges touching position 3 are left out: |11−10|, |10−11|, |10−11| remain, mean 1.
        Assert.Equal(1 / (2 / Math.Sqrt(Math.PI)), chart.Sigma!.Value, 12);
        Assert.Contains(3, chart.Primary.BeyondLimits());
    }

    [Fact]
    public void Individuals_KnownLimits_UseMeanAndSigmaAsGiven()
    {
        var chart = ShewhartCharts.Individuals([0.0, 3.5, -1.0], new LimitRequest(LimitSource.Known, KnownMean: 0, KnownSigma: 1));
        Assert.Equal(3.0, chart.Primary.Upper[0]);
        Assert.Equal([1], chart.Primary.BeyondLimits());
        // MR chart with known sigma: centre d2·σ, UCL (d2 + 3·d3)·σ (docs/statistics.md §2.1).
        var c = ControlChartConstants.Get(2);
        Assert.Equal(c.RangeMean, chart.Secondary!.Center[0], 12);
        Assert.Equal(c.RangeMean + (3 * c.RangeSd), chart.Secondary.Upper[0], 12);
    }

    [Fact]
    public void Individuals_PointExactlyOnTheLimit_IsNotBeyond()
    {
        // docs/statistics.md §2.4 and 3.3 item 1: "beyond the limits" is strict.
        var chart = ShewhartCharts.Individuals([3.0, -3.0, 3.0000001], new LimitRequest(LimitSource.Known, KnownMean: 0, KnownSigma: 1));
        Assert.Equal([2], chart.Primary.BeyondLimits());
    }

    [Fact]
    public void Individuals_ConstantSeries_ReportsZeroSigmaAndNoZoneScores()
    {
        var chart = ShewhartCharts.Individuals([5.0, 5.0, 5.0, 5.0], LimitRequest.FromData);
        Assert.Equal(0, chart.Sigma);
        Assert.All(chart.ZoneScores, z => Assert.True(double.IsNaN(z)));
        Assert.Contains(chart.Warnings, w => w.Contains("zero", StringComparison.Ordinal));
    }

    [Fact]
    public void Individuals_EmptyAndSinglePoint_GiveNoSigma()
    {
        Assert.Null(ShewhartCharts.Individuals([], LimitRequest.FromData).Sigma);
        var one = ShewhartCharts.Individuals([4.0], LimitRequest.FromData);
        Assert.Equal(4.0, one.Center);
        Assert.Null(one.Sigma);
        Assert.True(double.IsNaN(one.Primary.Upper[0]));
    }

    [Fact]
    public void Individuals_HugeOffset_GivesTheSameLimitsRelativeToTheCentre()
    {
        var small = ShewhartCharts.Individuals(FlowRate, LimitRequest.FromData);
        var shifted = ShewhartCharts.Individuals(FlowRate.Select(v => v + 1e9).ToArray(), LimitRequest.FromData);
        Assert.Equal(small.Sigma!.Value, shifted.Sigma!.Value, 5);
        Assert.Equal(small.Primary.Upper[0] - small.Center, shifted.Primary.Upper[0] - shifted.Center, 5);
    }

    [Fact]
    public void Subgroups_EqualSizesTableMode_MatchTextbookFormulas()
    {
        // With equal n the limits must be x̄̄ ± A2·R̄, D3·R̄, D4·R̄ (Montgomery ch. 6; docs/statistics.md §2.2) with the printed factors.
        double[][] groups = [[1, 2, 3, 4, 5], [2, 2, 4, 5, 7], [0, 3, 3, 3, 6], [1, 1, 2, 6, 5]];
        var rbar = groups.Average(g => g.Max() - g.Min());
        var grand = groups.SelectMany(g => g).Average();
        var chart = ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanRange, LimitRequest.FromData, ConstantsMode.Table);
        Assert.Equal(grand + (0.577 * rbar), chart.Primary.Upper[0], 12);
        Assert.Equal(grand - (0.577 * rbar), chart.Primary.Lower[0], 12);
        Assert.Equal(rbar, chart.Secondary!.Center[0], 12);
        Assert.Equal(2.114 * rbar, chart.Secondary.Upper[0], 12);
        Assert.Equal(0, chart.Secondary.Lower[0]);
        Assert.Equal(rbar / 2.326, chart.Sigma!.Value, 12);
    }

    [Fact]
    public void Subgroups_EqualSizesStandardDeviation_MatchTextbookFormulas()
    {
        // x̄̄ ± A3·s̄, B3·s̄, B4·s̄ (Montgomery ch. 6; docs/statistics.md §2.2), printed factors for n = 5: A3 1.427, B4 2.089.
        double[][] groups = [[1, 2, 3, 4, 5], [2, 2, 4, 5, 7], [0, 3, 3, 3, 6]];
        var sbar = groups.Average(SampleSd);
        var grand = groups.SelectMany(g => g).Average();
        var chart = ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanStandardDeviation, LimitRequest.FromData, ConstantsMode.Table);
        Assert.Equal(grand + (1.427 * sbar), chart.Primary.Upper[0], 12);
        Assert.Equal(2.089 * sbar, chart.Secondary!.Upper[0], 12);
        Assert.Equal(sbar / 0.9400, chart.Sigma!.Value, 12);
    }

    [Fact]
    public void Subgroups_UnequalSizes_FollowTheSigmaHatConvention()
    {
        // docs/statistics.md §2.3: σ̂ = mean of R_i/d2(n_i) over subgroups with n_i ≥ 2; limits x̄̄ ± 3σ̂/√n_i; a one-value subgroup is
        // plotted against ±3σ̂ and has no range point; an empty subgroup has no point.
        double[][] groups = [[1, 3, 2], [4, double.NaN, 6, 5, 5], [2], []];
        var d3 = ControlChartConstants.Get(3).RangeMean;
        var d4 = ControlChartConstants.Get(4).RangeMean;
        var sigma = ((2 / d3) + (2 / d4)) / 2;
        var chart = ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanRange, LimitRequest.FromData);
        Assert.Equal(sigma, chart.Sigma!.Value, 12);
        Assert.Equal([3, 4, 1, 0], chart.SubgroupSizes);
        Assert.Equal(28.0 / 8, chart.Center, 12);
        Assert.Equal(chart.Center + (3 * sigma / Math.Sqrt(3)), chart.Primary.Upper[0], 12);
        Assert.Equal(chart.Center + (3 * sigma / 2), chart.Primary.Upper[1], 12);
        Assert.Equal(chart.Center + (3 * sigma), chart.Primary.Upper[2], 12);
        Assert.True(double.IsNaN(chart.Secondary!.Values[2]));
        Assert.True(double.IsNaN(chart.Primary.Values[3]));
        Assert.Equal(d4 * sigma, chart.Secondary.Center[1], 12);
        Assert.Contains(chart.Warnings, w => w.Contains("vary", StringComparison.Ordinal));
    }

    [Fact]
    public void Subgroups_TooLarge_Throws()
    {
        double[][] groups = [Enumerable.Range(0, 26).Select(i => (double)i).ToArray()];
        Assert.Throws<ArgumentOutOfRangeException>(() => ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanRange, LimitRequest.FromData));
    }

    [Fact]
    public void Subgroups_ZoneScores_AreThirdsOfTheDistanceToTheLimit()
    {
        // docs/statistics.md §3.3: z = (x − CL)/sigma_point with sigma_point = sigma_hat/√n (a third of the distance to the limit).
        double[][] groups = [[1, 2, 3, 4], [2, 3, 4, 5], [0, 1, 2, 3]];
        var chart = ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanRange, LimitRequest.FromData);
        var sigmaPoint = chart.Sigma!.Value / 2;
        Assert.Equal((3.5 - chart.Center) / sigmaPoint, chart.ZoneScores[1], 12);
    }

    private static double SampleSd(double[] g)
    {
        var mean = g.Average();
        return Math.Sqrt(g.Sum(v => (v - mean) * (v - mean)) / (g.Length - 1));
    }
}
