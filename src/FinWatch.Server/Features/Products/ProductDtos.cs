using FinWatch.Physics.Analytic;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Products;

/// <summary>A product's nominal fin profile; every length in nm.</summary>
public sealed record NominalProfile(
    double TopWidthNm,
    double BottomWidthNm,
    double FinHeightNm,
    double CornerRadiusNm,
    double LinerThicknessNm);

/// <summary>Lower spec, target and upper spec of one parameter (in its unit, see GET /api/parameters), each optional.</summary>
public sealed record SpecLimitDto(string Parameter, double? Lower, double? Target, double? Upper);

/// <summary>
/// What the electrical-impact model needs and the profile does not measure: gate dielectric as EOT (nm), effective gate
/// length (nm), channel acceptor doping (cm⁻³) and the sidewall surface ("110" or "100"). Defaults are the design
/// note's example nominal (docs/model.md §G.4) until the product is calibrated.
/// </summary>
public sealed record ModelInputs(
    double EotNm = 0.9,
    double GateLengthNm = 20,
    double ChannelDopingCm3 = 1e17,
    string SidewallOrientation = ConfinementSurfaceText.Si110);

/// <summary>Create a product. <c>gate_faces</c> is "tri-gate" (top and both sidewalls gated) or "double-gate" (hard mask on top, sidewalls only).</summary>
public sealed record ProductRequest(
    string Code,
    string Name,
    string? Description,
    string GateFaces,
    NominalProfile Nominal,
    List<SpecLimitDto>? Specs,
    ModelInputs? Model = null) : IValidatedRequest
{
    public void Validate(ValidationErrors errors) => ProductRules.Check(this, errors);
}

public sealed record ProductResponse(
    string Code, string Name, string Description, string GateFaces, NominalProfile Nominal,
    IReadOnlyList<SpecLimitDto> Specs, ModelInputs Model, DateTime CreatedAt, DateTime UpdatedAt);
