namespace FinWatch.Statistics.Tests.RunLength;

/// <summary>
/// Seeded Monte Carlo run lengths of a 3-sigma chart with Western Electric rules, applying each rule literally to the
/// window of the most recent points (docs/statistics.md §3.1, windows truncated at the start); independent of the library's
/// Markov-chain state encoding.
/// </summary>
internal static class WesternElectricSimulation
{
    public static (double Mean, double StandardError) AverageRunLength(IReadOnlyCollection<string> rules, double shift, int runs, Random random)
    {
        var we1 = rules.Contains("WE1");
        var we2 = rules.Contains("WE2");
        var we3 = rules.Contains("WE3");
        var we4 = rules.Contains("WE4");
        var points = new List<double>();
        double sum = 0, sumSquares = 0;
        for (var run = 0; run < runs; run++)
        {
            points.Clear();
            while (true)
            {
                points.Add(shift + StandardNormal(random));
                if ((we1 && Math.Abs(points[^1]) > 3)
                    || (we2 && CountInWindow(points, 3, 2) >= 2)
                    || (we3 && CountInWindow(points, 5, 1) >= 4)
                    || (we4 && SameSideRun(points, 8)))
                {
                    break;
                }
            }

            sum += points.Count;
            sumSquares += (double)points.Count * points.Count;
        }

        var mean = sum / runs;
        var variance = (sumSquares - (runs * mean * mean)) / (runs - 1);
        return (mean, Math.Sqrt(variance / runs));
    }

    /// <summary>Largest number, on either side, of the last <paramref name="window"/> points beyond ±limit.</summary>
    private static int CountInWindow(List<double> points, int window, double limit)
    {
        int above = 0, below = 0;
        for (var i = Math.Max(0, points.Count - window); i < points.Count; i++)
        {
            above += points[i] > limit ? 1 : 0;
            below += points[i] < -limit ? 1 : 0;
        }

        return Math.Max(above, below);
    }

    private static bool SameSideRun(List<double> points, int length)
    {
        if (points.Count < length)
        {
            return false;
        }

        var window = points.GetRange(points.Count - length, length);
        return window.TrueForAll(z => z > 0) || window.TrueForAll(z => z < 0);
    }

    // Box–Muller transform (Box & Muller 1958).
    private static double StandardNormal(Random random)
    {
        var u1 = 1 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
