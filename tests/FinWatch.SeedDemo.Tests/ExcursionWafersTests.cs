namespace FinWatch.SeedDemo.Tests;

public sealed class ExcursionWafersTests
{
    [Fact]
    public void ExcursionWafers_DefaultScale_AboutOneWaferIn400()
    {
        int wafers = (int)(90 * 24.0) * 25;

        int count = DemoFab.ExcursionWafers().Count();

        Assert.InRange(count, wafers / 400 * 2 / 3, wafers / 400 * 3 / 2);
    }

    [Fact]
    public void ExcursionWafers_Listed_AreExactlyTheWafersThatStandOutFromTheirLot()
    {
        // A wafer stands out when its mean mid width and mean height both differ clearly from the median of the
        // other wafers of its lot etched in the same chamber (so chamber offsets do not count).
        var wafers = DemoFab.GenerateRows(DemoFab.DefaultSeed, TestData.FullLots)
            .Where(TestData.IsProfile)
            .GroupBy(r => (r.LotId, r.WaferSlot, r.EtchChamber))
            .Select(w => (w.Key, Mid: w.Average(r => (r.TopWidthNm!.Value + r.BottomWidthNm!.Value) / 2.0), Height: w.Average(r => r.FinHeightNm!.Value)))
            .ToList();
        var standOut = new HashSet<(string, int)>();
        foreach (var group in wafers.GroupBy(w => (w.Key.LotId, w.Key.EtchChamber)))
        {
            foreach (var w in group)
            {
                var others = group.Where(o => o.Key.WaferSlot != w.Key.WaferSlot).ToList();
                if (Math.Abs(w.Mid - Median(others.Select(o => o.Mid))) > 0.6 && Math.Abs(w.Height - Median(others.Select(o => o.Height))) > 1.5)
                {
                    standOut.Add((w.Key.LotId, w.Key.WaferSlot));
                }
            }
        }

        var listed = DemoFab.ExcursionWafers(DemoFab.DefaultSeed, TestData.FullLots).Select(e => (e.LotId, e.WaferSlot)).ToHashSet();

        Assert.True(listed.Count >= 10, $"only {listed.Count} bad wafers at this scale");
        Assert.Equal(listed.Order(), standOut.Order());
    }

    [Fact]
    public void ExcursionWafers_Kinds_UnderEtchWiderAndShorterOverEtchNarrowerAndTaller()
    {
        Assert.All(DemoFab.ExcursionWafers(), e =>
        {
            if (e.Kind == DemoExcursionKind.UnderEtch)
            {
                Assert.True(e.WidthShiftNm > 1.0 && e.HeightShiftNm < -2.5);
            }
            else
            {
                Assert.True(e.WidthShiftNm < -0.8 && e.HeightShiftNm > 1.9);
            }
        });
    }

    private static double Median(IEnumerable<double> values)
    {
        double[] sorted = [.. values.Order()];
        return sorted.Length % 2 == 1 ? sorted[sorted.Length / 2] : (sorted[sorted.Length / 2 - 1] + sorted[sorted.Length / 2]) / 2.0;
    }
}
