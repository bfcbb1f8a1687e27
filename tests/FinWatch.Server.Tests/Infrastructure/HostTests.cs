using System.Net;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Infrastructure;

public class HostTests : IntegrationTest
{
    protected override bool CreateProducts => false;

    [Theory]
    [InlineData("/health")]
    [InlineData("/alive")]
    public async Task HealthEndpoints_Answer200(string path)
    {
        var response = await Client.GetAsync(path);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("Healthy", await response.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task OpenApiDocument_ListsTheApi()
    {
        var doc = await ReadJsonAsync(await Client.GetAsync("/openapi/v1.json"));
        var paths = doc.GetProperty("paths").EnumerateObject().Select(p => p.Name).ToList();
        Assert.Contains("/api/measurements", paths);
        Assert.Contains("/api/measurements/csv", paths);
        Assert.Contains("/api/products", paths);
        Assert.Contains("/api/lots/{lot}", paths);
        Assert.Contains("/api/series", paths);
    }

    [Fact]
    public async Task About_DescribesTheService()
    {
        var about = await ReadJsonAsync(await Client.GetAsync("/api/about"));
        Assert.Equal("FinWatch", about.GetProperty("name").GetString());
        Assert.Equal("/openapi/v1.json", about.GetProperty("links").GetProperty("openapi").GetString());
    }

    [Fact]
    public async Task UnknownPath_Returns404Problem()
    {
        var response = await Client.GetAsync("/api/nothing-here");
        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }

    [Theory]
    [InlineData("/api/lots?page=abc", "page")]
    [InlineData("/api/series?product=P&step=S&parameter=taper_deg&from=yesterday", "from")]
    public async Task UnreadableQuery_Returns400ProblemNamingTheParameter(string path, string parameter)
    {
        var response = await Client.GetAsync(path);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var detail = (await ReadJsonAsync(response)).GetProperty("detail").GetString();
        Assert.Contains(parameter, detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task MalformedJsonBody_Returns400ProblemWithThePosition()
    {
        using var content = new StringContent("{\"code\": 5}", System.Text.Encoding.UTF8, "application/json");
        var response = await Client.PostAsync("/api/products", content);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var detail = (await ReadJsonAsync(response)).GetProperty("detail").GetString();
        Assert.Contains("$.code", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Database_IsInWalMode()
    {
        var mode = await Factory.QueryAsync(async db =>
        {
            var connection = db.Database.GetDbConnection();
            await connection.OpenAsync();
            await using var cmd = connection.CreateCommand();
            cmd.CommandText = "PRAGMA journal_mode";
            return (string?)await cmd.ExecuteScalarAsync();
        });
        Assert.Equal("wal", mode);
    }
}
