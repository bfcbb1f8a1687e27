namespace FinWatch.Physics.Analytic;

/// <summary>The minimum of the quasi-2-D channel potential (B.5).</summary>
/// <param name="PotentialV">ψ_min in V (same reference as ψ_L and V_bi); V_bi when the barrier is gone.</param>
/// <param name="BarrierPresent">
/// <see langword="false"/> when tanh u* ≤ 0: the minimum has moved to the source, the barrier is gone
/// (punch-through) and <paramref name="PotentialV"/> is V_bi.
/// </param>
public readonly record struct BarrierMinimum(double PotentialV, bool BarrierPresent);
