namespace FinWatch.Server.Features.Model;

/// <summary>POST /api/model/predict: a measured profile of a product; its shifts against that product's nominal fin.</summary>
public sealed record PredictRequest
{
    public string? Product { get; init; }
    public double? TopWidthNm { get; init; }
    public double? BottomWidthNm { get; init; }
    public double? HeightNm { get; init; }
    public double? CornerRadiusNm { get; init; }

    /// <summary>Gate dielectric as EOT; the product's model EOT when not given.</summary>
    public double? EotNm { get; init; }

    /// <summary>Optional random metrology errors (1 σ, nm) of the measured inputs, propagated to σ of ΔVT (G.4).</summary>
    public MetrologySdRequest? MetrologySd { get; init; }
}

/// <summary>1 σ random errors of the measured profile, nm; an omitted one counts as 0.</summary>
public sealed record MetrologySdRequest
{
    public double? TopWidthNm { get; init; }
    public double? BottomWidthNm { get; init; }
    public double? HeightNm { get; init; }
    public double? CornerRadiusNm { get; init; }
}

/// <summary>σ of the predicted ΔVT from the metrology errors, mV (linearised at the nominal).</summary>
public sealed record ShiftUncertaintyResponse(
    double DeltaVtLinSdMv,
    double DeltaVtSatSdMv);

/// <summary>How much each input moved a shift, from the sensitivity table (they sum to the linear estimate).</summary>
public sealed record ContributionsResponse(
    double MidWidth,
    double Taper,
    double Height,
    double CornerRadius,
    double Dielectric,
    double LinearTotal);

public sealed record PredictResponse(
    string Product,
    double? DeltaVtLinMv,
    double? DeltaVtSatMv,
    double? DeltaSwingLinMvPerDec,
    double? DeltaDiblMvPerV,
    ContributionsResponse ContributionsLinMv,
    ContributionsResponse ContributionsSatMv,
    IReadOnlyList<string> Warnings,
    ShiftUncertaintyResponse? Uncertainty,
    string ParameterSet,
    string ParameterSetVersion,
    string CodeVersion,
    string Note);

public sealed record SensitivityRowResponse(
    string Input,
    string Unit,
    double DeltaVtLinMv,
    double DeltaVtSatMv,
    double DeltaSwingLinMvPerDec,
    double DeltaDiblMvPerV);

public sealed record SensitivitiesResponse(
    string Product,
    IReadOnlyList<SensitivityRowResponse> Rows,
    string ParameterSet,
    string ParameterSetVersion,
    string CodeVersion,
    string Note);
