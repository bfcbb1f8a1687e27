namespace FinWatch.Statistics.RunLength;

/// <summary>Where a solved ARL is beyond what double precision can resolve.</summary>
internal static class RunLengthGuard
{
    /// <summary>
    /// Largest ARL reported. The linear systems have a condition number of the order of the ARL itself, so above about
    /// 1e12 the rounding error of the solve (≈ ARL · 1e-16 relative, times the matrix size) makes the digits meaningless
    /// and can even flip the sign; no practical chart has such an ARL.
    /// </summary>
    internal const double MaxResolvable = 1e12;

    /// <summary>The ARL, or +∞ when it exceeds <see cref="MaxResolvable"/> or the solve broke down.</summary>
    public static double Checked(double arl) => double.IsFinite(arl) && arl >= 1 && arl <= MaxResolvable ? arl : double.PositiveInfinity;
}
