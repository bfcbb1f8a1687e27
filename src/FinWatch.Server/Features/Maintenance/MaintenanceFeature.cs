using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>
/// The maintenance log of chambers and tools: recording (one at a time or by file), listing, and the markers a chart
/// draws where its chamber was maintained.
/// </summary>
public sealed class MaintenanceFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => MaintenanceEndpoints.Map(endpoints);
}
