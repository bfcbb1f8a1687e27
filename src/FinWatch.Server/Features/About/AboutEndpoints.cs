using System.Reflection;
using FinWatch.Server.Features.Demo;

namespace FinWatch.Server.Features.About;

public sealed record AboutResponse(string Name, string Version, string Job, string DemoData, IReadOnlyDictionary<string, string> Links);

public static class AboutEndpoints
{
    /// <summary>What this service is and where its parts are; the root (/) serves the floor pages.</summary>
    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/api/about", (DemoLoader demo) => TypedResults.Ok(new AboutResponse(
            "FinWatch",
            typeof(AboutEndpoints).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "dev",
            "Fin-profile metrology ingest, derived fin geometry, SPC, electrical-impact estimates and a live monitor for FinFET lines.",
            demo.State,
            new Dictionary<string, string>
            {
                ["openapi"] = "/openapi/v1.json",
                ["health"] = "/health",
                ["products"] = "/api/products",
                ["parameters"] = "/api/parameters",
                ["lots"] = "/api/lots",
                ["series"] = "/api/series?product={code}&step={step}&parameter=taper_deg&level=wafer",
                ["ingest_json"] = "POST /api/measurements",
                ["ingest_csv"] = "POST /api/measurements/csv",
                ["contexts"] = "/api/contexts",
                ["alerts"] = "/api/alerts?state=active",
                ["live_hub"] = "/hubs/monitor",
                ["floor_pages"] = "/",
            }))).AllowAnonymous().WithTags("About").WithSummary("What this service is, and links to its API");
    }
}
