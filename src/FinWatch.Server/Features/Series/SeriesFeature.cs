using FinWatch.Server.Features.Series;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>One parameter of one product and step in time order, by site or by wafer.</summary>
public sealed class SeriesFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => SeriesEndpoints.Map(endpoints);
}
