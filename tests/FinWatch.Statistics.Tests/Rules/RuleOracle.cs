using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// A deliberately naive, independent transcription of docs/statistics.md §3 (§3.1, §3.2 readings, §3.3 items 1–9) used as a test
/// oracle: for each point it re-reads the window or run ending there from the list of points, with no shared state
/// and no rings or counters. Quadratic and slow; for tests only.
/// </summary>
internal static class RuleOracle
{
    /// <summary>The signals (index, pattern) of one rule; null when a zone rule has no point with a z.</summary>
    public static List<(int Index, int[] Pattern)>? Signals(double[] values, double[] z, RunRule rule)
    {
        // Item 8: missing values (NaN) are dropped; positions keep the input indices.
        var present = Enumerable.Range(0, values.Length).Where(i => !double.IsNaN(values[i])).ToList();
        var zoned = present.Where(i => !double.IsNaN(z[i])).ToList();
        var result = new List<(int, int[])>();
        switch (rule)
        {
            case RunRule.N3:
                for (var j = 0; j < present.Count; j++)
                {
                    // Item 6: six points = five strict steps in one direction.
                    if (StepsBack(present, values, j, d => d > 0) >= 5 || StepsBack(present, values, j, d => d < 0) >= 5)
                    {
                        result.Add((present[j], present.GetRange(j - 5, 6).ToArray()));
                    }
                }

                return result;
            case RunRule.N4:
                for (var j = 0; j < present.Count; j++)
                {
                    if (AlternationsBack(present, values, j) >= 13)
                    {
                        result.Add((present[j], present.GetRange(j - 13, 14).ToArray()));
                    }
                }

                return result;
        }

        if (zoned.Count == 0)
        {
            return null; // item 9
        }

        for (var j = 0; j < zoned.Count; j++)
        {
            var zj = z[zoned[j]];
            switch (rule)
            {
                case RunRule.WE1 or RunRule.N1:
                    if (Math.Abs(zj) > 3)
                    {
                        result.Add((zoned[j], [zoned[j]]));
                    }

                    break;
                case RunRule.WE2 or RunRule.N5:
                    AddOfWindow(result, zoned, z, j, 3, 2, 2.0);
                    break;
                case RunRule.WE3 or RunRule.N6:
                    AddOfWindow(result, zoned, z, j, 5, 4, 1.0);
                    break;
                case RunRule.WE4:
                    AddRun(result, zoned, z, j, 8, v => v > 0, v => v < 0);
                    break;
                case RunRule.N2:
                    AddRun(result, zoned, z, j, 9, v => v > 0, v => v < 0);
                    break;
                case RunRule.N7:
                    AddRun(result, zoned, z, j, 15, v => Math.Abs(v) <= 1, _ => false);
                    break;
                case RunRule.N8:
                    AddRun(result, zoned, z, j, 8, v => Math.Abs(v) > 1, _ => false);
                    break;
                default:
                    throw new ArgumentOutOfRangeException(nameof(rule));
            }
        }

        return result;
    }

    // Items 3, 4, 5: one side at a time; the current point must be beyond on that side; window truncated at the start.
    private static void AddOfWindow(List<(int, int[])> result, List<int> zoned, double[] z, int j, int width, int need, double k)
    {
        foreach (var side in new[] { 1.0, -1.0 })
        {
            if (!(side * z[zoned[j]] > k))
            {
                continue;
            }

            var window = zoned.Skip(Math.Max(0, j - width + 1)).Take(Math.Min(width, j + 1));
            var beyond = window.Where(i => side * z[i] > k).ToArray();
            if (beyond.Length >= need)
            {
                result.Add((zoned[j], beyond));
            }
        }
    }

    // Item 4: every point that ends a run of at least the length; pattern = the last `length` points.
    private static void AddRun(List<(int, int[])> result, List<int> zoned, double[] z, int j, int length, Func<double, bool> a, Func<double, bool> b)
    {
        foreach (var member in new[] { a, b })
        {
            var run = 0;
            while (run <= j && member(z[zoned[j - run]]))
            {
                run++;
            }

            if (run >= length)
            {
                result.Add((zoned[j], zoned.GetRange(j - length + 1, length).ToArray()));
                return;
            }
        }
    }

    private static int StepsBack(List<int> present, double[] values, int j, Func<double, bool> step)
    {
        var n = 0;
        while (j - n >= 1 && step(values[present[j - n]] - values[present[j - n - 1]]))
        {
            n++;
        }

        return n;
    }

    private static int AlternationsBack(List<int> present, double[] values, int j)
    {
        if (j < 1 || values[present[j]] == values[present[j - 1]])
        {
            return 0;
        }

        var n = 1;
        while (j - n >= 1)
        {
            var later = Math.Sign(values[present[j - n + 1]] - values[present[j - n]]);
            var earlier = Math.Sign(values[present[j - n]] - values[present[j - n - 1]]);
            if (earlier == 0 || earlier == later)
            {
                break;
            }

            n++;
        }

        return n;
    }
}
