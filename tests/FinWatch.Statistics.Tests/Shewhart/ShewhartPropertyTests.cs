using FinWatch.Statistics.Shewhart;
using FsCheck.Xunit;

namespace FinWatch.Statistics.Tests.Shewhart;

public class ShewhartPropertyTests
{
    private static List<double[]> Groups(int seed)
    {
        var random = new Random(seed);
        var count = 2 + random.Next(30);
        return Enumerable.Range(0, count)
            .Select(_ => Enumerable.Range(0, 1 + random.Next(8)).Select(_ => random.NextDouble() < 0.1 ? double.NaN : 100 * random.NextDouble()).ToArray())
            .ToList();
    }

    // Property: the within-subgroup sigma depends on each subgroup's spread only, so the order of the subgroups
    // (and the order of values inside each) does not change it (docs/statistics.md §2.3 estimator).
    [Property(MaxTest = 200)]
    public bool Sigma_ShuffledSubgroups_IsUnchanged(int seed)
    {
        var groups = Groups(seed);
        var random = new Random(seed ^ 0x5bd1e995);
        var shuffled = groups.OrderBy(_ => random.Next()).Select(g => g.OrderBy(_ => random.Next()).ToArray()).ToList();
        foreach (var type in new[] { ShewhartChartType.MeanRange, ShewhartChartType.MeanStandardDeviation })
        {
            var a = ShewhartCharts.Subgroups(groups, type, LimitRequest.FromData).Sigma;
            var b = ShewhartCharts.Subgroups(shuffled, type, LimitRequest.FromData).Sigma;
            if (a.HasValue != b.HasValue || (a is { } x && b is { } y && Math.Abs(x - y) > 1e-9 * Math.Max(1, Math.Abs(x))))
            {
                return false;
            }
        }

        return true;
    }

    // Shifting every value by c moves the centre and limits by c and leaves sigma and the zone scores unchanged;
    // scaling by c > 0 scales centre, sigma and limits by c and leaves the zone scores unchanged.
    [Property(MaxTest = 200)]
    public bool Individuals_ShiftAndScale_TransformLimitsAndKeepZoneScores(int seed)
    {
        var random = new Random(seed);
        var values = Enumerable.Range(0, 3 + random.Next(40)).Select(_ => random.NextDouble()).ToArray();
        const double shift = 1234.5, scale = 7.25;
        var a = ShewhartCharts.Individuals(values, LimitRequest.FromData);
        var b = ShewhartCharts.Individuals(values.Select(v => (scale * v) + shift).ToArray(), LimitRequest.FromData);
        var ok = Math.Abs(b.Center - ((scale * a.Center) + shift)) < 1e-8
            && Math.Abs(b.Sigma!.Value - (scale * a.Sigma!.Value)) < 1e-9
            && Math.Abs(b.Primary.Upper[0] - ((scale * a.Primary.Upper[0]) + shift)) < 1e-8;
        for (var i = 0; ok && i < values.Length; i++)
        {
            ok = double.IsNaN(a.ZoneScores[i]) ? double.IsNaN(b.ZoneScores[i]) : Math.Abs(a.ZoneScores[i] - b.ZoneScores[i]) < 1e-8;
        }

        return ok;
    }
}
