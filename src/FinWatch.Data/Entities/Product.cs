using FinWatch.Physics;
using FinWatch.Physics.Analytic;

namespace FinWatch.Data.Entities;

/// <summary>A product: its nominal fin profile (nm) and its specification limits per parameter.</summary>
public sealed class Product
{
    public int Id { get; set; }

    /// <summary>Short unique code used in ingest files (column <c>product</c>).</summary>
    public required string Code { get; set; }

    public required string Name { get; set; }

    public string Description { get; set; } = "";

    /// <summary>Which faces the gate covers: tri-gate (top and sidewalls) or double-gate (hard mask on top); stored as <see cref="GateFacesText"/>.</summary>
    public GateFaces GateFaces { get; set; } = GateFaces.TriGate;

    public double NominalTopWidthNm { get; set; }
    public double NominalBottomWidthNm { get; set; }
    public double NominalFinHeightNm { get; set; }
    public double NominalCornerRadiusNm { get; set; }
    public double NominalLinerThicknessNm { get; set; }

    /// <summary>Electrical-model inputs the profile does not measure (docs/model.md §G.3 defaults until calibrated).</summary>
    public double ModelEotNm { get; set; } = 0.9;

    public double ModelGateLengthNm { get; set; } = 20;

    public double ModelChannelDopingCm3 { get; set; } = 1e17;

    /// <summary>Sidewall surface: "110" (a ⟨110⟩ fin on a (100) wafer) or "100", as <see cref="ConfinementSurfaceText"/>.</summary>
    public string ModelSidewallOrientation { get; set; } = ConfinementSurfaceText.Si110;

    public long CreatedAtMs { get; set; }
    public long UpdatedAtMs { get; set; }

    public List<SpecLimit> Specs { get; set; } = [];
}
