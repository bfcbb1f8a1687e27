namespace FinWatch.Server.Features.Parameters;

public static class ParametersEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/api/parameters", () => TypedResults.Ok(FinParameters.All.Select(p => new ParameterResponse(p.Name, p.Unit, p.Kind, p.Label, p.Description))))
            .WithTags("Parameters")
            .WithSummary("The measured and derived parameters, with their units");
    }
}

public sealed record ParameterResponse(string Name, string Unit, string Kind, string Label, string Description);
