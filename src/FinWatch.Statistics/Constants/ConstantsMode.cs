namespace FinWatch.Statistics.Constants;

/// <summary>
/// Which values of the control chart constants to use (docs/statistics.md §1.4).
/// </summary>
public enum ConstantsMode
{
    /// <summary>
    /// Double-precision values computed from their definitions (docs/statistics.md §1.2): d2 and d3 by numerical
    /// integration over the normal distribution, c4 from the gamma function. The FinWatch default.
    /// </summary>
    Exact = 0,

    /// <summary>
    /// The printed three-decimal factors (c4: four decimals) of Montgomery, <i>Introduction to Statistical
    /// Quality Control</i>, Appendix VI, as transcribed in docs/statistics.md §1.3, so that results reproduce hand
    /// calculations and textbook examples digit for digit.
    /// </summary>
    Table = 1,
}
