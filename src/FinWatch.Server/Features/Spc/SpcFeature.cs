using FinWatch.Server.Features.Spc;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>
/// Statistical process control on demand: analyses of numbers sent, and of stored series (control chart, capability,
/// three-way chart, trend forecast).
/// </summary>
public sealed class SpcFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints)
    {
        SpcEndpoints.Map(endpoints);
        StoredSeriesEndpoints.Map(endpoints);
        ThreeWayEndpoints.Map(endpoints);
        ForecastEndpoints.Map(endpoints);
        RunLengthEndpoints.Map(endpoints);
    }
}
