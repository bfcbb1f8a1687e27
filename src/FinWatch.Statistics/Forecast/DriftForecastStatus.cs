namespace FinWatch.Statistics.Forecast;

/// <summary>The outcome of a drift forecast.</summary>
public enum DriftForecastStatus
{
    /// <summary>No trend is seen: the slope is not significant, or there are fewer than 6 points, or the
    /// positions do not vary.</summary>
    NoTrend = 0,

    /// <summary>A significant trend, but no given limit lies in its direction.</summary>
    NotApproachingAnyLimit = 1,

    /// <summary>A significant trend whose fitted line reaches a limit ahead of the last point.</summary>
    WillCross = 2,

    /// <summary>A significant trend whose fitted line is already beyond every limit in its direction at
    /// the last point.</summary>
    AlreadyBeyond = 3,
}
