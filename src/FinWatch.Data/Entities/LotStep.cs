namespace FinWatch.Data.Entities;

/// <summary>Summary of one lot at one process step, maintained on ingest so lot listings need no scan of the site rows.</summary>
public sealed class LotStep
{
    public required string LotId { get; set; }
    public required string Step { get; set; }
    public int ProductId { get; set; }
    public long FirstMeasuredAtMs { get; set; }
    public long LastMeasuredAtMs { get; set; }
    public int WaferCount { get; set; }
    public int SiteCount { get; set; }
}
