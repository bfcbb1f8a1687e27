namespace FinWatch.Statistics.Capability;

/// <summary>
/// Normal-theory expected fraction outside the specification, in parts per million (docs/statistics.md §5.1):
/// below = Φ((LSL − x̄)/sigma)·10⁶, above = Φ(−(USL − x̄)/sigma)·10⁶.
/// </summary>
/// <param name="BelowLower">Expected ppm below LSL; null without a lower limit.</param>
/// <param name="AboveUpper">Expected ppm above USL; null without an upper limit.</param>
/// <param name="Total">Sum of the two that exist, 0..10⁶.</param>
public readonly record struct OutsideSpecPpm(double? BelowLower, double? AboveUpper, double Total);
