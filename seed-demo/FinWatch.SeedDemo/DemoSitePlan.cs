namespace FinWatch.SeedDemo;

/// <summary>One site of a demo site plan: its id and position from the wafer centre (mm, as the rows write it).</summary>
public sealed record DemoPlanSite(string SiteId, double XMm, double YMm);

/// <summary>The sites the demo's metrology measures for one product at one step, in the order it measures them.</summary>
public sealed record DemoSitePlan(string Product, string Step, IReadOnlyList<DemoPlanSite> Sites);
