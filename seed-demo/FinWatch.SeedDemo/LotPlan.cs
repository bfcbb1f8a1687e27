using System.Globalization;

namespace FinWatch.SeedDemo;

/// <summary>
/// The route of one lot through the invented fab: which tools it used and when it was measured.
/// A step time is null when the step would end after <see cref="FabLayout.EndUtc"/> (the lot was still in flight).
/// </summary>
internal sealed record LotPlan(
    int Index,
    string LotId,
    ProductRecipe Recipe,
    DateTime EtchedAtUtc,
    EtchTool EtchTool,
    LinerChamber Liner,
    DateTime LinedAtUtc,
    DateTime? CdAtUtc,
    string CdOperator,
    DateTime? ProfileAtUtc,
    MetrologyTool ProfileTool,
    string ProfileOperator)
{
    public const int FirstLotNumber = 30001;

    /// <summary>Seconds between wafers, and between sites of one wafer, at a metrology step.</summary>
    public const int SecondsPerWafer = 60;
    public const int SecondsPerSite = 4;

    /// <summary>Load and unload time a metrology tool spends per lot beyond measuring.</summary>
    private static readonly TimeSpan HandlingTime = TimeSpan.FromMinutes(2);

    /// <summary>The slots measured at the post-etch CD step: first, middle and last of the lot (fewer if the lot is smaller).</summary>
    public static int[] CdSlots(int wafersPerLot) => [.. new[] { 1, (wafersPerLot + 1) / 2, wafersPerLot }.Distinct()];

    /// <summary>
    /// Plans every lot of the window in start order. Lots start on a jittered grid of 1/LotsPerDay days, so lot ids
    /// follow time; each metrology step is a first-in, first-out queue, so lots are measured in lot order and a tool
    /// never measures two lots at once.
    /// </summary>
    public static List<LotPlan> PlanAll(int seed, DemoScale scale)
    {
        var random = SeededRandom.Create(seed, 0, SeededRandom.PlanStream);
        DateTime startUtc = FabLayout.StartUtc(scale);
        double spacingHours = 24.0 / scale.LotsPerDay;
        int lotCount = (int)Math.Floor(scale.Days * scale.LotsPerDay);
        int[] cdSlots = CdSlots(scale.WafersPerLot);

        DateTime cdFree = startUtc;
        DateTime lastCd = startUtc;
        DateTime[] profileFree = [startUtc, startUtc];
        DateTime lastProfile = startUtc;

        var lots = new List<LotPlan>(lotCount);
        for (int k = 0; k < lotCount; k++)
        {
            // Every draw happens for every lot, in this order, so one lot's route never shifts another's.
            DateTime etchedAt = Second(startUtc.AddHours(spacingHours * (k + 0.5 + random.NextUniform(-0.4, 0.4))));
            ProductRecipe recipe = random.NextDouble() < ProductRecipe.TriGate.LotShare ? ProductRecipe.TriGate : ProductRecipe.DoubleGate;
            EtchTool etchTool = FabLayout.EtchTools[random.Next(FabLayout.EtchTools.Length)];
            DateTime cdReady = Second(etchedAt.AddMinutes(random.NextUniform(20.0, 35.0)));
            DateTime linedAt = Second(etchedAt.AddMinutes(random.NextUniform(110.0, 130.0)));
            LinerChamber liner = FabLayout.LinerChambers[random.Next(FabLayout.LinerChambers.Length)];
            if (FabLayout.IsDown(liner.Id, linedAt))
            {
                liner = FabLayout.LinerChambers.First(c => c != liner && !FabLayout.IsDown(c.Id, linedAt));
            }

            DateTime profileReady = Second(linedAt.AddMinutes(random.NextUniform(80.0, 110.0)));

            DateTime cdAt = Max(Max(cdReady, cdFree), lastCd);
            cdFree = cdAt + Duration(cdSlots.Length, ProductRecipe.CdSites.Count) + HandlingTime;
            lastCd = cdAt;

            int toolIndex = profileFree[0] <= profileFree[1] ? 0 : 1;
            DateTime profileAt = Max(Max(profileReady, profileFree[toolIndex]), lastProfile);
            profileFree[toolIndex] = profileAt + Duration(scale.WafersPerLot, recipe.ProfileSites.Count) + HandlingTime;
            lastProfile = profileAt;

            string cdOperator = FabLayout.OperatorOnShift(cdAt, random);
            string profileOperator = FabLayout.OperatorOnShift(profileAt, random);

            bool cdFits = cdAt + Duration(cdSlots.Length, ProductRecipe.CdSites.Count) < FabLayout.EndUtc;
            bool profileFits = profileAt + Duration(scale.WafersPerLot, recipe.ProfileSites.Count) < FabLayout.EndUtc;
            lots.Add(new LotPlan(
                k,
                "Q" + (FirstLotNumber + k).ToString(CultureInfo.InvariantCulture),
                recipe,
                etchedAt,
                etchTool,
                liner,
                linedAt,
                cdFits ? cdAt : null,
                cdOperator,
                profileFits ? profileAt : null,
                FabLayout.ProfileTools[toolIndex],
                profileOperator));
        }

        return lots;
    }

    /// <summary>Time from the first to the last site of a step (the last site's offset).</summary>
    public static TimeSpan Duration(int wafers, int sites) =>
        TimeSpan.FromSeconds((wafers - 1) * SecondsPerWafer + (sites - 1) * SecondsPerSite);

    public static DateTime Second(DateTime t) => new(t.Ticks - t.Ticks % TimeSpan.TicksPerSecond, DateTimeKind.Utc);

    private static DateTime Max(DateTime a, DateTime b) => a >= b ? a : b;
}
