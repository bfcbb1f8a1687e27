using FinWatch.Server.Features.Reports;
using FinWatch.Server.Infrastructure;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features;

/// <summary>The shift report: what a shift measured, raised, handled and left open, as JSON or CSV.</summary>
public sealed class ReportsFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args)
    {
        builder.Services.AddOptions<ShiftOptions>().BindConfiguration(ShiftOptions.Section).ValidateOnStart();
        builder.Services.AddSingleton<IValidateOptions<ShiftOptions>, ShiftOptionsValidator>();
        builder.Services.AddScoped<ShiftReport>();
    }

    public static void Map(IEndpointRouteBuilder endpoints)
    {
        ReportEndpoints.Map(endpoints);
        HandoverEndpoints.Map(endpoints);
    }
}
