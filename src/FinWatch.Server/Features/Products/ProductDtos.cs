using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Features.Products;

/// <summary>A product's nominal fin profile; every length in nm.</summary>
public sealed record NominalProfile(
    [property: Range(0.001, 100)] double TopWidthNm,
    [property: Range(0.001, 100)] double BottomWidthNm,
    [property: Range(0.001, 300)] double FinHeightNm,
    [property: Range(0, 50)] double CornerRadiusNm,
    [property: Range(0, 20)] double LinerThicknessNm);

/// <summary>Lower spec, target and upper spec of one parameter (in its unit, see GET /api/parameters), each optional.</summary>
public sealed record SpecLimitDto([property: Required] string Parameter, double? Lower, double? Target, double? Upper);

/// <summary>
/// What the electrical-impact model needs and the profile does not measure: gate dielectric as EOT (nm), effective gate
/// length (nm), channel acceptor doping (cm⁻³) and the sidewall surface ("110" or "100"). Defaults are the design
/// note's example nominal (fin-model.md G.4) until the product is calibrated.
/// </summary>
public sealed record ModelInputs(
    [property: Range(0.3, 5)] double EotNm = 0.9,
    [property: Range(5, 200)] double GateLengthNm = 20,
    [property: Range(0, 1e20)] double ChannelDopingCm3 = 1e17,
    string SidewallOrientation = "110");

/// <summary>Create a product. <c>gate_faces</c> is "tri-gate" (top and sidewalls gated) or "double-gate" (hard mask on top).</summary>
public sealed record ProductRequest(
    [property: Required, RegularExpression("^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$", ErrorMessage = "1 to 64 letters, digits, '.', '_' or '-', starting with a letter or digit")] string Code,
    [property: Required, StringLength(200, MinimumLength = 1)] string Name,
    [property: StringLength(2000)] string? Description,
    [property: Required] string GateFaces,
    [property: Required] NominalProfile Nominal,
    List<SpecLimitDto>? Specs,
    ModelInputs? Model = null);

public sealed record ProductResponse(
    string Code, string Name, string Description, string GateFaces, NominalProfile Nominal,
    IReadOnlyList<SpecLimitDto> Specs, ModelInputs Model, DateTime CreatedAt, DateTime UpdatedAt);
