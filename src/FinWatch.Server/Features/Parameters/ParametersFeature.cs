using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>The measured and derived parameters with their units, as every chart and series names them.</summary>
public sealed class ParametersFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => ParametersEndpoints.Map(endpoints);
}
