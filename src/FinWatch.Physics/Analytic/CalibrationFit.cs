namespace FinWatch.Physics.Analytic;

/// <summary>
/// The result of <see cref="Calibration.Fit"/>: the fitted parameter set, its three fitted values with posterior standard
/// deviations, and the fit quality (root-mean-square threshold residual in mV before and after).
/// </summary>
public sealed record CalibrationFit(
    CalibrationParameters Parameters,
    double GateLengthNm, double GateLengthSdNm,
    double BarrierHeightV, double BarrierHeightSdV,
    double ThresholdOffsetV, double ThresholdOffsetSdV,
    double RmsResidualBeforeMv, double RmsResidualAfterMv,
    int Observations, int Iterations);
