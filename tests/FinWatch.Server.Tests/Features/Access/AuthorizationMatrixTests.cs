using System.Text;
using FinWatch.Testing;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Features.Access;

/// <summary>
/// Every endpoint against every kind of caller. The expected rights are the issue's permission list (technicians ingest,
/// enter data and acknowledge; supervisors also disposition and close; engineers also manage products, specifications,
/// contexts, limits, reaction plans and calibrations; administrators also people and keys; everyone signed in reads;
/// a tool key only ingests; a display only reads the floor overview and charts). An endpoint missing from the table
/// fails the test, so a new endpoint must be classified here.
/// </summary>
public sealed class AuthorizationMatrixTests : IntegrationTest
{
    private static readonly Dictionary<string, string> Expected = new(StringComparer.Ordinal)
    {
        ["GET /api/about"] = "anonymous",
        ["GET /health"] = "anonymous",
        ["GET /alive"] = "anonymous",
        ["GET /openapi/{documentName}.json"] = "anonymous",
        ["POST /api/auth/sign-in"] = "anonymous",
        ["POST /api/auth/sign-out"] = "anonymous",
        ["GET /api/auth/me"] = "anonymous",
        ["GET /api/auth/antiforgery"] = "anonymous",
        ["GET /display/{token}"] = "anonymous",
        ["GET /api/parameters"] = "read",
        ["GET /api/products/"] = "floor",
        ["GET /api/products/{code}"] = "floor",
        ["POST /api/products/"] = "engineer",
        ["PUT /api/products/{code}"] = "engineer",
        ["GET /api/products/{code}/site-plans/"] = "floor",
        ["PUT /api/products/{code}/site-plans/"] = "engineer",
        ["GET /api/measurements/known-values"] = "read",
        ["GET /api/measurements/ranges"] = "read",
        ["POST /api/measurements/"] = "ingest",
        ["POST /api/measurements/csv"] = "ingest",
        ["GET /api/lots/"] = "read",
        ["GET /api/lots/{lot}"] = "read",
        ["GET /api/series"] = "read",
        ["GET /api/series/three-way"] = "read",
        ["GET /api/series/forecast"] = "read",
        ["GET /api/series/chart"] = "read",
        ["GET /api/series/capability"] = "floor",
        ["POST /api/spc/analyses"] = "read",
        ["POST /api/spc/arl"] = "read",
        ["GET /api/spc/constants"] = "read",
        ["GET /api/spc/rules"] = "read",
        ["POST /api/model/evaluate"] = "read",
        ["POST /api/model/cross-section"] = "read",
        ["GET /api/model/cross-section/{id}"] = "read",
        ["DELETE /api/model/cross-section/{id}"] = "read",
        ["POST /api/model/predict"] = "read",
        ["GET /api/model/sensitivities"] = "read",
        ["POST /api/model/calibrations/"] = "engineer",
        ["GET /api/model/calibrations/"] = "read",
        ["GET /api/contexts/"] = "floor",
        ["POST /api/contexts/"] = "engineer",
        ["GET /api/contexts/{code}"] = "floor",
        ["PUT /api/contexts/{code}"] = "engineer",
        ["GET /api/contexts/{code}/points"] = "floor",
        ["GET /api/contexts/{code}/limits"] = "read",
        ["POST /api/contexts/{code}/limits"] = "engineer",
        ["POST /api/contexts/{code}/limits/{version:int}/approve"] = "engineer",
        ["GET /api/contexts/{code}/run-length"] = "read",
        ["POST /api/contexts/run-length"] = "read",
        ["GET /api/run-length"] = "read",
        ["GET /api/feed"] = "floor",
        ["GET /hubs/monitor/negotiate"] = "floor", // the negotiate endpoint has no method metadata; GET stands for it
        ["GET /hubs/monitor"] = "floor",
        ["GET /api/alerts/"] = "floor", // a wall screen's banner loads the open alerts
        ["GET /api/alerts/counts"] = "read",
        ["GET /api/alerts/{id:long}"] = "read",
        ["POST /api/alerts/{id:long}/acknowledge"] = "acknowledge",
        ["POST /api/alerts/{id:long}/disposition"] = "disposition",
        ["POST /api/alerts/{id:long}/close"] = "disposition",
        ["GET /api/people/"] = "administer",
        ["POST /api/people/"] = "administer",
        ["PUT /api/people/{name}"] = "administer",
        ["POST /api/people/{name}/password"] = "administer",
        ["GET /api/keys/"] = "administer",
        ["POST /api/keys/"] = "administer",
        ["POST /api/keys/{id:int}/revoke"] = "administer",
        ["GET /api/audit/"] = "read",
        ["GET /api/audit/csv"] = "read",
        ["GET /api/reports/shift"] = "read",
        ["GET /api/reports/shift.csv"] = "read",
        ["GET /api/reports/shift/handover/"] = "read",
        ["PUT /api/reports/shift/handover/"] = "disposition",
        ["POST /api/reports/shift/handover/sign-off"] = "disposition",
        ["POST /api/maintenance"] = "disposition",
        ["GET /api/maintenance"] = "read",
        ["POST /api/maintenance/import"] = "disposition",
        ["GET /api/contexts/{code}/maintenance"] = "floor",
        ["GET /api/notifications/channels"] = "read",
        ["GET /api/notifications/rules"] = "read",
        ["POST /api/notifications/rules"] = "read",
        ["PUT /api/notifications/rules/{id:long}"] = "read",
        ["DELETE /api/notifications/rules/{id:long}"] = "read",
        ["GET /api/notifications/messages"] = "read",
        ["POST /api/notifications/messages/{id:long}/send-again"] = "disposition",
        ["GET /api/roster/"] = "read",
        ["PUT /api/roster/"] = "disposition",
        ["GET /api/roster/on-shift"] = "read",
    };

