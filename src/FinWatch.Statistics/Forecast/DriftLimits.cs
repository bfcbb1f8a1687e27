namespace FinWatch.Statistics.Forecast;

/// <summary>
/// The limits a drift may approach, in the data's units; any may be absent. An upward drift can reach the
/// upper limits only, a downward drift the lower ones.
/// </summary>
/// <param name="LowerControl">Lower control limit, or null.</param>
/// <param name="UpperControl">Upper control limit, or null.</param>
/// <param name="LowerSpec">Lower specification limit, or null.</param>
/// <param name="UpperSpec">Upper specification limit, or null.</param>
public readonly record struct DriftLimits(double? LowerControl, double? UpperControl, double? LowerSpec = null, double? UpperSpec = null)
{
    /// <summary>The given limits with their kinds.</summary>
    internal IEnumerable<(LimitKind Kind, double Value)> Given()
    {
        if (LowerControl is { } lcl)
        {
            yield return (LimitKind.LowerControl, lcl);
        }

        if (UpperControl is { } ucl)
        {
            yield return (LimitKind.UpperControl, ucl);
        }

        if (LowerSpec is { } lsl)
        {
            yield return (LimitKind.LowerSpec, lsl);
        }

        if (UpperSpec is { } usl)
        {
            yield return (LimitKind.UpperSpec, usl);
        }
    }

    /// <summary>True for the kinds an upward drift approaches.</summary>
    internal static bool IsUpper(LimitKind kind) => kind is LimitKind.UpperControl or LimitKind.UpperSpec;
}
