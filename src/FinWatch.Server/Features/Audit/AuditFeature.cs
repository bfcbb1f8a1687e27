using FinWatch.Server.Features.Audit;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>The append-only record of who changed what (products, limits, contexts, alerts, people), with its export.</summary>
public sealed class AuditFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => AuditEndpoints.Map(endpoints);
}