    private static readonly Dictionary<string, string[]> Rights = new(StringComparer.Ordinal)
    {
        ["anonymous"] = ["anonymous"],
        ["display"] = ["anonymous", "floor"],
        ["ingest-key"] = ["anonymous", "ingest"],
        ["technician"] = ["anonymous", "floor", "read", "ingest", "acknowledge"],
        ["supervisor"] = ["anonymous", "floor", "read", "ingest", "acknowledge", "disposition"],
        ["engineer"] = ["anonymous", "floor", "read", "ingest", "acknowledge", "disposition", "engineer"],
        ["administrator"] = ["anonymous", "floor", "read", "ingest", "acknowledge", "disposition", "engineer", "administer"],
    };

    // Each endpoint with the content type it accepts (routing answers 415 before authorization to any other).
    private List<(string Method, string Route, string ContentType)> Endpoints() =>
        [.. Factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .SelectMany(e => (e.Metadata.GetMetadata<HttpMethodMetadata>()?.HttpMethods ?? ["GET"]).Select(m => (m, "/" + e.RoutePattern.RawText!.TrimStart('/'),
                e.Metadata.GetMetadata<Microsoft.AspNetCore.Http.Metadata.IAcceptsMetadata>() is { ContentTypes.Count: > 0 } accepts ? accepts.ContentTypes[0] : "application/json")))
            .Where(e => !e.Item2.StartsWith("/hubs/monitor/", StringComparison.Ordinal) || e.Item2 == "/hubs/monitor/negotiate")
            .Distinct()];

    [Fact]
    public void EveryEndpoint_IsInTheTable()
    {
        var missing = Endpoints().Select(e => $"{e.Method} {e.Route}").Where(k => !Expected.ContainsKey(k)).ToList();
        Assert.True(missing.Count == 0, "classify these endpoints in AuthorizationMatrixTests: " + string.Join(", ", missing));
    }

    [Theory]
    [InlineData("anonymous")]
    [InlineData("display")]
    [InlineData("ingest-key")]
    [InlineData("technician")]
    [InlineData("supervisor")]
    [InlineData("engineer")]
    [InlineData("administrator")]
    public async Task EveryEndpoint_AnswersEachCallerByItsRights(string who)
    {
        var wrong = new List<string>();
        foreach (var (method, route, contentType) in Endpoints())
        {
            var permission = Expected[$"{method} {route}"];
            var allowed = Rights[who].Contains(permission);
            using var request = new HttpRequestMessage(new HttpMethod(method), Concrete(route));
            request.Headers.Add(TestAuthHandler.Header, who);
            if (method is "POST" or "PUT")
            {
                request.Content = new StringContent(contentType == "application/json" ? "{}" : "x", Encoding.UTF8, contentType);
            }

            using var response = await Client.SendAsync(request);
            var status = (int)response.StatusCode;
            var refused = status is 401 or 403;
            if (status >= 500)
            {
                wrong.Add($"{method} {route}: {status} for {who}");
            }
            else if (allowed == refused || (refused && status != (who == "anonymous" ? 401 : 403)))
            {
                wrong.Add($"{method} {route}: {status} for {who}, expected {(allowed ? "allowed" : who == "anonymous" ? "401" : "403")} ({permission})");
            }
        }

        Assert.True(wrong.Count == 0, string.Join("\n", wrong));
    }

    private static string Concrete(string route) => route
        .Replace("{documentName}", "v1", StringComparison.Ordinal).Replace("{token}", "fwk_nothing", StringComparison.Ordinal)
        .Replace("{code}", "NO-SUCH", StringComparison.Ordinal).Replace("{lot}", "NO-SUCH", StringComparison.Ordinal)
        .Replace("{id}", "no-such", StringComparison.Ordinal).Replace("{id:long}", "999", StringComparison.Ordinal)
        .Replace("{id:int}", "999", StringComparison.Ordinal).Replace("{version:int}", "1", StringComparison.Ordinal)
        .Replace("{name}", "nobody", StringComparison.Ordinal);
}
