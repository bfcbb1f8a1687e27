namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// One plotted statistic with its centre line and limits per point (equal entries when they do not vary).
/// <see cref="double.NaN"/> marks a position with no point (a missing value, the first moving range, a subgroup too small
/// for a range).
/// </summary>
public sealed record ChartSeries(double[] Values, double[] Center, double[] Upper, double[] Lower)
{
    /// <summary>Input positions whose value lies strictly above the upper or strictly below the lower limit.</summary>
    public int[] BeyondLimits()
    {
        var beyond = new List<int>();
        for (var i = 0; i < Values.Length; i++)
        {
            if (Values[i] > Upper[i] || Values[i] < Lower[i])
            {
                beyond.Add(i);
            }
        }

        return [.. beyond];
    }
}
