namespace FinWatch.SeedDemo.Tests;

public sealed class EventsTests
{
    [Fact]
    public void Events_Demo_SortedAndBeforeTheFixedEnd()
    {
        Assert.Equal(DemoFab.Events.OrderBy(e => e.AtUtc), DemoFab.Events);
        Assert.All(DemoFab.Events, e =>
        {
            Assert.Equal(DateTimeKind.Utc, e.AtUtc.Kind);
            Assert.True(e.AtUtc < DemoFab.EndUtc);
        });
    }

    [Fact]
    public void Events_Chambers_AreChambersOfTheDataIncludingTheirTool()
    {
        var chambers = TestData.SeasonRows.SelectMany(r => new[] { r.EtchChamber, r.LinerChamber }).OfType<string>().ToHashSet();

        Assert.All(DemoFab.Events, e =>
        {
            Assert.Contains(e.Chamber, chambers);
            Assert.StartsWith(e.Tool + "-", e.Chamber, StringComparison.Ordinal);
        });
    }

    [Fact]
    public void Events_PlantedKinds_EachPresent()
    {
        Assert.Equal(3, DemoFab.Events.Count(e => e.Kind == DemoEventKind.TaperCreepReset));
        Assert.Single(DemoFab.Events, e => e.Kind == DemoEventKind.CornerRadiusStep);
        Assert.Single(DemoFab.Events, e => e.Kind == DemoEventKind.LinerThinningStart);
        Assert.False(DemoFab.Events.Single(e => e.Kind == DemoEventKind.LinerThinningStart).IsMaintenance);
    }

    [Fact]
    public void Events_DuringMaintenance_ChamberRunsNoWafers()
    {
        Assert.All(DemoFab.Events.Where(e => e.IsMaintenance && e.AtUtc >= DemoFab.StartUtc(TestData.Season)), e =>
        {
            // The CD step follows etch by 20-35 minutes, so CD rows from an hour into the downtime to its end were
            // etched while the chamber was down: they must all come from the tool's other chamber.
            var cdRows = TestData.SeasonRows
                .Where(r => r.Step == DemoFab.EtchCdStep && r.EtchTool == e.Tool)
                .Where(r => r.MeasuredAtUtc >= e.AtUtc + TimeSpan.FromHours(1) && r.MeasuredAtUtc < e.AtUtc + DemoFab.MaintenanceDowntime);
            Assert.DoesNotContain(cdRows, r => r.EtchChamber == e.Chamber);
        });
    }
}
