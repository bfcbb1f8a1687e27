using FinWatch.Server.Features.Model.Calibrations;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>Calibrating a product's model to electrical-test results: the fit, its preview and its history.</summary>
public sealed class CalibrationsFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args) => builder.Services.AddScoped<CalibrateModel>();

    public static void Map(IEndpointRouteBuilder endpoints) => CalibrationEndpoints.Map(endpoints);
}
