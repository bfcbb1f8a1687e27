namespace FinWatch.Statistics.Forecast;

/// <summary>
/// Result of <see cref="DriftForecast.Estimate"/>: the least-squares line value = a + b·x, the t test of
/// its slope, and, for a significant trend, where the line reaches the nearest limit in its direction with
/// an inverse-regression (Fieller) interval. Positions and distances are in <see cref="Unit"/>; values,
/// intercept and limits in data units; the slope in data units per lot or per hour.
/// </summary>
/// <param name="Status">What was found.</param>
/// <param name="Message">One plain sentence for an engineer, e.g. "No trend is seen (slope p = 0.41).".</param>
/// <param name="N">Number of points used (pairs with a missing value are skipped).</param>
/// <param name="Unit">Unit of positions and distances.</param>
/// <param name="LastPosition">Largest position in the data (the "last point"); null when empty.</param>
/// <param name="Intercept">Fitted a; null for fewer than 3 points or constant positions.</param>
/// <param name="Slope">Fitted b per unit of position.</param>
/// <param name="SlopeStandardError">s/√Sxx with s² = SSE/(N − 2).</param>
/// <param name="PValue">Two-sided p-value of the slope t test, N − 2 degrees of freedom.</param>
/// <param name="Alpha">Significance level of the slope test.</param>
/// <param name="Confidence">Level of the confidence band of the mean line used for the crossing interval.</param>
/// <param name="Limit">The limit the forecast refers to; null for <see cref="DriftForecastStatus.NoTrend"/>
/// and <see cref="DriftForecastStatus.NotApproachingAnyLimit"/>.</param>
/// <param name="LimitValue">Its value in data units.</param>
/// <param name="CrossingPosition">x* = (limit − a)/b.</param>
/// <param name="CrossingLow">Earliest position at which the band of the mean line reaches the limit.</param>
/// <param name="CrossingHigh">Latest such position; null when the band never closes on that side
/// (unbounded interval).</param>
/// <param name="DistanceEstimate">x* − last position (lots or hours to cross).</param>
/// <param name="DistanceLow">Low end of the distance; for <see cref="DriftForecastStatus.WillCross"/> not
/// below 0 (a note says when it was clamped).</param>
/// <param name="DistanceHigh">High end of the distance; null when unbounded.</param>
/// <param name="Notes">Further remarks (clamping, unbounded interval, limits already passed).</param>
public sealed record DriftForecastResult(
    DriftForecastStatus Status,
    string Message,
    int N,
    PositionUnit Unit,
    double? LastPosition,
    double? Intercept,
    double? Slope,
    double? SlopeStandardError,
    double? PValue,
    double Alpha,
    double Confidence,
    LimitKind? Limit,
    double? LimitValue,
    double? CrossingPosition,
    double? CrossingLow,
    double? CrossingHigh,
    double? DistanceEstimate,
    double? DistanceLow,
    double? DistanceHigh,
    IReadOnlyList<string> Notes);
