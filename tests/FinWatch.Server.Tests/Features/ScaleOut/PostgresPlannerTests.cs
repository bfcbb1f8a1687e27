using System.Text.Json;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Features.Series;
using FinWatch.Server.Infrastructure;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Configuration;
using Npgsql;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// FinWatch's PostgreSQL sessions carry the planner's random page cost (FinWatch:Database:PostgresRandomPageCost,
/// README Performance), and with it the series query is read from the series index in order, without a sort node
/// (PostgreSQL manual, "Using EXPLAIN": a Sort node appears when the rows must be sorted).
/// </summary>
public class PostgresPlannerTests : PostgresIntegrationTest
{
    private static readonly DateTimeOffset Start = new(2026, 11, 20, 10, 0, 0, TimeSpan.Zero);

    [ScaleOutFact]
    public async Task Session_HasTheConfiguredRandomPageCost()
    {
        var cost = await Factory.QueryAsync(db => db.Database.SqlQueryRaw<string>("SELECT current_setting('random_page_cost') AS \"Value\"").SingleAsync());
        Assert.Equal("1.1", cost);
    }

    [ScaleOutFact]
    public async Task SeriesQuery_OnPostgres_ScansTheSeriesIndexWithoutASort()
    {
        // 25 lots an hour apart, 25 wafers of 15 sites each (9,375 rows); the query asks for three hours of them.
        var rows = Enumerable.Range(1, 25).SelectMany(lot => SiteRow.Wafers($"PL{lot:00}", 25, 15, Start.AddHours(lot))).ToList();
        (await PostCsvAsync(SiteRow.Csv(rows))).EnsureSuccessStatusCode();
        await Factory.QueryAsync(db => db.Database.ExecuteSqlRawAsync("ANALYZE measurements"));
        FinParameters.TryGet("top_width_nm", out var parameter);
        var plan = await Factory.QueryAsync(async db =>
        {
            var productId = await db.Products.Where(p => p.Code == TestProducts.TriGate).Select(p => p.Id).SingleAsync();
            var query = new SeriesQuery(TestProducts.TriGate, productId, "FIN-PROFILE", parameter, null, Start.AddHours(10), Start.AddHours(13)).Queryable(db);
            await using var command = query.CreateDbCommand();
            command.CommandText = "EXPLAIN (FORMAT JSON) " + command.CommandText;
            await db.Database.OpenConnectionAsync();
            return JsonDocument.Parse((string)(await command.ExecuteScalarAsync())!).RootElement[0].GetProperty("Plan").Clone();
        });

        var nodes = Nodes(plan).ToList();
        Assert.Contains(nodes, n => n.GetProperty("Node Type").GetString() == "Index Scan"
            && n.GetProperty("Index Name").GetString() == "IX_measurements_series_order");
        Assert.DoesNotContain(nodes, n => n.GetProperty("Node Type").GetString() is "Sort" or "Incremental Sort");
    }

    private static IEnumerable<JsonElement> Nodes(JsonElement node) =>
        node.TryGetProperty("Plans", out var children)
            ? children.EnumerateArray().SelectMany(Nodes).Prepend(node)
            : [node];
}

/// <summary>How the planner option joins a PostgreSQL connection string (no server needed).</summary>
public class PostgresPlannerOptionTests
{
    [Fact]
    public void WithPlannerOptions_AddsTheStartupOption()
    {
        var cs = new NpgsqlConnectionStringBuilder(DatabaseOptions.WithPlannerOptions("Host=db;Database=finwatch", 1.1));
        Assert.Equal("-c random_page_cost=1.1", cs.Options);
        Assert.Equal("db", cs.Host);
    }

    [Fact]
    public void WithPlannerOptions_KeepsOtherOptionsAndAnExplicitCost()
    {
        Assert.Equal("-c statement_timeout=5000 -c random_page_cost=1.5",
            new NpgsqlConnectionStringBuilder(DatabaseOptions.WithPlannerOptions("Host=db;Options=-c statement_timeout=5000", 1.5)).Options);
        Assert.Equal("-c random_page_cost=2",
            new NpgsqlConnectionStringBuilder(DatabaseOptions.WithPlannerOptions("Host=db;Options=-c random_page_cost=2", 1.1)).Options);
    }

    [Theory]
    [InlineData(null, 1.1)]
    [InlineData("", null)]
    [InlineData("2.5", 2.5)]
    public void PostgresRandomPageCost_FromConfiguration(string? value, double? expected)
    {
        var settings = new Dictionary<string, string?>();
        if (value is not null)
        {
            settings["PostgresRandomPageCost"] = value;
        }

        var options = new ConfigurationBuilder().AddInMemoryCollection(settings).Build().Get<DatabaseOptions>() ?? new DatabaseOptions();
        Assert.Equal(expected, options.PostgresRandomPageCost);
    }

    [Fact]
    public void WithPlannerOptions_Unset_LeavesTheServerSetting()
    {
        Assert.Null(new NpgsqlConnectionStringBuilder(DatabaseOptions.WithPlannerOptions("Host=db", null)).Options);
    }
}
