using FinWatch.Server.Features.Lots;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>Stored lots: lists by step and one lot's wafers and sites with measured and derived values.</summary>
public sealed class LotsFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => LotsEndpoints.Map(endpoints);
}
