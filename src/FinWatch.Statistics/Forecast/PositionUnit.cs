namespace FinWatch.Statistics.Forecast;

/// <summary>What the position (x) of a drift series measures, and so the unit of the forecast distances.</summary>
public enum PositionUnit
{
    /// <summary>x is a lot index (dimensionless count); distances are in lots.</summary>
    LotIndex = 0,

    /// <summary>x is time in hours; distances are in hours.</summary>
    Hours = 1,
}
