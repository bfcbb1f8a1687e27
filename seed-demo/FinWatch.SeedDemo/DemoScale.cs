namespace FinWatch.SeedDemo;

/// <summary>
/// Size of the generated demo data set. The window always ends at the fixed end
/// (<see cref="DemoFab.EndUtc"/>) and reaches back <paramref name="Days"/> days.
/// </summary>
/// <param name="Days">Days of history, 1..90 (the planted events cover 90 days).</param>
/// <param name="LotsPerDay">Mean lots started per day, greater than 0 and at most 240.</param>
/// <param name="WafersPerLot">Wafers per lot, 1..25 (slots 1..WafersPerLot).</param>
public sealed record DemoScale(int Days = 90, double LotsPerDay = 24, int WafersPerLot = 25);
