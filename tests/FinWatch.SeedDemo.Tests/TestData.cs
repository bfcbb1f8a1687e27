namespace FinWatch.SeedDemo.Tests;

/// <summary>Small scales and cached rows, so that each test runs in well under a second.</summary>
internal static class TestData
{
    /// <summary>Three days, 18 lots of 5 wafers: for format and determinism tests.</summary>
    public static readonly DemoScale Tiny = new(Days: 3, LotsPerDay: 6, WafersPerLot: 5);

    /// <summary>The whole 90-day window with few, small lots: enough to see every planted trend.</summary>
    public static readonly DemoScale Season = new(Days: 90, LotsPerDay: 6, WafersPerLot: 3);

    /// <summary>The whole window with full lots (for the bad-wafer tests).</summary>
    public static readonly DemoScale FullLots = new(Days: 90, LotsPerDay: 4, WafersPerLot: 25);

    private static readonly Lazy<DemoSiteRow[]> SeasonRowsCache = new(() => [.. DemoFab.GenerateRows(DemoFab.DefaultSeed, Season)]);

    public static DemoSiteRow[] SeasonRows => SeasonRowsCache.Value;

    public static string Csv(int seed, DemoScale scale)
    {
        using var writer = new StringWriter();
        DemoFab.WriteMeasurementsCsv(writer, seed, scale);
        return writer.ToString();
    }

    public static DemoProduct Product(string code) => DemoFab.Products.Single(p => p.Code == code);

    /// <summary>Sidewall angle from vertical, degrees (docs/model.md §A.1, computed independently of the generator).</summary>
    public static double TaperDeg(double topNm, double bottomNm, double heightNm) =>
        Math.Atan((bottomNm - topNm) / (2.0 * heightNm)) * 180.0 / Math.PI;

    public static double TaperDeg(DemoSiteRow row) => TaperDeg(row.TopWidthNm!.Value, row.BottomWidthNm!.Value, row.FinHeightNm!.Value);

    /// <summary>Largest corner radius that fits the top: (W_t/2)·tan(45° + θ/2).</summary>
    public static double MaxCornerRadiusNm(DemoSiteRow row) =>
        row.TopWidthNm!.Value / 2.0 * Math.Tan(Math.PI / 4.0 + TaperDeg(row) * Math.PI / 180.0 / 2.0);

    public static bool IsProfile(DemoSiteRow row) => row.Step == DemoFab.ProfileStep;

    /// <summary>Ordinary least-squares slope of y on x.</summary>
    public static double Slope(IReadOnlyList<(double X, double Y)> points)
    {
        double meanX = points.Average(p => p.X);
        double meanY = points.Average(p => p.Y);
        double sxy = points.Sum(p => (p.X - meanX) * (p.Y - meanY));
        double sxx = points.Sum(p => (p.X - meanX) * (p.X - meanX));
        return sxy / sxx;
    }
}
