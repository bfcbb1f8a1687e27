using FinWatch.Server.Features.Access;
using Microsoft.AspNetCore.Http.HttpResults;

namespace FinWatch.Server.Features.Monitor;

/// <summary>The live feed: the hub that pushes it and the endpoint a reconnecting screen catches up from.</summary>
public static class FeedEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/api/feed", FeedAsync).RequireAuthorization(Permissions.Floor).WithTags("Monitor").WithSummary("Live-feed entries after a number (what a reconnecting client missed)");
        app.MapHub<MonitorHub>(MonitorHub.Path).RequireAuthorization(Permissions.Floor);
    }

    private static async Task<Ok<List<FeedMessage>>> FeedAsync(long? after, string? context, FeedReader feed, CancellationToken cancellationToken)
    {
        var contexts = context?.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
        return TypedResults.Ok(await feed.AfterAsync(after ?? 0, contexts, cancellationToken));
    }
}
