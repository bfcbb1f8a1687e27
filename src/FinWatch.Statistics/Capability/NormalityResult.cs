namespace FinWatch.Statistics.Capability;

/// <summary>
/// Result of the Anderson–Darling test for normality with mean and variance estimated (docs/statistics.md §6).
/// The statistic members are null when the test is undefined (<see cref="Reason"/> says why).
/// </summary>
/// <param name="N">Number of non-missing values used.</param>
/// <param name="ASquared">The statistic A², ≥ 0.</param>
/// <param name="AStar">The small-sample adjusted statistic A* = A²·(1 + 0.75/n + 2.25/n²).</param>
/// <param name="PValue">Approximate p-value from A* (D'Agostino and Stephens 1986, Table 4.9), clipped to [0, 1].
/// Small p means evidence against normality.</param>
/// <param name="Note">A caution that does not make the test undefined (n &lt; 8); null otherwise.</param>
/// <param name="Reason">Why the test is undefined (n &lt; 3, or zero standard deviation); null otherwise.</param>
public readonly record struct NormalityResult(int N, double? ASquared, double? AStar, double? PValue, string? Note, string? Reason);
