using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Features.Series;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Series;

/// <summary>
/// The series query (shared by the series, chart and capability endpoints) is answered from the series index in its
/// order, without a sort: SQLite's EXPLAIN QUERY PLAN (sqlite.org/eqp.html) names the index it searches and says
/// "USE TEMP B-TREE FOR ORDER BY" when it has to sort.
/// </summary>
public class SeriesQueryPlanTests : IntegrationTest
{
    private static readonly DateTimeOffset Day1 = new(2026, 11, 10, 8, 0, 0, TimeSpan.Zero);

    [Theory]
    [InlineData(null)]
    [InlineData("ETA-1")]
    public async Task SeriesQuery_OnSqlite_SearchesTheSeriesIndexAndDoesNotSort(string? chamber)
    {
        (await PostCsvAsync(SiteRow.Csv(SiteRow.Wafers("PA", 2, 4, Day1)))).EnsureSuccessStatusCode();
        FinParameters.TryGet("top_width_nm", out var parameter);
        var plan = await Factory.QueryAsync(async db =>
        {
            var productId = await db.Products.Where(p => p.Code == "TP-TRI").Select(p => p.Id).SingleAsync();
            var query = new SeriesQuery("TP-TRI", productId, "FIN-PROFILE", parameter, chamber, Day1, Day1.AddDays(7)).Queryable(db);
            await using var command = query.CreateDbCommand();
            command.CommandText = "EXPLAIN QUERY PLAN " + command.CommandText;
            await db.Database.OpenConnectionAsync();
            await using var reader = await command.ExecuteReaderAsync();
            var details = new List<string>();
            while (await reader.ReadAsync())
            {
                details.Add(reader.GetString(3));
            }

            return details;
        });

        Assert.Contains(plan, d => d.Contains("USING INDEX IX_measurements_series_order", StringComparison.Ordinal));
        Assert.DoesNotContain(plan, d => d.Contains("TEMP B-TREE", StringComparison.Ordinal));
    }
}
