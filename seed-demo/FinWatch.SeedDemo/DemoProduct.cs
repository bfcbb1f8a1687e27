using FinWatch.Physics;

namespace FinWatch.SeedDemo;

/// <summary>
/// A product of the invented demo fab (no real product is meant). Created on the server by <c>--demo</c>.
/// </summary>
/// <param name="Code">Short product code, as written in the CSV <c>product</c> column.</param>
/// <param name="Name">Display name.</param>
/// <param name="Description">One-line description.</param>
/// <param name="GateFaces">Tri-gate (top and both sidewalls gated) or double-gate (hard mask on top, sidewalls only); written as <see cref="GateFacesText"/>.</param>
/// <param name="Nominal">Nominal fin profile.</param>
/// <param name="Specs">Specs for all seven parameters (see <see cref="DemoSpec"/>).</param>
public sealed record DemoProduct(
    string Code,
    string Name,
    string Description,
    GateFaces GateFaces,
    DemoProfile Nominal,
    IReadOnlyList<DemoSpec> Specs);
