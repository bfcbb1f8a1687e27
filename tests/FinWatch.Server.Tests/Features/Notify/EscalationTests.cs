using System.Globalization;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Server.Features.Monitor;
using FinWatch.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>
/// Escalation by shift on the fake clock (it starts at 2026-12-01 08:00 UTC, in the default pattern's early shift
/// 06:00–14:00 UTC): after 30 min (the monitor's setting) to the roster's supervisors on shift, after 60 min to the
/// configured next level, each step on the channels of those people's rules and in the alert's history. The monitor's
/// own timer runs on the fake clock, so advancing the clock is what takes a step.
/// </summary>
public sealed class EscalationTests : NotificationTestBase
{
    private SmtpSink smtp = null!;

    protected override Task BeforeStartAsync()
    {
        smtp = new SmtpSink();
        Factory.With("FinWatch:Notify:Smtp:Host", "127.0.0.1").With("FinWatch:Notify:Smtp:Port", smtp.Port.ToString(CultureInfo.InvariantCulture))
            .With("FinWatch:Notify:Smtp:Security", "none").With("FinWatch:Notify:Smtp:From", "finwatch@fab.example")
            .With("FinWatch:Notify:Escalation:0:AfterMinutes", "60").With("FinWatch:Notify:Escalation:0:People:0", "eng.kim")
            .With("FinWatch:Notify:Escalation:0:People:1", "nobody.here");
        return Task.CompletedTask;
    }

    protected override async Task AfterStopAsync() => await smtp.DisposeAsync();

    /// <summary>Advances the fake clock; the worker's timer takes whatever step is due. Waits until the alert has <paramref name="steps"/> escalation steps.</summary>
    private async Task<JsonElement> AdvanceAsync(TimeSpan by, long id, int steps)
    {
        Factory.Clock.Advance(by);
        await EventuallyAsync(async () => Escalations(await AlertAsync(id)).Count >= steps, $"{steps} escalation step(s)");
        await Task.Delay(300); // and no more than that: a step taken too early or twice would show here
        var alert = await AlertAsync(id);
        Assert.Equal(steps, Escalations(alert).Count);
        return alert;
    }

    [Fact]
    public async Task UnacknowledgedAlert_GoesToTheOnShiftSupervisor_ThenTheNextLevel_OnTheirChannels_InTheHistory()
    {
        await AddPersonAsync("ana.sup", "supervisor", "ana@fab.example");
        await AddPersonAsync("tom.tech", "technician", "tom@fab.example");
        await AddPersonAsync("cy.sup", "supervisor", "cy@fab.example");
        await AddPersonAsync("eng.kim", "engineer", "kim@fab.example");
        (await Client.PutAsJsonAsync("/api/roster", new
        {
            entries = new[]
            {
                new { shift = "early", person = "ana.sup", from = "2026-11-01", to = (string?)null },
                new { shift = "early", person = "tom.tech", from = "2026-11-01", to = (string?)null },
                new { shift = "late", person = "cy.sup", from = "2026-11-01", to = (string?)null },
            },
        })).EnsureSuccessStatusCode();
        // Ana's rules take the other product only: the raise does not reach her, the escalation does (on both channels).
        await AddRuleAsync(new { channel = "email", min_severity = "low", product = TestProducts.DoubleGate, owner = "ana.sup" });
        await AddRuleAsync(new { channel = "browser", min_severity = "critical", owner = "ana.sup" });
        await AddRuleAsync(new { channel = "email", min_severity = "critical", product = TestProducts.DoubleGate, owner = "eng.kim" });
        await ChartAsync();
        var id = (await RaiseAsync()).GetProperty("id").GetInt64();
        Assert.Empty(await MessagesAsync());

        await AdvanceAsync(TimeSpan.FromMinutes(29), id, 0);
        var alert = await AdvanceAsync(TimeSpan.FromMinutes(2), id, 1); // 31 min after the raise
        Assert.Equal(1, alert.GetProperty("alert").GetProperty("escalation_level").GetInt32());
        Assert.Equal(["ana.sup"], alert.GetProperty("alert").GetProperty("escalated_to").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal("level 1, not acknowledged within 30 min: escalated to the supervisors on the early shift of 2026-12-01: ana.sup (ana.sup: e-mail, browser)",
            Escalations(alert).Single());
        var first = await smtp.NextAsync(TimeSpan.FromSeconds(15));
        Assert.Equal("ana@fab.example", first.To.Mailboxes.Single().Address);
        Assert.StartsWith("FinWatch escalated alert, ", first.Subject, StringComparison.Ordinal);
        Assert.Contains("Escalation level 1 to ana.sup: not acknowledged within 30 min.", first.TextBody, StringComparison.Ordinal);
        Assert.Equal($"alert-{id}-escalated-1-ana.sup-email@finwatch", first.MessageId);

        await AdvanceAsync(TimeSpan.FromMinutes(20), id, 1); // 51 min: the next level is not due before 60 min
        alert = await AdvanceAsync(TimeSpan.FromMinutes(10), id, 2); // 61 min
        Assert.Equal(2, alert.GetProperty("alert").GetProperty("escalation_level").GetInt32());
        Assert.Equal("level 2, not acknowledged within 60 min: escalated to level 2: eng.kim, nobody.here " +
            "(nobody.here: not an enabled person in FinWatch, not reached) (eng.kim: e-mail)", Escalations(alert)[1]);
        var second = await smtp.NextAsync(TimeSpan.FromSeconds(15));
        Assert.Equal("kim@fab.example", second.To.Mailboxes.Single().Address);

        await AdvanceAsync(TimeSpan.FromHours(5), id, 2); // no level left
        Assert.Equal(0, await Factory.Services.GetRequiredService<MonitorWorker>().EscalateAsync(CancellationToken.None));
    }

    [Fact]
    public async Task NobodyOnTheRoster_TheStepSaysSo_AndAnAcknowledgedAlertIsNotEscalated()
    {
        await ChartAsync();
        var id = (await RaiseAsync()).GetProperty("id").GetInt64();
        var alert = await AdvanceAsync(TimeSpan.FromMinutes(31), id, 1);
        Assert.Equal("level 1, not acknowledged within 30 min: escalated to the supervisors on the early shift of 2026-12-01, but the roster names none " +
            "(shown on the alert queue only)", Escalations(alert).Single());

        (await Client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment = "looking" })).EnsureSuccessStatusCode();
        await AdvanceAsync(TimeSpan.FromMinutes(30), id, 1); // acknowledged: level 2 (60 min) is not taken
    }

    private async Task<JsonElement> AlertAsync(long id) => await Client.GetFromJsonAsync<JsonElement>($"/api/alerts/{id}");

    private static List<string> Escalations(JsonElement detail) =>
        [.. detail.GetProperty("history").EnumerateArray().Where(e => e.GetProperty("kind").GetString() == "escalated").Select(e => e.GetProperty("comment").GetString()!)];
}
