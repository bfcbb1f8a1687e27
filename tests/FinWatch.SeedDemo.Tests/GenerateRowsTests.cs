using System.Text.RegularExpressions;

namespace FinWatch.SeedDemo.Tests;

public sealed partial class GenerateRowsTests
{
    private static readonly DateTime FixedEnd = new(2026, 11, 30, 0, 0, 0, DateTimeKind.Utc);

    [Fact]
    public void GenerateRows_SeasonScale_EveryValueInsideIngestValidityRanges()
    {
        Assert.All(TestData.SeasonRows, AssertValid);
    }

    [Fact]
    public void GenerateRows_FullLotsOverNinetyDays_EveryRowValidAndInTimeOrder()
    {
        // Full 25-wafer lots, so the bad wafers (about 1 in 400) are among the rows checked.
        long count = 0;
        DateTime previous = DateTime.MinValue;
        foreach (DemoSiteRow row in DemoFab.GenerateRows(DemoFab.DefaultSeed, TestData.FullLots))
        {
            AssertValid(row);
            if (row.MeasuredAtUtc < previous)
            {
                Assert.Fail($"Row {count} goes back in time: {row}");
            }

            previous = row.MeasuredAtUtc;
            count++;
        }

        int lots = (int)(TestData.FullLots.Days * TestData.FullLots.LotsPerDay);
        Assert.InRange(count, lots * 25 * 9, lots * (25 * 13 + 3 * 5));
    }

    [Fact]
    public void GenerateRows_SeasonScale_UniqueKeysNeverRepeat()
    {
        var keys = new HashSet<(string, int, string, string, DateTime)>();

        Assert.All(TestData.SeasonRows, r => Assert.True(keys.Add((r.LotId, r.WaferSlot, r.SiteId, r.Step, r.MeasuredAtUtc))));
    }

    [Fact]
    public void GenerateRows_SeasonScale_TimesSortedUtcWholeSecondsInsideWindow()
    {
        DemoSiteRow[] rows = TestData.SeasonRows;
        DateTime start = FixedEnd.AddDays(-TestData.Season.Days);

        Assert.All(rows, r =>
        {
            Assert.Equal(DateTimeKind.Utc, r.MeasuredAtUtc.Kind);
            Assert.Equal(0, r.MeasuredAtUtc.Ticks % TimeSpan.TicksPerSecond);
            Assert.InRange(r.MeasuredAtUtc, start, FixedEnd.AddTicks(-1));
        });
        Assert.True(rows.Zip(rows.Skip(1)).All(p => p.First.MeasuredAtUtc <= p.Second.MeasuredAtUtc));
        Assert.Equal(FixedEnd, DemoFab.EndUtc);
        Assert.Equal(start, DemoFab.StartUtc(TestData.Season));
    }

    [Fact]
    public void GenerateRows_EachStep_LotsMeasuredInLotOrderWaferByWaferAMinuteApart()
    {
        foreach (var step in TestData.SeasonRows.GroupBy(r => r.Step))
        {
            var lotStarts = step.GroupBy(r => r.LotId).Select(g => (Lot: g.Key, Start: g.Min(r => r.MeasuredAtUtc))).ToList();
            Assert.Equal(lotStarts.OrderBy(l => l.Lot, StringComparer.Ordinal).Select(l => l.Start), lotStarts.Select(l => l.Start).Order());

            foreach (var lot in step.GroupBy(r => r.LotId))
            {
                var waferStarts = lot.GroupBy(r => r.WaferSlot).Select(g => g.Min(r => r.MeasuredAtUtc)).Order().ToList();
                Assert.All(waferStarts.Zip(waferStarts.Skip(1)), p => Assert.Equal(TimeSpan.FromMinutes(1), p.Second - p.First));
            }
        }
    }

    [Fact]
    public void GenerateRows_TinyScale_RowCountsFollowLotsWafersAndSites()
    {
        DemoSiteRow[] rows = [.. DemoFab.GenerateRows(DemoFab.DefaultSeed, TestData.Tiny)];
        int lots = (int)(TestData.Tiny.Days * TestData.Tiny.LotsPerDay);

        var profileLots = rows.Where(TestData.IsProfile).GroupBy(r => r.LotId).ToList();
        var cdLots = rows.Where(r => !TestData.IsProfile(r)).GroupBy(r => r.LotId).ToList();

        Assert.Equal(lots, rows.Select(r => r.LotId).Distinct().Count());
        Assert.InRange(profileLots.Count, lots - 3, lots);
        Assert.All(profileLots, lot =>
        {
            int sites = lot.First().Product == "TRN7" ? 13 : 9;
            Assert.Equal(TestData.Tiny.WafersPerLot * sites, lot.Count());
        });
        Assert.All(cdLots, lot => Assert.Equal(3 * 5, lot.Count()));
    }

    [Fact]
    public void GenerateRows_ProfileStep_EveryWaferOfTheLotHasItsProductsNineToThirteenSites()
    {
        var wafers = TestData.SeasonRows.Where(TestData.IsProfile).GroupBy(r => (r.LotId, r.WaferSlot)).ToList();

        Assert.All(wafers, w =>
        {
            Assert.InRange(w.Count(), 9, 13);
            Assert.Equal(w.First().Product == "TRN7" ? 13 : 9, w.Select(r => r.SiteId).Distinct().Count());
            Assert.All(w, r => Assert.True(r.FinHeightNm.HasValue && r.CornerRadiusNm.HasValue && r.LinerThicknessNm.HasValue));
        });
        Assert.All(wafers.GroupBy(w => w.Key.LotId), lot =>
            Assert.Equal(Enumerable.Range(1, TestData.Season.WafersPerLot), lot.Select(w => w.Key.WaferSlot).Order()));
    }

