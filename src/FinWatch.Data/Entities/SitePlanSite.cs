namespace FinWatch.Data.Entities;

/// <summary>
/// One site of a product's site plan at one step: where the metrology tool measures, in the order it measures.
/// Position is 1-based; x and y are mm from the wafer centre.
/// </summary>
public sealed class SitePlanSite
{
    public int Id { get; set; }
    public int ProductId { get; set; }
    public required string Step { get; set; }
    public int Position { get; set; }
    public required string SiteId { get; set; }
    public double SiteXMm { get; set; }
    public double SiteYMm { get; set; }
    public long UpdatedAtMs { get; set; }
    public required string UpdatedBy { get; set; }
}
