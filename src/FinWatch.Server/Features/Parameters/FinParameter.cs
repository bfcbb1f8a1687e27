namespace FinWatch.Server.Features.Parameters;

/// <summary>A chartable parameter: a measured value or one derived on ingest, with its unit and stored column.</summary>
/// <param name="Name">API name, e.g. <c>taper_deg</c>; it carries the unit.</param>
/// <param name="Kind">"measured" or "derived".</param>
/// <param name="Property">The <see cref="Data.Entities.Measurement"/> property that stores it.</param>
public sealed record FinParameter(string Name, string Unit, string Kind, string Label, string Description, string Property);
