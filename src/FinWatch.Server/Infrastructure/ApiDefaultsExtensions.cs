using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Diagnostics.HealthChecks;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace FinWatch.Server.Infrastructure;

public static class ApiDefaultsExtensions
{
    /// <summary>
    /// The API's one JSON dialect, for the endpoints, the OpenAPI document (which reads the same options) and the live hub:
    /// field names, map keys and enum values in snake_case (field names carry their unit: <c>top_width_nm</c>). A map's
    /// keys go through the policy too, so a map keyed by data that must keep its spelling (lot ids) needs another shape.
    /// </summary>
    public static JsonSerializerOptions UseFinWatchJson(this JsonSerializerOptions options)
    {
        options.PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower;
        options.DictionaryKeyPolicy = JsonNamingPolicy.SnakeCaseLower;
        options.Converters.Add(new JsonStringEnumConverter(JsonNamingPolicy.SnakeCaseLower, allowIntegerValues: false));
        options.DefaultIgnoreCondition = JsonIgnoreCondition.Never;
        options.NumberHandling = JsonNumberHandling.Strict;
        return options;
    }

    /// <summary>JSON in the API's dialect (<see cref="UseFinWatchJson"/>), problem details for every error, OpenAPI.</summary>
    public static WebApplicationBuilder AddFinWatchApiDefaults(this WebApplicationBuilder builder)
    {
        builder.Services.ConfigureHttpJsonOptions(o => o.SerializerOptions.UseFinWatchJson());
        // A request that cannot be bound (malformed JSON, a wrong type, text where a number belongs) becomes a 400 problem
        // that says what could not be read and where, instead of a bare "Bad Request".
        builder.Services.Configure<RouteHandlerOptions>(o => o.ThrowOnBadRequest = true);
        builder.Services.AddProblemDetails(o => o.CustomizeProblemDetails = ctx =>
        {
            if (ctx.HttpContext.Features.Get<IExceptionHandlerFeature>()?.Error is BadHttpRequestException bad)
            {
                ctx.ProblemDetails.Status = bad.StatusCode;
                ctx.ProblemDetails.Title = "The request could not be read.";
                ctx.ProblemDetails.Detail = bad.InnerException is JsonException json ? $"{bad.Message} {json.Message}" : bad.Message;
            }
        });
        builder.Services.AddOpenApi();
        builder.Services.TryAddSingleton(TimeProvider.System);
        return builder;
    }

    public static WebApplication UseFinWatchApiDefaults(this WebApplication app)
    {
        app.UseExceptionHandler(new ExceptionHandlerOptions
        {
            StatusCodeSelector = e => e is BadHttpRequestException bad ? bad.StatusCode : StatusCodes.Status500InternalServerError,
            // A client's malformed request is not a server fault: it is answered, not logged as an error.
            SuppressDiagnosticsCallback = c => c.Exception is BadHttpRequestException,
        });
        app.UseStatusCodePages();
        app.MapOpenApi().AllowAnonymous();
        app.MapHealthChecks("/health").AllowAnonymous();
        // Liveness: the process answers; it does not touch the database.
        app.MapHealthChecks("/alive", new HealthCheckOptions { Predicate = _ => false }).AllowAnonymous();
        return app;
    }
}
