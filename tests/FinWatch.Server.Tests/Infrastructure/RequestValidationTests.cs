using System.Net;
using System.Net.Http.Json;
using System.Reflection;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Routing;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Infrastructure;

public class RequestValidationTests : IntegrationTest
{
    [Fact]
    public void EveryEndpointWithACheckedRequest_RunsTheValidationFilter()
    {
        var endpoints = Factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .Where(e => e.Metadata.OfType<MethodInfo>().FirstOrDefault() is { } m && RequestValidation.ValidatedParameters(m).Length > 0)
            .ToList();
        // The bodies checked without the database: product (create and update), analysis, ARL, evaluate and cross-section.
        Assert.True(endpoints.Count >= 6, string.Join(", ", endpoints.Select(e => e.RoutePattern.RawText)));
        Assert.All(endpoints, e => Assert.NotNull(e.Metadata.GetMetadata<ValidatesRequests>()));
    }

    [Fact]
    public async Task PostProduct_OutOfRangeNominal_Returns400ByJsonPathAndStoresNothing()
    {
        var request = new
        {
            code = "X9",
            name = "too wide",
            gate_faces = "tri-gate",
            nominal = new { top_width_nm = 150.0, bottom_width_nm = 10.0, fin_height_nm = 42.0, corner_radius_nm = 1.0, liner_thickness_nm = 2.5 },
            model = new { eot_nm = 9.0, gate_length_nm = 20.0, channel_doping_cm3 = 1e17, sidewall_orientation = "110" },
        };
        var response = await Client.PostAsJsonAsync("/api/products", request);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var errors = (await ReadJsonAsync(response)).GetProperty("errors");
        // Ranges as the API documents them (common practice, no source).
        Assert.Equal("top_width_nm is 0.001 to 100 nm", errors.GetProperty("nominal.top_width_nm")[0].GetString());
        Assert.Equal("eot_nm is 0.3 to 5 nm", errors.GetProperty("model.eot_nm")[0].GetString());
        using var scope = Factory.Services.CreateScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatch.Data.FinWatchDbContext>();
        Assert.False(await db.Products.AnyAsync(p => p.Code == "X9"));
    }

    [Fact]
    public async Task PostAnalysis_BadSigmaMultiplier_Returns400NamingTheField()
    {
        var response = await Client.PostAsJsonAsync("/api/spc/analyses", new { values = new[] { 1.0, 2.0, 3.0 }, sigma_multiplier = 0.0 });
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = await ReadJsonAsync(response);
        Assert.Equal(400, problem.GetProperty("status").GetInt32());
        Assert.Equal("the sigma multiplier must be above 0 and at most 10",
            Assert.Single(problem.GetProperty("errors").EnumerateObject(), p => p.Name == "sigma_multiplier").Value[0].GetString());
    }

    [Fact]
    public async Task Problems_NotFound_KeepsTypeTitleStatusAndDetail()
    {
        var problem = await ReadJsonAsync(await Client.GetAsync("/api/alerts/424242"));
        Assert.Equal("/problems/not-found", problem.GetProperty("type").GetString());
        Assert.Equal("No such alert.", problem.GetProperty("title").GetString());
        Assert.Equal(404, problem.GetProperty("status").GetInt32());
        Assert.Equal("There is no alert 424242.", problem.GetProperty("detail").GetString());
    }
}
