namespace FinWatch.Physics.Analytic;

/// <summary>Threshold and numerically defined swing of parallel sub-devices in the E.3 charge-interpolated form.</summary>
/// <param name="ThresholdV">V_G at which the total charge equals the critical charge, in V.</param>
/// <param name="SwingAtHundredthVPerDecade">S = dV_G/dlog₁₀I at I = I_crit/100, in V/decade.</param>
/// <param name="MaxSwingVPerDecade">Largest S over the four decades below I_crit, in V/decade (sampled on 400 steps in V_G).</param>
public readonly record struct ChargeInterpolatedResult(double ThresholdV, double SwingAtHundredthVPerDecade, double MaxSwingVPerDecade);
