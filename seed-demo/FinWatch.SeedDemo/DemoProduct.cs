namespace FinWatch.SeedDemo;

/// <summary>
/// A product of the invented demo fab (no real product is meant). Created on the server by <c>--demo</c>.
/// </summary>
/// <param name="Code">Short product code, as written in the CSV <c>product</c> column.</param>
/// <param name="Name">Display name.</param>
/// <param name="Description">One-line description.</param>
/// <param name="GatedFaces"><c>"tri-gate"</c> (top and both sidewalls gated) or <c>"double-gate"</c> (hard mask on top, sidewalls only).</param>
/// <param name="Nominal">Nominal fin profile.</param>
/// <param name="Specs">Specs for all seven parameters (see <see cref="DemoSpec"/>).</param>
public sealed record DemoProduct(
    string Code,
    string Name,
    string Description,
    string GatedFaces,
    DemoProfile Nominal,
    IReadOnlyList<DemoSpec> Specs);
