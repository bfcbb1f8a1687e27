namespace FinWatch.Statistics.Forecast;

/// <summary>Which limit a drift forecast refers to.</summary>
public enum LimitKind
{
    /// <summary>Lower control limit (LCL).</summary>
    LowerControl = 0,

    /// <summary>Upper control limit (UCL).</summary>
    UpperControl = 1,

    /// <summary>Lower specification limit (LSL).</summary>
    LowerSpec = 2,

    /// <summary>Upper specification limit (USL).</summary>
    UpperSpec = 3,
}
