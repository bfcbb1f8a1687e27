using System.Globalization;

namespace FinWatch.SeedDemo;

/// <summary>
/// Lots after the history: what the simulated live profile tool measures. Each lot is drawn from its own seeded
/// stream (so the same lot number always gives the same lot) with the history's variation model and planted events,
/// which keep going past the window's end (the taper keeps creeping and the liner keeps thinning).
/// </summary>
internal static class LiveLots
{
    /// <summary>The random stream of a live lot's route (the history's lots use <see cref="SeededRandom.PlanStream"/> once for all).</summary>
    private const int RouteStream = 4;

    public static IEnumerable<DemoSiteRow> ProfileLot(int seed, int lotNumber, DateTime lastSiteUtc, int wafersPerLot)
    {
        int index = lotNumber - LotPlan.FirstLotNumber;
        var random = SeededRandom.Create(seed, index, RouteStream);
        ProductRecipe recipe = random.NextDouble() < ProductRecipe.TriGate.LotShare ? ProductRecipe.TriGate : ProductRecipe.DoubleGate;
        EtchTool etchTool = FabLayout.EtchTools[random.Next(FabLayout.EtchTools.Length)];
        LinerChamber liner = FabLayout.LinerChambers[random.Next(FabLayout.LinerChambers.Length)];
        DateTime profileAt = LotPlan.Second(lastSiteUtc - LotPlan.Duration(wafersPerLot, recipe.ProfileSites.Count));
        DateTime linedAt = LotPlan.Second(profileAt.AddMinutes(-random.NextUniform(80.0, 110.0)));
        DateTime etchedAt = LotPlan.Second(linedAt.AddMinutes(-random.NextUniform(110.0, 130.0)));
        if (FabLayout.IsDown(liner.Id, linedAt))
        {
            liner = FabLayout.LinerChambers.First(c => c != liner && !FabLayout.IsDown(c.Id, linedAt));
        }

        string profileOperator = FabLayout.OperatorOnShift(profileAt, random);
        var lot = new LotPlan(
            index, "Q" + lotNumber.ToString(CultureInfo.InvariantCulture), recipe, etchedAt, etchTool, liner, linedAt,
            null, "", profileAt, FabLayout.LiveProfileTool, profileOperator);
        return RowStream.ProfileRows(seed, lot, FinModel.Wafers(seed, lot, wafersPerLot), profileAt);
    }
}
