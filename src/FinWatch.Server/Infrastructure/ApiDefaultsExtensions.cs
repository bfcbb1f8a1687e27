using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Diagnostics.HealthChecks;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace FinWatch.Server.Infrastructure;

public static class ApiDefaultsExtensions
{
    /// <summary>JSON in snake_case (field names carry their unit: <c>top_width_nm</c>), problem details for every error, OpenAPI.</summary>
    public static WebApplicationBuilder AddFinWatchApiDefaults(this WebApplicationBuilder builder)
    {
        builder.Services.ConfigureHttpJsonOptions(o =>
        {
            o.SerializerOptions.PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower;
            o.SerializerOptions.DictionaryKeyPolicy = null;
            o.SerializerOptions.DefaultIgnoreCondition = JsonIgnoreCondition.Never;
            o.SerializerOptions.NumberHandling = JsonNumberHandling.Strict;
        });
        builder.Services.AddProblemDetails();
        builder.Services.AddValidation();
        builder.Services.AddOpenApi();
        builder.Services.TryAddSingleton(TimeProvider.System);
        return builder;
    }

    public static WebApplication UseFinWatchApiDefaults(this WebApplication app)
    {
        app.UseExceptionHandler();
        app.UseStatusCodePages();
        app.MapOpenApi();
        app.MapHealthChecks("/health");
        // Liveness: the process answers; it does not touch the database.
        app.MapHealthChecks("/alive", new HealthCheckOptions { Predicate = _ => false });
        return app;
    }
}
