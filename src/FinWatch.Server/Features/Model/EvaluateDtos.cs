using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Model;

/// <summary>POST /api/model/evaluate: one device, the model's whole working (docs/model.md §A–E).</summary>
public sealed record EvaluateRequest : IValidatedRequest
{
    public void Validate(ValidationErrors errors) => EvaluateModel.Check(this, errors);

    public double? TopWidthNm { get; init; }
    public double? BottomWidthNm { get; init; }
    public double? HeightNm { get; init; }
    public double? CornerRadiusNm { get; init; }
    public double? EotNm { get; init; }
    public double? GateLengthNm { get; init; }
    public double? DopingCm3 { get; init; }

    /// <summary>"tri-gate" (top and both sidewalls gated, the default) or "double-gate" (hard mask on top, sidewalls only).</summary>
    public string? GateFaces { get; init; }

    /// <summary>Sidewall surface, as a product's <c>model.sidewall_orientation</c>: "110" (the usual ⟨110⟩ fin on a (100) wafer, the default) or "100" (a fin rotated 45°).</summary>
    public string? SidewallOrientation { get; init; }

    public double? VdsLinV { get; init; }
    public double? VdsSatV { get; init; }
}

public sealed record GeometryResponse(
    double TaperDeg,
    double MidWidthNm,
    double AreaNm2,
    double GatedPerimeterNm,
    double MaxCornerRadiusNm);

public sealed record SliceResponse(
    double HeightNm,
    double? WidthNm,
    double VtLinV,
    double CurrentShare,
    bool Corner);

public sealed record EvaluateResponse(
    GeometryResponse Geometry,
    double ScaleLengthNm,
    double QcShiftMv,
    double? SceShiftLinMv,
    double? SceShiftSatMv,
    double? VtLinV,
    double? VtSatV,
    double? SwingLinMvPerDec,
    double? DiblMvPerV,
    IReadOnlyList<SliceResponse> Slices,
    IReadOnlyDictionary<string, double> Assumptions,
    IReadOnlyList<string> Warnings,
    string Note);
