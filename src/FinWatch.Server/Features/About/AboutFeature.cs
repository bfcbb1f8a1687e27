using FinWatch.Server.Features.About;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>What this server is: name, version, database and demo mode (for the pages' header).</summary>
public sealed class AboutFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => AboutEndpoints.Map(endpoints);
}
