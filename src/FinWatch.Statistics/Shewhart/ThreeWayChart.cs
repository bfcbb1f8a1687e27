namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// The three-way chart for nested fab data (after Wheeler's three-way chart for subgrouped data, extended here to two
/// nesting levels): lot means on an individuals and moving-range chart, the spread of wafer means within each lot on a
/// range (or standard-deviation) chart, and the spread of sites within each wafer on a range (or standard-deviation)
/// chart. Each chart's limits come from its own level's variation, so a wafer-to-wafer problem is not hidden by the
/// site noise and a lot-to-lot drift is not judged against within-wafer limits.
/// </summary>
/// <param name="BetweenLots">I-MR chart of lot means (the mean of the lot's wafer means); one position per lot.</param>
/// <param name="WithinLot">Spread of the wafer means within each lot; one position per lot.</param>
/// <param name="WithinWafer">Spread of the sites within each wafer; one position per wafer, lots in order.</param>
/// <param name="WaferLot">For each <see cref="WithinWafer"/> position, the lot position it belongs to.</param>
/// <param name="SigmaSite">Within-wafer sigma of site values.</param>
/// <param name="SigmaWafer">Wafer-to-wafer sigma within a lot, with the site part removed (0 when the site part explains it all).</param>
/// <param name="SigmaLot">Lot-to-lot sigma, with the within-lot part removed.</param>
public sealed record ThreeWayChart(
    ShewhartChart BetweenLots,
    ChartSeries WithinLot,
    ChartSeries WithinWafer,
    int[] WaferLot,
    double? SigmaSite,
    double? SigmaWafer,
    double? SigmaLot)
{
    /// <summary>Builds the three charts from lots → wafers → site values (NaN for a missing site).</summary>
    /// <param name="lots">Each lot's wafers, each wafer's site values. At most 25 wafers a lot and 25 sites a wafer.</param>
    /// <param name="useRange">Ranges (true) or standard deviations (false) for the two spread charts.</param>
    /// <param name="mode">Constants mode.</param>
    /// <param name="multiplier">Sigma multiplier of the limits.</param>
    public static ThreeWayChart Compute(IReadOnlyList<IReadOnlyList<double[]>> lots, bool useRange = true,
        Constants.ConstantsMode mode = Constants.ConstantsMode.Exact, double multiplier = ShewhartCharts.DefaultMultiplier)
    {
        var type = useRange ? ShewhartChartType.MeanRange : ShewhartChartType.MeanStandardDeviation;
        var wafers = new List<double[]>();
        var waferLot = new List<int>();
        var waferMeans = new double[lots.Count][];
        var sitesPerWafer = new RunningMoments();
        for (var l = 0; l < lots.Count; l++)
        {
            waferMeans[l] = new double[lots[l].Count];
            for (var w = 0; w < lots[l].Count; w++)
            {
                var m = new RunningMoments();
                foreach (var v in lots[l][w])
                {
                    if (!double.IsNaN(v))
                    {
                        m.Add(v);
                    }
                }

                waferMeans[l][w] = m.Count > 0 ? m.Mean : double.NaN;
                wafers.Add(lots[l][w]);
                waferLot.Add(l);
                if (m.Count > 0)
                {
                    sitesPerWafer.Add(m.Count);
                }
            }
        }

        var siteChart = ShewhartCharts.Subgroups(wafers, type, LimitRequest.FromData, mode, multiplier);
        var lotChart = ShewhartCharts.Subgroups(waferMeans, type, LimitRequest.FromData, mode, multiplier);
        var lotMeans = lotChart.Primary.Values;
        var between = ShewhartCharts.Individuals(lotMeans, LimitRequest.FromData, mode, multiplier);

        var wafersPerLot = new RunningMoments();
        foreach (var means in waferMeans)
        {
            var k = means.Count(v => !double.IsNaN(v));
            if (k > 0)
            {
                wafersPerLot.Add(k);
            }
        }

        // Variance components (expected mean squares of a balanced nested design, used with the average sizes):
        // var(wafer mean within lot) = σ_w² + σ_s²/n, var(lot mean) = σ_l² + (σ_w² + σ_s²/n)/k.
        var sigmaSite = siteChart.Sigma;
        var sigmaWaferMean = lotChart.Sigma;
        double? sigmaWafer = sigmaSite is { } ss && sigmaWaferMean is { } swm && sitesPerWafer.Count > 0
            ? Math.Sqrt(Math.Max(0, (swm * swm) - (ss * ss / sitesPerWafer.Mean)))
            : null;
        double? sigmaLot = between.Sigma is { } slm && sigmaWaferMean is { } swm2 && wafersPerLot.Count > 0
            ? Math.Sqrt(Math.Max(0, (slm * slm) - (swm2 * swm2 / wafersPerLot.Mean)))
            : null;
        return new ThreeWayChart(between, lotChart.Secondary!, siteChart.Secondary!, [.. waferLot], sigmaSite, sigmaWafer, sigmaLot);
    }
}
