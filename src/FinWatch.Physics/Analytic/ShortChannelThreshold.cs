namespace FinWatch.Physics.Analytic;

/// <summary>Short-channel threshold shift and swing from the exact barrier minimum (B.5).</summary>
/// <param name="ShiftV">ΔV_T,SCE = n_long·(ψ_L* − φ_th), in V (≤ 0); NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="LongChannelPotentialShiftV">ψ_L* − φ_th in V; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="BarrierSlope">∂ψ_min/∂ψ_L at ψ_L* (dimensionless, in (0, 1]); NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="SwingVPerDecade">S = S_long/(∂ψ_min/∂ψ_L), in V/decade; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="PunchThrough">
/// <see langword="true"/> when no ψ_L in [φ_th − 5 V, φ_th] brings the barrier down to φ_th: the barrier is gone.
/// </param>
public readonly record struct ShortChannelThreshold(
    double ShiftV, double LongChannelPotentialShiftV, double BarrierSlope, double SwingVPerDecade, bool PunchThrough);
