using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Server.Features;
using FinWatch.Server.Features.Monitor;
using FinWatch.Testing;
using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Monitor;

/// <summary>Drafts carry the baseline check's verdict; approval of an unstable baseline needs a justification; a second engineer approves.</summary>
public class BaselineCheckTests : IntegrationTest
{
    /// <summary>Baseline wafers in lots of 15 (B0001, B0002, …), a lot an hour, in the order given.</summary>
    internal static async Task BaselineAsync(HttpClient client, double[] offsets)
    {
        for (var lot = 0; lot * 15 < offsets.Length; lot++)
        {
            await IngestAsync(client, Wafers($"B{lot + 1:0000}", BaselineDay.AddHours(lot), [.. offsets.Skip(lot * 15).Take(15)]));
        }
    }

    private async Task<JsonElement> DraftAsync(string code, params double[] offsets)
    {
        await BaselineAsync(Client, offsets);
        await CreateContextAsync(Client, code);
        var computed = await Client.PostAsJsonAsync($"/api/contexts/{code}/limits", new { reason = "baseline" });
        Assert.Equal(HttpStatusCode.Created, computed.StatusCode);
        return await ReadJsonAsync(computed);
    }

    private Task<HttpResponseMessage> ApproveAsync(string code, int version, string? justification, string? asWho)
    {
        var request = new HttpRequestMessage(HttpMethod.Post, $"/api/contexts/{code}/limits/{version}/approve")
        {
            Content = JsonContent.Create(new { comment = "reviewed", effective_from = EffectiveFrom, justification }),
        };
        if (asWho is not null)
        {
            request.Headers.Add(TestAuthHandler.Header, asWho);
        }

        return Client.SendAsync(request);
    }

    [Fact]
    public async Task SteadyBaselineOf30Wafers_IsStable_AndASecondEngineerApprovesItWithoutJustification()
    {
        // Wafer means alternate 6.01 and 5.99 nm: no rule fires (|z| = 0.28 against σ/√5), no trend, 30 ≥ 25 subgroups.
        var draft = await DraftAsync("TRI-TOP", [.. Enumerable.Range(0, 30).Select(i => i % 2 == 0 ? 0.01 : -0.01)]);
        Assert.Equal("stable", draft.GetProperty("verdict").GetString());
        var check = draft.GetProperty("check");
        Assert.Empty(check.GetProperty("reasons").EnumerateArray());
        Assert.Equal(30, check.GetProperty("subgroups").GetInt32());
        Assert.Equal("Mann–Kendall", check.GetProperty("trend").GetProperty("method").GetString());
        Assert.Equal("none", check.GetProperty("trend").GetProperty("direction").GetString());
        Assert.Equal("Anderson–Darling", check.GetProperty("normality").GetProperty("method").GetString());

        var same = await ApproveAsync("TRI-TOP", 1, null, null);
        Assert.Equal(HttpStatusCode.Forbidden, same.StatusCode); // the administrator computed it
        Assert.Contains("another engineer", (await ReadJsonAsync(same)).GetProperty("detail").GetString(), StringComparison.Ordinal);
        var other = await ApproveAsync("TRI-TOP", 1, null, SecondApprover);
        Assert.Equal(HttpStatusCode.OK, other.StatusCode);
        Assert.Equal("test engineer", (await ReadJsonAsync(other)).GetProperty("approved_by").GetString());
    }

    [Fact]
    public async Task DriftingBaseline_IsNotStable_WithItsReasons_AndNeedsAWrittenJustification()
    {
        // 30 wafers whose means climb 0.01 nm a wafer: the trend test sees it and the chart's own rules fire against the
        // limits computed from it (the last wafers lie far above the centre).
        var draft = await DraftAsync("TRI-TOP", [.. Enumerable.Range(0, 30).Select(i => i * 0.01)]);
        Assert.Equal("not stable", draft.GetProperty("verdict").GetString());
        var reasons = draft.GetProperty("check").GetProperty("reasons").EnumerateArray().Select(r => r.GetString()!).ToList();
        Assert.Contains(reasons, r => r.Contains("rising (Mann–Kendall", StringComparison.Ordinal));
        Assert.Contains(reasons, r => r.Contains("break the chart's own rules", StringComparison.Ordinal));
        Assert.Equal("rising", draft.GetProperty("check").GetProperty("trend").GetProperty("direction").GetString());
        Assert.True(draft.GetProperty("check").GetProperty("trend").GetProperty("p_value").GetDouble() < 1e-6);
        Assert.NotEmpty(draft.GetProperty("check").GetProperty("rule_signals").EnumerateArray());

        var bare = await ApproveAsync("TRI-TOP", 1, null, SecondApprover);
        Assert.Equal(HttpStatusCode.BadRequest, bare.StatusCode);
        Assert.True((await ReadJsonAsync(bare)).GetProperty("errors").TryGetProperty("justification", out _));

        const string Why = "chamber seasoning drift accepted for two days while the new liner kit is qualified";
        var approved = await ApproveAsync("TRI-TOP", 1, Why, SecondApprover);
        Assert.Equal(HttpStatusCode.OK, approved.StatusCode);
        Assert.Equal(Why, (await ReadJsonAsync(approved)).GetProperty("justification").GetString());
        var audit = await ReadJsonAsync(await Client.GetAsync("/api/audit?entity=limits"));
        var entry = audit.EnumerateArray().First(e => e.GetProperty("action").GetString() == "approved");
        Assert.Contains(Why, entry.GetProperty("after").GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new[] { "--demo" }, null, false)]
    [InlineData(new[] { "--demo" }, "true", true)]
    [InlineData(new string[0], null, true)]
    public void DemoMode_TurnsTheSecondApproverRuleOff_UnlessSetExplicitly(string[] args, string? explicitSetting, bool expected)
    {
        var builder = WebApplication.CreateBuilder(args);
        if (explicitSetting is not null)
        {
            builder.Configuration["FinWatch:Monitor:ApproverMustDiffer"] = explicitSetting;
        }

        DemoFeature.Add(builder, args);
        Assert.Equal(expected, builder.Configuration.GetValue("FinWatch:Monitor:ApproverMustDiffer", new MonitorOptions().ApproverMustDiffer));
    }
}

/// <summary>With the second-approver setting off, the engineer who computed the draft may approve it.</summary>
public class SameApproverAllowedTests : IntegrationTest
{
    public SameApproverAllowedTests()
    {
        Factory.With("FinWatch:Monitor:ApproverMustDiffer", "false");
    }

    [Fact]
    public async Task WithTheSettingOff_TheSamePersonMayApprove()
    {
        await BaselineCheckTests.BaselineAsync(Client, [.. Enumerable.Range(0, 30).Select(i => i % 2 == 0 ? 0.01 : -0.01)]);
        await CreateContextAsync(Client, "TRI-TOP");
        (await Client.PostAsJsonAsync("/api/contexts/TRI-TOP/limits", new { reason = "baseline" })).EnsureSuccessStatusCode();
        var approved = await Client.PostAsJsonAsync("/api/contexts/TRI-TOP/limits/1/approve", new { comment = "reviewed", effective_from = EffectiveFrom });
        Assert.Equal(HttpStatusCode.OK, approved.StatusCode);
        Assert.Equal("test administrator", (await ReadJsonAsync(approved)).GetProperty("approved_by").GetString());
    }
}
