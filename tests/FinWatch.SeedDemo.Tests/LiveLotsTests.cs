using FinWatch.Physics;

namespace FinWatch.SeedDemo.Tests;

/// <summary>The simulated live profile tool's lots, and the chamber log the planted maintenances make.</summary>
public sealed class LiveLotsTests
{
    private static readonly DateTime FiveDaysOn = DemoFab.EndUtc.AddDays(5);

    private static List<DemoSiteRow> Lots(int count, DateTime lastSiteUtc) =>
        [.. Enumerable.Range(DemoFab.FirstLotNumberAfter(), count).SelectMany(n => DemoFab.LiveProfileLot(DemoFab.DefaultSeed, n, lastSiteUtc))];

    [Fact]
    public void LiveProfileLot_SameNumber_SameRows_AndEndsAtTheGivenTime()
    {
        var first = DemoFab.LiveProfileLot(DemoFab.DefaultSeed, 32161, FiveDaysOn).ToList();
        Assert.Equal(first, DemoFab.LiveProfileLot(DemoFab.DefaultSeed, 32161, FiveDaysOn).ToList());
        Assert.NotEqual(first.Select(r => r.TopWidthNm), DemoFab.LiveProfileLot(DemoFab.DefaultSeed, 32162, FiveDaysOn).Select(r => r.TopWidthNm));

        Assert.All(first, r =>
        {
            Assert.Equal("Q32161", r.LotId);
            Assert.Equal(DemoFab.ProfileStep, r.Step);
            Assert.Equal(DemoFab.LiveProfileToolId, r.MetrologyTool);
            Assert.Equal(0, r.MeasuredAtUtc.Ticks % TimeSpan.TicksPerSecond);
        });
        Assert.Equal(FiveDaysOn, first.Max(r => r.MeasuredAtUtc));
        Assert.Equal(first.OrderBy(r => r.MeasuredAtUtc), first);
        Assert.Equal(25, first.Select(r => r.WaferSlot).Distinct().Count());
    }

    [Fact]
    public void FirstLotNumberAfter_FollowsTheHistorysLastLot()
    {
        var scale = new DemoScale(Days: 3, LotsPerDay: 6, WafersPerLot: 2);
        var last = DemoFab.GenerateRows(DemoFab.DefaultSeed, scale).Max(r => int.Parse(r.LotId[1..], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(last + 1, DemoFab.FirstLotNumberAfter(scale));
        Assert.Throws<ArgumentOutOfRangeException>(() => DemoFab.LiveProfileLot(DemoFab.DefaultSeed, 30000, FiveDaysOn));
    }

    [Fact]
    public void LiveLots_PlantedDriftsGoOnAfterTheHistory()
    {
        // Five days after the window, FX07-R has run 36 days since its last wet clean (2026-10-29 14:00, 8 h down):
        // about (36 d·24 h − 8 h)·0.7·0.0012 ≈ 0.72° of creep, against a flat FX07-L; the planted constants, not a fit.
        var rows = Lots(160, FiveDaysOn);
        double Taper(string chamber) => rows.Where(r => r.EtchChamber == chamber)
            .Average(r => TestData.TaperDeg(r.TopWidthNm!.Value, r.BottomWidthNm!.Value, r.FinHeightNm!.Value));
        double creep = (FiveDaysOn - new DateTime(2026, 10, 29, 22, 0, 0, DateTimeKind.Utc) - TimeSpan.FromHours(3.5)).TotalHours * 0.7 * 0.0012;
        // Both products mix in each chamber, and the chambers' fixed offsets tilt a little: ±0.15° covers them.
        Assert.InRange(Taper("FX07-R") - Taper("FX07-L"), creep - 0.15, creep + 0.15);

        // LD03-2 has thinned since 2026-09-01 at −0.3 nm per 90 days; LD03-1 has not; fixed offsets +0.04 and −0.03 nm.
        double Liner(string chamber) => rows.Where(r => r.LinerChamber == chamber).Average(r => r.LinerThicknessNm!.Value - TestData.Product(r.Product).Nominal.LinerThicknessNm);
        double thinned = (FiveDaysOn.AddHours(-2) - new DateTime(2026, 9, 1, 0, 0, 0, DateTimeKind.Utc)).TotalDays * 0.3 / 90;
        Assert.InRange(Liner("LD03-1") - Liner("LD03-2"), thinned + 0.07 - 0.03, thinned + 0.07 + 0.03);
    }

    [Fact]
    public void Events_Maintenances_AreLoggedWithAKindAndACrew_DriftStartsAreNot()
    {
        Assert.All(DemoFab.Events.Where(e => e.IsMaintenance), e =>
        {
            Assert.NotNull(e.LoggedAs);
            Assert.Equal(e.AtUtc + DemoFab.MaintenanceDowntime, e.BackInProductionUtc);
            Assert.EndsWith("(invented)", e.Crew, StringComparison.Ordinal);
        });
        Assert.All(DemoFab.Events.Where(e => !e.IsMaintenance), e => Assert.Null(e.LoggedAs));
        Assert.All(DemoFab.Events.Where(e => e.Kind == DemoEventKind.TaperCreepReset), e => Assert.Equal(MaintenanceKind.WetClean, e.LoggedAs));
        Assert.Equal(MaintenanceKind.PartReplacement, DemoFab.Events.Single(e => e.Kind == DemoEventKind.CornerRadiusStep).LoggedAs);
    }
}
