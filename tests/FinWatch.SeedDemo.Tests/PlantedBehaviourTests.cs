namespace FinWatch.SeedDemo.Tests;

/// <summary>The planted behaviour of the invented fab is visible in the rows, at a small scale.</summary>
public sealed class PlantedBehaviourTests
{
    private static readonly TimeSpan Week = TimeSpan.FromDays(7);

    public static TheoryData<DateTime> TaperResetsInWindow()
    {
        var data = new TheoryData<DateTime>();
        foreach (DemoEvent e in DemoFab.Events.Where(e => e.Kind == DemoEventKind.TaperCreepReset && e.AtUtc >= DemoFab.StartUtc(TestData.Season)))
        {
            data.Add(e.AtUtc);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(TaperResetsInWindow))]
    public void TaperCreep_WeekBeforeMaintenance_ExceedsWeekAfterByAboutHalfADegree(DateTime maintenanceUtc)
    {
        string chamber = CreepingChamber();
        DateTime backUp = maintenanceUtc + DemoFab.MaintenanceDowntime;

        double before = MeanTaperExcess(chamber, maintenanceUtc - Week, maintenanceUtc);
        double after = MeanTaperExcess(chamber, backUp, backUp + Week);

        Assert.InRange(before - after, 0.4, 0.9);
    }

    [Fact]
    public void TaperCreep_NinetyDayWindow_HasTwoResets()
    {
        Assert.Equal(2, TaperResetsInWindow().Count);
    }

    [Theory]
    [MemberData(nameof(TaperResetsInWindow))]
    public void TaperCreep_OtherChamberOfTheTool_NoChangeAtTheMaintenance(DateTime maintenanceUtc)
    {
        DemoEvent reset = DemoFab.Events.First(e => e.Kind == DemoEventKind.TaperCreepReset);
        string sibling = TestData.SeasonRows.First(r => r.EtchTool == reset.Tool && r.EtchChamber != reset.Chamber).EtchChamber;

        double before = MeanTaperExcess(sibling, maintenanceUtc - Week, maintenanceUtc);
        double after = MeanTaperExcess(sibling, maintenanceUtc, maintenanceUtc + Week);

        Assert.InRange(before - after, -0.15, 0.15);
    }

    [Fact]
    public void CornerRadiusStep_TwoWeeksAfterMaintenance_LowerByAboutHalfANanometrePerProduct()
    {
        DemoEvent step = DemoFab.Events.Single(e => e.Kind == DemoEventKind.CornerRadiusStep);
        DateTime backUp = step.AtUtc + DemoFab.MaintenanceDowntime;

        foreach (DemoProduct product in DemoFab.Products)
        {
            double before = MeanRadius(step.Chamber, product.Code, step.AtUtc - 2 * Week, step.AtUtc);
            double after = MeanRadius(step.Chamber, product.Code, backUp, backUp + 2 * Week);

            Assert.InRange(before - after, 0.4, 0.6);
        }
    }

    [Fact]
    public void CornerRadiusStep_OtherChambers_NoStep()
    {
        DemoEvent step = DemoFab.Events.Single(e => e.Kind == DemoEventKind.CornerRadiusStep);
        foreach (string chamber in TestData.SeasonRows.Select(r => r.EtchChamber).Distinct().Where(c => c != step.Chamber))
        {
            double before = MeanRadius(chamber, "TRN7", step.AtUtc - 2 * Week, step.AtUtc);
            double after = MeanRadius(chamber, "TRN7", step.AtUtc, step.AtUtc + 2 * Week);

            Assert.InRange(before - after, -0.1, 0.1);
        }
    }

    [Fact]
    public void LinerThinning_ThinningChamber_NegativeSlopeOfAboutMinusPointThreeOverNinetyDays()
    {
        DemoEvent drift = DemoFab.Events.Single(e => e.Kind == DemoEventKind.LinerThinningStart);

        double slopePerDay = LinerSlopePerDay(drift.Chamber);

        Assert.True(slopePerDay < 0.0);
        Assert.InRange(slopePerDay * 90.0, -0.36, -0.24);
    }

    [Fact]
    public void LinerThinning_OtherLinerChamber_Flat()
    {
        DemoEvent drift = DemoFab.Events.Single(e => e.Kind == DemoEventKind.LinerThinningStart);
        string other = TestData.SeasonRows.First(r => r.LinerChamber is not null && r.LinerChamber != drift.Chamber).LinerChamber!;

        Assert.InRange(LinerSlopePerDay(other) * 90.0, -0.03, 0.03);
    }

    [Fact]
    public void ChamberOffsets_TopWidthMeans_DifferByTenthsOfANanometre()
    {
        var means = Profile()
            .GroupBy(r => r.EtchChamber)
            .ToDictionary(g => g.Key, g => g.Average(r => r.TopWidthNm!.Value - TestData.Product(r.Product).Nominal.TopWidthNm));

        double spread = means.Values.Max() - means.Values.Min();

        Assert.InRange(spread, 0.3, 0.7);
    }

