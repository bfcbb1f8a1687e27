using System.Text.Json.Serialization;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>
/// The live monitor: chart contexts and their limit versions, the evaluation of every stored batch into points, rule
/// signals and alerts, the alert queue, and the live feed pushed to the floor's screens.
/// </summary>
public sealed class MonitorFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args)
    {
        var services = builder.Services;
        services.AddOptions<MonitorOptions>().BindConfiguration(MonitorOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        // The hub speaks the same JSON as the HTTP API, so a page handles a pushed point like a fetched one, except that
        // it leaves out empty (null) fields: every screen parses every entry it is sent, and the pages test for a missing
        // value with == null, which holds for both.
        var signalR = services.AddSignalR().AddJsonProtocol(o =>
            o.PayloadSerializerOptions.UseFinWatchJson().DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull);
        if (builder.Configuration[SignalRScaleOut.RedisKey] is { Length: > 0 } redis)
        {
            // Several instances: each sends through Redis, so a screen on any instance gets points ingested on any other.
            var prefix = builder.Configuration[SignalRScaleOut.ChannelPrefixKey] is { Length: > 0 } p ? p : SignalRScaleOut.DefaultChannelPrefix;
            signalR.AddStackExchangeRedis(redis, o => o.Configuration.ChannelPrefix = StackExchange.Redis.RedisChannel.Literal(prefix));
        }

        services.AddSingleton<MonitorFeed>();
        services.AddSingleton<MonitorGate>();
        services.AddScoped<MonitorEvaluator>();
        // Ingest announces each stored batch; the evaluator picks it up.
        services.AddScoped<IBatchStoredListener>(sp => sp.GetRequiredService<MonitorEvaluator>());
        services.AddScoped<FeedReader>();
        services.AddSingleton<MonitorWorker>();
        services.AddHostedService(sp => sp.GetRequiredService<MonitorWorker>());
    }

    public static void Map(IEndpointRouteBuilder endpoints)
    {
        ContextEndpoints.Map(endpoints);
        LimitEndpoints.Map(endpoints);
        AlertEndpoints.Map(endpoints);
        FeedEndpoints.Map(endpoints);
    }
}
