using FinWatch.Physics.Analytic;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// The predicted electrical shifts stored with a site (engineering estimate against the product's nominal fin):
/// mV, mV/dec and mV/V; a shift the model cannot give (punch-through, invalid fin) is null.
/// </summary>
public sealed record PredictedShifts(double? VtLinMv, double? VtSatMv, double? SwingLinMvPerDec, double? DiblMvPerV,
    string ParameterSet, string ParameterSetVersion, string CodeVersion)
{
    public static PredictedShifts From(ThresholdPrediction p) => new(
        Finite(p.DeltaThresholdLinMv), Finite(p.DeltaThresholdSatMv), Finite(p.DeltaSwingLinMvPerDecade), Finite(p.DeltaDiblMvPerV),
        p.ParameterSetName, p.ParameterSetVersion, p.CodeVersion);

    private static double? Finite(double v) => double.IsFinite(v) ? v : null;
}
