namespace FinWatch.Statistics.Capability;

/// <summary>A two-sided confidence interval [Low, High] for a capability index (dimensionless).</summary>
/// <param name="Low">Lower confidence limit.</param>
/// <param name="High">Upper confidence limit; High ≥ Low.</param>
public readonly record struct ConfidenceInterval(double Low, double High);
