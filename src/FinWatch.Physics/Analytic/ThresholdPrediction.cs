namespace FinWatch.Physics.Analytic;

/// <summary>
/// One record's predicted electrical shift against the product's nominal fin, evaluated with the same code and
/// calibration (G.2 step 6). Shift values are NaN when <see cref="Warnings"/> contains
/// <see cref="ModelWarnings.InvalidInput"/> or <see cref="ModelWarnings.PunchThrough"/>.
/// </summary>
/// <param name="DeltaThresholdLinMv">ΔV_T,lin = V_T,eff(fin) − V_T,eff(nominal) at V_DS,lin, in mV.</param>
/// <param name="DeltaThresholdSatMv">ΔV_T,sat at V_DS,sat, in mV.</param>
/// <param name="DeltaSwingLinMvPerDecade">ΔS_lin, in mV/decade.</param>
/// <param name="DeltaDiblMvPerV">ΔDIBL, in mV/V.</param>
/// <param name="LinearLin">Sensitivity-table contributions to ΔV_T,lin (mV); their total is the linear estimate.</param>
/// <param name="LinearSat">Sensitivity-table contributions to ΔV_T,sat (mV).</param>
/// <param name="MinLengthRatio">Smallest L_eff/λ over the fin's slices (dimensionless); NaN for invalid input.</param>
/// <param name="Warnings">Validity warnings (H.1 ranges, L/λ &lt; 3, punch-through, nonlinearity).</param>
/// <param name="ParameterSetName">Stamp: the parameter set's name.</param>
/// <param name="ParameterSetVersion">Stamp: the parameter set's version.</param>
/// <param name="CodeVersion">Stamp: <see cref="ThresholdModel.CodeVersion"/>.</param>
public sealed record ThresholdPrediction(
    double DeltaThresholdLinMv,
    double DeltaThresholdSatMv,
    double DeltaSwingLinMvPerDecade,
    double DeltaDiblMvPerV,
    ShiftContributions LinearLin,
    ShiftContributions LinearSat,
    double MinLengthRatio,
    ModelWarnings Warnings,
    string ParameterSetName,
    string ParameterSetVersion,
    string CodeVersion);