    [Fact]
    public void GenerateRows_EtchCdStep_ThreeWafersFiveSitesWidthsOnly()
    {
        var lots = TestData.SeasonRows.Where(r => r.Step == DemoFab.EtchCdStep).GroupBy(r => r.LotId).ToList();

        Assert.NotEmpty(lots);
        Assert.All(lots, lot =>
        {
            Assert.Equal(3, lot.Select(r => r.WaferSlot).Distinct().Count());
            Assert.All(lot.GroupBy(r => r.WaferSlot), w => Assert.Equal(5, w.Count()));
            Assert.All(lot, r =>
            {
                Assert.True(r.TopWidthNm.HasValue && r.BottomWidthNm.HasValue);
                Assert.Null(r.FinHeightNm);
                Assert.Null(r.CornerRadiusNm);
                Assert.Null(r.LinerThicknessNm);
                Assert.Null(r.LinerChamber);
            });
        });
    }

    [Fact]
    public void GenerateRows_SitePatterns_FixedPerProductAndStep()
    {
        var patterns = TestData.SeasonRows
            .GroupBy(r => (r.Product, r.Step))
            .ToDictionary(g => g.Key, g => g.Select(r => (r.SiteId, r.SiteXMm, r.SiteYMm)).Distinct().Count());

        Assert.Equal(13, patterns[("TRN7", DemoFab.ProfileStep)]);
        Assert.Equal(9, patterns[("BRM7", DemoFab.ProfileStep)]);
        Assert.Equal(5, patterns[("TRN7", DemoFab.EtchCdStep)]);
        Assert.Equal(5, patterns[("BRM7", DemoFab.EtchCdStep)]);
    }

    [Fact]
    public void GenerateRows_Names_InventedIdsWithoutCommasOrQuotes()
    {
        Assert.All(TestData.SeasonRows, r =>
        {
            Assert.StartsWith(r.EtchTool + "-", r.EtchChamber, StringComparison.Ordinal);
            if (r.LinerChamber is not null)
            {
                Assert.StartsWith(r.LinerTool + "-", r.LinerChamber, StringComparison.Ordinal);
            }

            Assert.Matches(BadgePattern(), r.Operator);
            Assert.Matches(LotPattern(), r.LotId);
            Assert.Matches(SitePattern(), r.SiteId);
            foreach (string? text in new[] { r.EtchTool, r.EtchChamber, r.LinerTool, r.LinerChamber, r.MetrologyTool, r.Product, r.Step })
            {
                Assert.DoesNotContain(',', text ?? "");
                Assert.DoesNotContain('"', text ?? "");
            }
        });
        Assert.Equal(4, TestData.SeasonRows.Select(r => r.EtchChamber).Distinct().Count());
        Assert.Equal(2, TestData.SeasonRows.Select(r => r.EtchTool).Distinct().Count());
        Assert.Single(TestData.SeasonRows.Where(TestData.IsProfile).Select(r => r.LinerTool).Distinct());
    }

    [Theory]
    [InlineData(0, 24.0, 25)]
    [InlineData(91, 24.0, 25)]
    [InlineData(90, 0.0, 25)]
    [InlineData(90, double.NaN, 25)]
    [InlineData(90, 241.0, 25)]
    [InlineData(90, 24.0, 0)]
    [InlineData(90, 24.0, 26)]
    public void GenerateRows_ScaleOutOfRange_ThrowsBeforeEnumerating(int days, double lotsPerDay, int wafersPerLot)
    {
        var scale = new DemoScale(days, lotsPerDay, wafersPerLot);

        Assert.Throws<ArgumentOutOfRangeException>(() => DemoFab.GenerateRows(DemoFab.DefaultSeed, scale));
        Assert.Throws<ArgumentOutOfRangeException>(() => DemoFab.WriteMeasurementsCsv(TextWriter.Null, DemoFab.DefaultSeed, scale));
    }

    private static void AssertValid(DemoSiteRow row)
    {
        if (!IsValid(row))
        {
            Assert.Fail($"Outside the ingest validity ranges: {row}");
        }
    }

    // The ranges the server enforces (brief): widths 0 < w <= 100, height 0 < H <= 300, radius 0 <= r <= 50 and not
    // above the geometric limit, liner 0 <= t <= 20, sites inside 147 mm, slots 1..25, times before the fixed end.
    private static bool IsValid(DemoSiteRow r) =>
        r.WaferSlot is >= 1 and <= 25
        && Math.Sqrt(r.SiteXMm * r.SiteXMm + r.SiteYMm * r.SiteYMm) <= 147.0
        && r.TopWidthNm is > 0.0 and <= 100.0
        && r.BottomWidthNm is > 0.0 and <= 100.0
        && r.FinHeightNm is null or (> 0.0 and <= 300.0)
        && r.CornerRadiusNm is null or (>= 0.0 and <= 50.0)
        && r.LinerThicknessNm is null or (>= 0.0 and <= 20.0)
        && r.MeasuredAtUtc < FixedEnd
        && (r.CornerRadiusNm is not { } radius || radius <= TestData.MaxCornerRadiusNm(r));

    [GeneratedRegex(@"^OP-\d{4}$")]
    private static partial Regex BadgePattern();

    [GeneratedRegex(@"^Q\d{5}$")]
    private static partial Regex LotPattern();

    [GeneratedRegex(@"^[SC]\d{2}$")]
    private static partial Regex SitePattern();
}