    [Fact]
    public void WithinWaferPattern_EdgeSites_WiderAndLowerThanCentre()
    {
        var trn7 = Profile().Where(r => r.Product == "TRN7").ToList();
        var centre = trn7.Where(r => Radius(r) < 1.0).ToList();
        var edge = trn7.Where(r => Radius(r) > 120.0).ToList();

        Assert.InRange(edge.Average(r => r.TopWidthNm!.Value) - centre.Average(r => r.TopWidthNm!.Value), 0.15, 0.4);
        Assert.InRange(edge.Average(r => r.BottomWidthNm!.Value) - centre.Average(r => r.BottomWidthNm!.Value), 0.2, 0.5);
        Assert.InRange(centre.Average(r => r.FinHeightNm!.Value) - edge.Average(r => r.FinHeightNm!.Value), 0.6, 1.5);
    }

    [Fact]
    public void CornerRadiusNoise_WithinWafer_SkewedToTheRight()
    {
        // Site radius over its wafer's mean: the lognormal site factor, whose skewness is about 3σ = 0.18.
        var ratios = Profile()
            .GroupBy(r => (r.LotId, r.WaferSlot))
            .SelectMany(w =>
            {
                double mean = w.Average(r => r.CornerRadiusNm!.Value);
                return w.Select(r => r.CornerRadiusNm!.Value / mean);
            })
            .ToList();

        Assert.InRange(Skewness(ratios), 0.08, 0.35);
    }

    [Fact]
    public void SiteNoise_RepeatedSiteWithinWafer_RealisticSpread()
    {
        // Spread of a site around its wafer mean, pooled over wafers (includes the centre-to-edge pattern).
        var wafers = Profile().Where(r => r.Product == "BRM7").GroupBy(r => (r.LotId, r.WaferSlot)).ToList();

        Assert.InRange(PooledSd(wafers, r => r.TopWidthNm!.Value), 0.1, 0.25);
        Assert.InRange(PooledSd(wafers, r => r.FinHeightNm!.Value), 0.3, 0.8);
        Assert.InRange(PooledSd(wafers, r => r.LinerThicknessNm!.Value), 0.02, 0.05);
    }

    private static IEnumerable<DemoSiteRow> Profile() => TestData.SeasonRows.Where(TestData.IsProfile);

    private static string CreepingChamber() => DemoFab.Events.First(e => e.Kind == DemoEventKind.TaperCreepReset).Chamber;

    private static double Radius(DemoSiteRow r) => Math.Sqrt(r.SiteXMm * r.SiteXMm + r.SiteYMm * r.SiteYMm);

    private static double MeanTaperExcess(string chamber, DateTime fromUtc, DateTime toUtc)
    {
        var rows = Window(chamber, fromUtc, toUtc).ToList();
        Assert.True(rows.Count > 50, $"only {rows.Count} rows of {chamber} in the window");
        return rows.Average(r => TestData.TaperDeg(r) - TestData.Product(r.Product).Nominal.TaperDeg);
    }

    private static double MeanRadius(string chamber, string product, DateTime fromUtc, DateTime toUtc)
    {
        var rows = Window(chamber, fromUtc, toUtc).Where(r => r.Product == product).ToList();
        Assert.True(rows.Count > 50, $"only {rows.Count} {product} rows of {chamber} in the window");
        return rows.Average(r => r.CornerRadiusNm!.Value);
    }

    private static IEnumerable<DemoSiteRow> Window(string chamber, DateTime fromUtc, DateTime toUtc) =>
        Profile().Where(r => r.EtchChamber == chamber && r.MeasuredAtUtc >= fromUtc && r.MeasuredAtUtc < toUtc);

    private static double LinerSlopePerDay(string chamber)
    {
        DateTime start = DemoFab.StartUtc(TestData.Season);
        var points = Profile()
            .Where(r => r.LinerChamber == chamber)
            .Select(r => ((r.MeasuredAtUtc - start).TotalDays, r.LinerThicknessNm!.Value - TestData.Product(r.Product).Nominal.LinerThicknessNm))
            .ToList();
        return TestData.Slope(points);
    }

    private static double Skewness(IReadOnlyList<double> values)
    {
        double mean = values.Average();
        double m2 = values.Average(v => (v - mean) * (v - mean));
        double m3 = values.Average(v => (v - mean) * (v - mean) * (v - mean));
        return m3 / Math.Pow(m2, 1.5);
    }

    private static double PooledSd(IEnumerable<IGrouping<(string, int), DemoSiteRow>> wafers, Func<DemoSiteRow, double> value)
    {
        double sum = 0.0;
        int degrees = 0;
        foreach (var wafer in wafers)
        {
            double mean = wafer.Average(value);
            sum += wafer.Sum(r => (value(r) - mean) * (value(r) - mean));
            degrees += wafer.Count() - 1;
        }

        return Math.Sqrt(sum / degrees);
    }
}
