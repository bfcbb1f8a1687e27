namespace FinWatch.Statistics.Charts;

/// <summary>
/// One plotted point of an EWMA chart (docs/statistics.md §4.1), as returned by <see cref="EwmaAccumulator.Append"/>.
/// </summary>
/// <param name="Z">The EWMA statistic z_i after this point, in data units; <see cref="double.NaN"/> for a missing point.</param>
/// <param name="Ucl">Exact (time-varying) upper limit for this point, in data units; <see cref="double.NaN"/> for a missing point.</param>
/// <param name="Lcl">Exact (time-varying) lower limit for this point, in data units; <see cref="double.NaN"/> for a missing point.</param>
/// <param name="Signal">True when <paramref name="Z"/> is strictly above <paramref name="Ucl"/> or strictly below
/// <paramref name="Lcl"/>; always false for a missing point.</param>
public readonly record struct EwmaPoint(double Z, double Ucl, double Lcl, bool Signal)
{
    /// <summary>True when the input value was missing (NaN) and the point carries no statistic.</summary>
    public bool IsMissing => double.IsNaN(Z);
}
