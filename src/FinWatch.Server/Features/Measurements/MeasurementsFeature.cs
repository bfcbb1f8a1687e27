using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>
/// Ingest: site rows from JSON, CSV uploads and the inbox folder are validated, derived and stored as one batch, all
/// or nothing; a stored batch is announced to the <see cref="IBatchStoredListener"/>s (the monitor).
/// </summary>
public sealed class MeasurementsFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args)
    {
        builder.Services.AddOptions<IngestOptions>().BindConfiguration(IngestOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddSingleton<IngestGate>();
        builder.Services.AddScoped<IngestMeasurements>();
        builder.Services.AddHostedService<InboxWatcher>();
    }

    public static void Map(IEndpointRouteBuilder endpoints)
    {
        MeasurementsEndpoints.Map(endpoints);
        EntryAidEndpoints.Map(endpoints);
    }
}
