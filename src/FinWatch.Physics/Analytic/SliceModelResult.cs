namespace FinWatch.Physics.Analytic;

/// <summary>Absolute slice-model results (E.2–E.4), relative to the gate's Δφ (mid-gap reference, no V_T offset).</summary>
/// <param name="ThresholdLowV">V_T,eff at V_DS,lin in V; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="ThresholdHighV">V_T,eff at V_DS,sat in V; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="SwingLowVPerDecade">S_eff at V_DS,lin in V/decade; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="SwingHighVPerDecade">S_eff at V_DS,sat in V/decade; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="DiblVPerV">DIBL_eff = −ΔV_T,eff/ΔV_DS in V/V; NaN when <paramref name="PunchThrough"/>.</param>
/// <param name="MinLengthRatio">Smallest L/λ_i over the slices (the widest slice).</param>
/// <param name="CornerFraction">f_c used for the corner term (0 for a double gate).</param>
/// <param name="PunchThrough">True when some slice has no barrier at V_DS,sat or V_DS,lin (B.5).</param>
public readonly record struct SliceModelResult(
    double ThresholdLowV,
    double ThresholdHighV,
    double SwingLowVPerDecade,
    double SwingHighVPerDecade,
    double DiblVPerV,
    double MinLengthRatio,
    double CornerFraction,
    bool PunchThrough);
