using System.Net.Http.Headers;
using System.Text.Json;
using FinWatch.Testing;
using FsCheck.Xunit;

namespace FinWatch.Server.Tests.Features.Measurements;

/// <summary>One app and database for all generated cases (a fresh app per case would take most of the time budget).</summary>
public sealed class FuzzApp : IAsyncLifetime
{
    public FinWatchAppFactory Factory { get; } = new();

    public HttpClient Client { get; private set; } = null!;

    public async Task InitializeAsync()
    {
        Client = Factory.CreateClient();
        await TestProducts.CreateBothAsync(Client);
    }

    public Task DisposeAsync()
    {
        Client.Dispose();
        Factory.Dispose();
        return Task.CompletedTask;
    }
}

/// <summary>
/// Generated bodies (<see cref="IngestFuzzGenerators"/>) through both ingest endpoints of the in-process server. The
/// property is the project's own ingest contract (README, "What ingest answers", and DEVELOPERS.md, "Errors: always
/// problem details"): never a 5xx; any answer that is not 2xx is application/problem+json; a rejected batch leaves
/// every table an ingest writes unchanged; an accepted batch stores exactly the rows it reports as inserted, and its
/// rows are the inserted plus the already present ones.
/// </summary>
public sealed class IngestFuzzTests(FuzzApp app) : IClassFixture<FuzzApp>
{
    [Property(MaxTest = 300, Arbitrary = [typeof(IngestFuzzGenerators)])]
    public Task CsvEndpoint_GeneratedBody_AnswersByContract(CsvFuzz fuzz) =>
        PostAndCheckAsync("/api/measurements/csv", "text/csv", fuzz.Body);

    [Property(MaxTest = 300, Arbitrary = [typeof(IngestFuzzGenerators)])]
    public Task JsonEndpoint_GeneratedBody_AnswersByContract(JsonFuzz fuzz) =>
        PostAndCheckAsync("/api/measurements", "application/json", fuzz.Body);

    private async Task PostAndCheckAsync(string path, string mediaType, FuzzBody body)
    {
        var before = await app.Factory.CountsAsync();
        using var content = new ByteArrayContent(body.Bytes);
        content.Headers.ContentType = new MediaTypeHeaderValue(mediaType);
        using var response = await app.Client.PostAsync(new Uri(path, UriKind.Relative), content);
        var text = await response.Content.ReadAsStringAsync();
        var status = (int)response.StatusCode;
        var after = await app.Factory.CountsAsync();

        if (status >= 500) { File.WriteAllBytes("/tmp/fuzzfail-" + Guid.NewGuid().ToString("N") + (mediaType == "text/csv" ? ".csv" : ".json"), body.Bytes); }
        Assert.True(status < 500, $"{status} for {body}: {text}");
        if (status is < 200 or > 299)
        {
            Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
            Assert.Equal(status, JsonDocument.Parse(text).RootElement.GetProperty("status").GetInt32());
            Assert.Equal(before, after);
            return;
        }

        var accepted = JsonDocument.Parse(text).RootElement;
        var inserted = accepted.GetProperty("inserted").GetInt32();
        Assert.Equal(accepted.GetProperty("rows").GetInt32(), inserted + accepted.GetProperty("already_present").GetInt32());
        Assert.Equal(before.Measurements + inserted, after.Measurements);
        Assert.Equal(before.Batches + 1, after.Batches);
    }
}
