using System.Net;
using System.Net.Http.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>E-mail through a real SMTP conversation: an SMTP server on a loopback port receives the message, MimeKit reads it.</summary>
public sealed class EmailTests : NotificationTestBase
{
    private SmtpSink smtp = null!;

    protected override Task BeforeStartAsync()
    {
        smtp = new SmtpSink();
        Factory.With("FinWatch:Notify:Smtp:Host", "127.0.0.1").With("FinWatch:Notify:Smtp:Port", smtp.Port.ToString(System.Globalization.CultureInfo.InvariantCulture))
            .With("FinWatch:Notify:Smtp:Security", "none").With("FinWatch:Notify:Smtp:From", "FinWatch <finwatch@fab.example>");
        return Task.CompletedTask;
    }

    protected override async Task AfterStopAsync() => await smtp.DisposeAsync();

    [Fact]
    public async Task RaisedAlert_EmailSaysChartRuleSeverityLotWaferTimeAndEstimate_WithTheLink()
    {
        await AddPersonAsync("ana.sup", "supervisor", "ana@fab.example");
        await ChartAsync();
        await AddRuleAsync(new { channel = "email", min_severity = "low", product = TestProducts.TriGate, owner = "ana.sup" });
        var alert = await RaiseAsync();
        var id = alert.GetProperty("id").GetInt64();

        await EventuallyAsync(async () => (await MessagesAsync()).Single().GetProperty("status").GetString() is "sent" or "failed", "the e-mail is tried", 20);
        Assert.True(!smtp.Messages.IsEmpty, (await MessagesAsync()).Single().ToString());
        var mail = await smtp.NextAsync(TimeSpan.FromSeconds(15));
        Assert.Equal("ana@fab.example", mail.To.Mailboxes.Single().Address);
        Assert.Equal("finwatch@fab.example", mail.From.Mailboxes.Single().Address);
        var severity = alert.GetProperty("severity").GetString();
        var title = alert.GetProperty("context_title").GetString();
        Assert.Equal($"FinWatch alert, {severity}: {title}: one point beyond a 3σ limit (lot M0001, wafer 1)", mail.Subject);
        Assert.Equal($"alert-{id}-raised-rule-1@finwatch", mail.MessageId);
        var body = mail.TextBody;
        Assert.Contains($"Alert {id}, severity {severity}, signalling.", body, StringComparison.Ordinal);
        Assert.Contains($"Chart: {title} (product {TestProducts.TriGate}, step FIN-PROFILE)", body, StringComparison.Ordinal);
        Assert.Contains("Rule: one point beyond a 3σ limit", body, StringComparison.Ordinal);
        Assert.Contains("Lot M0001, wafer 1", body, StringComparison.Ordinal);
        // The wafer's sites were measured 26 Nov 2026 from 06:00:00 to 06:00:04 UTC (the shift pattern's zone is UTC here).
        Assert.Contains("Measured: 26 Nov 2026, 06:00 UTC", body, StringComparison.Ordinal);
        var dvt = alert.GetProperty("predicted_dvt_sat_mv").GetDouble();
        Assert.Contains($"Predicted ΔVT sat: {(dvt < 0 ? "−" : "+")}{Math.Abs(dvt).ToString("0.0", System.Globalization.CultureInfo.InvariantCulture)} mV (engineering estimate, not a measurement)",
            body, StringComparison.Ordinal);
        Assert.Contains("do not use it in place of electrical test", body, StringComparison.Ordinal);
        Assert.Contains($"Open the alert: {PublicUrl}/alerts.html?state=all&alert={id}", body, StringComparison.Ordinal);

        await EventuallyAsync(async () => (await MessagesAsync()).Single().GetProperty("status").GetString() == "sent", "the e-mail is marked sent");
    }

    [Fact]
    public async Task RuleOfSomeoneWithoutAnAddress_IsRefusedOnSave_WithTheReason()
    {
        await AddPersonAsync("bo.tech", "technician");
        var r = await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "email", owner = "bo.tech" });
        Assert.Equal(HttpStatusCode.BadRequest, r.StatusCode);
        var error = (await ReadJsonAsync(r)).GetProperty("errors").GetProperty("channel")[0].GetString();
        Assert.Equal("bo.tech has no e-mail address in FinWatch; an administrator adds it on the people page", error);
    }

    [Fact]
    public void Compose_WritesTheOneTimeFormatInTheShiftZone()
    {
        // 2026-07-01 12:30 UTC is 14:30 in Berlin (CEST, UTC+2: the IANA time-zone database).
        var berlin = TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin");
        Assert.Equal("01 Jul 2026, 14:30 Europe/Berlin", FinWatch.Server.Features.Notify.MailSender.Time(new DateTimeOffset(2026, 7, 1, 12, 30, 0, TimeSpan.Zero), berlin));
    }
}
