using System.Reflection;
using Microsoft.Extensions.Options;
using Npgsql;
using OpenTelemetry.Metrics;
using OpenTelemetry.Resources;
using OpenTelemetry.Trace;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// Observability (README Observability). FinWatch's instruments (<see cref="Telemetry"/>) always exist and cost almost
/// nothing unheard. OpenTelemetry collects only when an exporter is configured: OTLP (metrics and traces) when
/// OTEL_EXPORTER_OTLP_ENDPOINT is set, read with the other OTEL_* variables by the OpenTelemetry SDK itself, and the
/// Prometheus scrape (metrics) when <see cref="TelemetryOptions.PrometheusEnabled"/> is set. With neither, no
/// OpenTelemetry provider is registered at all.
/// </summary>
public static class TelemetryExtensions
{
    public const string OtlpEndpointVariable = "OTEL_EXPORTER_OTLP_ENDPOINT";

    /// <summary>service.name unless OTEL_SERVICE_NAME (or service.name in OTEL_RESOURCE_ATTRIBUTES) says otherwise.</summary>
    public const string DefaultServiceName = "finwatch";

    // The EF Core instrumentation's name for the SQLite provider; PostgreSQL commands are traced by Npgsql itself.
    private const string SqliteProvider = "Microsoft.EntityFrameworkCore.Sqlite";

    public static WebApplicationBuilder AddFinWatchTelemetry(this WebApplicationBuilder builder)
    {
        builder.Services.AddOptions<TelemetryOptions>().BindConfiguration(TelemetryOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddMetrics();
        builder.Services.AddSingleton<Telemetry>();

        var settings = builder.Configuration.GetSection(TelemetryOptions.Section).Get<TelemetryOptions>() ?? new TelemetryOptions();
        var otlp = builder.Configuration[OtlpEndpointVariable] is { Length: > 0 };
        if (!otlp && !settings.PrometheusEnabled)
        {
            return builder;
        }

        var version = typeof(Telemetry).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion;
        var telemetry = builder.Services.AddOpenTelemetry()
            // The environment's resource variables are read last, so that they win over the defaults.
            .ConfigureResource(r => r.Clear().AddService(DefaultServiceName, serviceVersion: version).AddTelemetrySdk().AddEnvironmentVariableDetector())
            .WithMetrics(metrics =>
            {
                // ASP.NET Core's own meters (requests, Kestrel, SignalR connections), the runtime's (GC, thread pool), Npgsql's.
                metrics.AddMeter(Telemetry.Name).AddAspNetCoreInstrumentation().AddMeter("System.Runtime").AddNpgsqlInstrumentation();
                if (otlp)
                {
                    metrics.AddOtlpExporter();
                }

                if (settings.PrometheusEnabled)
                {
                    metrics.AddPrometheusExporter();
                }
            });
        if (otlp)
        {
            telemetry.WithTracing(tracing => tracing
                .AddSource(Telemetry.Name)
                .AddAspNetCoreInstrumentation(o => o.Filter = http => !IsProbeOrScrape(http, settings))
                .AddEntityFrameworkCoreInstrumentation(o => o.Filter = (provider, _) => provider == SqliteProvider)
                .AddNpgsql()
                .AddOtlpExporter());
        }

        if (settings.PrometheusEnabled)
        {
            builder.Services.AddSingleton<IStartupFilter, PrometheusScrape>();
        }

        return builder;
    }

    // Health probes and scrapes arrive every few seconds and say nothing about the fab's work: no spans for them.
    private static bool IsProbeOrScrape(HttpContext http, TelemetryOptions settings) =>
        http.Request.Path.StartsWithSegments("/health") || http.Request.Path.StartsWithSegments("/alive")
        || (settings.PrometheusEnabled && http.Request.Path.StartsWithSegments(settings.PrometheusPath));

    /// <summary>
    /// The scrape answers first in the pipeline, before sign-in and the pages: a scraper has no session, and the
    /// answer holds counts and durations only (<see cref="TelemetryOptions.PrometheusEnabled"/>).
    /// </summary>
    private sealed class PrometheusScrape(IOptions<TelemetryOptions> options) : IStartupFilter
    {
        public Action<IApplicationBuilder> Configure(Action<IApplicationBuilder> next) => app =>
        {
            app.UseOpenTelemetryPrometheusScrapingEndpoint(options.Value.PrometheusPath);
            next(app);
        };
    }
}
