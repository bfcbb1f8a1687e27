using FinWatch.Server.Features.Model;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>
/// The fin model: the analytic threshold-shift estimate of a profile against its product's nominal, its whole
/// working for one device, and the numerical cross-section solve as a background job.
/// </summary>
public sealed class ModelFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args) =>
        builder.Services.AddSingleton<CrossSectionJobs>().AddSingleton<ProductModels>();

    public static void Map(IEndpointRouteBuilder endpoints)
    {
        ModelEndpoints.Map(endpoints);
        PredictEndpoints.Map(endpoints);
    }
}
