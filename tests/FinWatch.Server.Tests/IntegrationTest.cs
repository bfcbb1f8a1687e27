using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests;

/// <summary>Each test gets its own app and database; the two invented test products exist.</summary>
public abstract class IntegrationTest : IAsyncLifetime
{
    protected IntegrationTest()
    {
        Factory = new FinWatchAppFactory();
    }

    protected FinWatchAppFactory Factory { get; }

    protected HttpClient Client { get; private set; } = null!;

    protected virtual bool CreateProducts => true;

    /// <summary>Runs before the app starts (the PostgreSQL tests create their database here).</summary>
    protected virtual Task BeforeStartAsync() => Task.CompletedTask;

    /// <summary>Runs after the app has stopped.</summary>
    protected virtual Task AfterStopAsync() => Task.CompletedTask;

    public async Task InitializeAsync()
    {
        await BeforeStartAsync();
        Client = Factory.CreateClient();
        if (CreateProducts)
        {
            await TestProducts.CreateBothAsync(Client);
        }
    }

    public async Task DisposeAsync()
    {
        Client?.Dispose();
        Factory.Dispose();
        await AfterStopAsync();
    }

    protected Task<HttpResponseMessage> PostCsvAsync(string csv) => PostCsvAsync(Encoding.UTF8.GetBytes(csv));

    protected async Task<HttpResponseMessage> PostCsvAsync(byte[] body)
    {
        using var content = new ByteArrayContent(body);
        content.Headers.ContentType = new MediaTypeHeaderValue("text/csv");
        return await Client.PostAsync("/api/measurements/csv", content);
    }

    protected async Task<HttpResponseMessage> PostJsonAsync(string json)
    {
        using var content = new StringContent(json, Encoding.UTF8, "application/json");
        return await Client.PostAsync("/api/measurements", content);
    }

    protected static async Task<JsonElement> ReadJsonAsync(HttpResponseMessage response)
    {
        var text = await response.Content.ReadAsStringAsync();
        return JsonDocument.Parse(text).RootElement.Clone();
    }

    /// <summary>Asserts a rejected batch: 400 problem+json of the invalid-batch type; returns its errors.</summary>
    protected static async Task<JsonElement[]> AssertRejectedAsync(HttpResponseMessage response)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.BadRequest, $"expected 400, got {(int)response.StatusCode}: {body}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = JsonDocument.Parse(body).RootElement;
        Assert.Equal("/problems/invalid-batch", problem.GetProperty("type").GetString());
        var errors = problem.GetProperty("errors").EnumerateArray().Select(e => e.Clone()).ToArray();
        Assert.NotEmpty(errors);
        Assert.Equal(errors.Length, Math.Min(problem.GetProperty("error_count").GetInt32(), 100));
        return errors;
    }

    protected async Task AssertNothingStoredAsync()
    {
        var (measurements, batches, lotSteps, chambers) = await Factory.CountsAsync();
        Assert.Equal((0, 0, 0, 0), (measurements, batches, lotSteps, chambers));
    }

    protected static bool HasError(JsonElement[] errors, int row, string? column) =>
        errors.Any(e => e.GetProperty("row").GetInt32() == row
            && (column is null ? e.GetProperty("column").ValueKind == JsonValueKind.Null : e.GetProperty("column").GetString() == column));

    protected static string Describe(JsonElement[] errors) => string.Join("\n", errors.Select(e => e.ToString()));
}
