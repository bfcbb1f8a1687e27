using System.Globalization;

namespace FinWatch.SeedDemo;

/// <summary>A measurement site: id and position from the wafer centre (mm, rounded to 0.1 mm as written).</summary>
internal readonly record struct SitePosition(string Id, double XMm, double YMm)
{
    /// <summary>(site radius / usable radius)², 0 at the centre and about 1 at the edge.</summary>
    public double RelativeRadiusSquared => (XMm * XMm + YMm * YMm) / (FabLayout.UsableRadiusMm * FabLayout.UsableRadiusMm);

    /// <summary>A centre site followed by rings of equally spaced sites, numbered <paramref name="prefix"/>01, 02, ...</summary>
    public static SitePosition[] CentreAndRings(string prefix, params (int Count, double RadiusMm, double FirstAngleDeg)[] rings)
    {
        var sites = new List<SitePosition> { new(Name(prefix, 1), 0.0, 0.0) };
        foreach (var (count, radiusMm, firstAngleDeg) in rings)
        {
            for (int i = 0; i < count; i++)
            {
                double angle = (firstAngleDeg + 360.0 * i / count) * Math.PI / 180.0;
                sites.Add(new(Name(prefix, sites.Count + 1), Mm(radiusMm * Math.Cos(angle)), Mm(radiusMm * Math.Sin(angle))));
            }
        }

        return [.. sites];
    }

    private static string Name(string prefix, int number) => prefix + number.ToString("00", CultureInfo.InvariantCulture);

    // Rounded as written; "+ 0.0" turns a negative zero into a positive one, so "-0.0" is never printed.
    private static double Mm(double value) => Math.Round(value, 1) + 0.0;
}
