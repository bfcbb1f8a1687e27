using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Reports;
using MailKit.Net.Smtp;
using MailKit.Security;
using Microsoft.Extensions.Options;
using MimeKit;

namespace FinWatch.Server.Features.Notify;

/// <summary>The outcome of one attempt: sent, or not and whether another attempt can help; the receiver's answer in words.</summary>
public sealed record SendOutcome(bool Sent, bool Permanent, string Detail)
{
    public static SendOutcome Ok(string detail) => new(true, false, detail);

    public static SendOutcome Retry(string detail) => new(false, false, detail);

    public static SendOutcome GiveUp(string detail) => new(false, true, detail);
}

/// <summary>Posts a notice to a configured webhook, signed (<see cref="WebhookSignature"/>); only the configured addresses are ever called.</summary>
public sealed class WebhookSender(IHttpClientFactory clients, IOptions<NotifyOptions> options, TimeProvider clock)
{
    public const string ClientName = "finwatch-webhooks";

    public async Task<SendOutcome> SendAsync(OutboxMessage message, CancellationToken cancellationToken)
    {
        var hook = options.Value.Webhooks.FirstOrDefault(w => string.Equals(w.Name, message.Target, StringComparison.OrdinalIgnoreCase));
        if (hook is null)
        {
            return SendOutcome.GiveUp($"the webhook '{message.Target}' is no longer in the configuration");
        }

        var body = Encoding.UTF8.GetBytes(message.Payload);
        var timestamp = clock.GetUtcNow().ToUnixTimeSeconds();
        using var request = new HttpRequestMessage(HttpMethod.Post, hook.Url) { Content = new ByteArrayContent(body) };
        request.Content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("application/json") { CharSet = "utf-8" };
        request.Headers.Add(WebhookSignature.IdempotencyKeyHeader, message.Key);
        request.Headers.Add(WebhookSignature.TimestampHeader, timestamp.ToString(CultureInfo.InvariantCulture));
        request.Headers.Add(WebhookSignature.SignatureHeader, WebhookSignature.Sign(hook.Secret, timestamp, body));
        using var timeout = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        timeout.CancelAfter(TimeSpan.FromSeconds(options.Value.TimeoutSeconds));
        try
        {
            using var response = await clients.CreateClient(ClientName).SendAsync(request, timeout.Token);
            var status = $"{(int)response.StatusCode} {response.ReasonPhrase}".TrimEnd();
            if (response.IsSuccessStatusCode)
            {
                return SendOutcome.Ok($"{hook.Name} answered {status}");
            }

            // The receiver is busy or failing: try again later. Any other refusal will not change by repeating it.
            var again = response.StatusCode is HttpStatusCode.RequestTimeout or HttpStatusCode.TooManyRequests || (int)response.StatusCode >= 500;
            return again ? SendOutcome.Retry($"{hook.Name} answered {status}") : SendOutcome.GiveUp($"{hook.Name} refused the call: {status}; not tried again");
        }
        catch (OperationCanceledException) when (!cancellationToken.IsCancellationRequested)
        {
            return SendOutcome.Retry($"{hook.Name} did not answer within {options.Value.TimeoutSeconds.ToString(CultureInfo.InvariantCulture)} s");
        }
        catch (HttpRequestException e)
        {
            return SendOutcome.Retry($"{hook.Name} could not be reached: {e.Message}");
        }
    }
}

/// <summary>Writes and sends the e-mail of a notice through the configured SMTP server.</summary>
public sealed class MailSender(IOptions<NotifyOptions> options, IOptions<ShiftOptions> shifts)
{
    public async Task<SendOutcome> SendAsync(OutboxMessage message, CancellationToken cancellationToken)
    {
        var smtp = options.Value.Smtp;
        if (!smtp.Configured)
        {
            return SendOutcome.GiveUp("e-mail is not configured on this FinWatch");
        }

        var notice = JsonSerializer.Deserialize<AlertNotice>(message.Payload, FeedLog.Json)!;
        var mail = Compose(notice, smtp.From, message.Target, message.Key, ShiftCalendar.TryZone(shifts.Value.TimeZone, out var z) ? z : TimeZoneInfo.Utc);
        try
        {
            using var client = await ConnectAsync(options.Value, cancellationToken);
            var reply = await client.SendAsync(mail, cancellationToken);
            await client.DisconnectAsync(quit: true, cancellationToken);
            return SendOutcome.Ok($"mail server accepted it: {reply}".Trim());
        }
        catch (SmtpCommandException e)
        {
            // 5xx is a refusal (no such mailbox, message refused); 4xx is a temporary condition.
            var detail = $"mail server answered {(int)e.StatusCode}: {e.Message}";
            return (int)e.StatusCode >= 500 ? SendOutcome.GiveUp(detail + "; not tried again") : SendOutcome.Retry(detail);
        }
        catch (Exception e) when (e is IOException or System.Net.Sockets.SocketException or SmtpProtocolException or AuthenticationException
            or SslHandshakeException or OperationCanceledException && !cancellationToken.IsCancellationRequested)
        {
            return SendOutcome.Retry($"mail server {smtp.Host}:{smtp.Port} could not be used: {e.Message}");
        }
    }

    /// <summary>Connects (and signs in when a user is configured), within the configured time.</summary>
    public static async Task<SmtpClient> ConnectAsync(NotifyOptions options, CancellationToken cancellationToken)
    {
        var smtp = options.Smtp;
        var client = new SmtpClient { Timeout = (int)(options.TimeoutSeconds * 1000) };
        try
        {
            using var timeout = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
            timeout.CancelAfter(TimeSpan.FromSeconds(options.TimeoutSeconds));
            var security = smtp.Security switch
            {
                "none" => SecureSocketOptions.None,
                "tls" => SecureSocketOptions.SslOnConnect,
                _ => SecureSocketOptions.StartTls,
            };
            await client.ConnectAsync(smtp.Host, smtp.Port, security, timeout.Token);
            if (smtp.User.Length > 0)
            {
                await client.AuthenticateAsync(smtp.User, smtp.Password, timeout.Token);
            }

            return client;
        }
        catch
        {
            client.Dispose();
            throw;
        }
    }

    /// <summary>
    /// The e-mail of a notice. The subject leads with the severity, the chart and the rule; the body gives the lot
    /// and wafer, the measured time in the shift pattern's zone, the predicted ΔVT marked as an estimate, and the link.
    /// The message id is made from the idempotency key, so a repeat is recognisable.
    /// </summary>
    public static MimeMessage Compose(AlertNotice notice, string from, string to, string key, TimeZoneInfo zone)
    {
        var a = notice.Alert;
        var wafer = a.WaferSlot is { } w ? $", wafer {w}" : "";
        var what = notice.Event == AlertNotices.Escalated ? "Escalated alert" : "Alert";
        var mail = new MimeMessage { Subject = $"FinWatch {what.ToLowerInvariant()}, {a.Severity}: {a.ChartTitle}: {a.RuleText} (lot {a.LotId}{wafer})" };
        mail.From.Add(MailboxAddress.Parse(from));
        mail.To.Add(MailboxAddress.Parse(to));
        mail.MessageId = $"{key}@finwatch";
        var text = new StringBuilder();
        text.AppendLine(CultureInfo.InvariantCulture, $"{what} {a.Id}, severity {a.Severity}, {a.Condition}.");
        if (notice.Escalation is { } e)
        {
            text.AppendLine(CultureInfo.InvariantCulture, $"Escalation level {e.Level} to {string.Join(", ", e.To)}: {e.Reason}.");
        }

        text.AppendLine();
        text.AppendLine(CultureInfo.InvariantCulture, $"Chart: {a.ChartTitle} (product {a.Product}, step {a.Step})");
        text.AppendLine(CultureInfo.InvariantCulture, $"Rule: {a.RuleText}");
        if (a.RuleTexts.Count > 1)
        {
            text.AppendLine(CultureInfo.InvariantCulture, $"All rules that fired: {string.Join("; ", a.RuleTexts)}");
        }

        text.AppendLine(CultureInfo.InvariantCulture, $"Lot {a.LotId}{wafer}{(a.Chamber is { } c ? $", chamber {c}" : "")}");
        text.AppendLine(CultureInfo.InvariantCulture, $"Measured: {Time(a.LastSignalMeasuredAt, zone)} (last signal; first signal {Time(a.FirstSignalMeasuredAt, zone)}; {a.SignalCount} signal point(s))");
        text.AppendLine(CultureInfo.InvariantCulture, $"Raised: {Time(a.RaisedAt, zone)}");
        text.AppendLine(a.PredictedDvtSatMv is { } dvt
            ? $"Predicted ΔVT sat: {Signed(dvt)} mV (engineering estimate, not a measurement)"
            : "Predicted ΔVT sat: not predicted for these points");
        text.AppendLine();
        text.AppendLine(CultureInfo.InvariantCulture, $"Open the alert: {a.Url}");
        text.AppendLine();
        text.AppendLine(a.PredictedDvtNote);
        text.AppendLine(CultureInfo.InvariantCulture, $"Sent for {notice.SentFor}. Idempotency key: {notice.IdempotencyKey}");
        mail.Body = new TextPart("plain") { Text = text.ToString() };
        return mail;
    }

    /// <summary>The one date-time format of the pages (05 Dec 2026, 14:30), here in the shift pattern's zone, named.</summary>
    public static string Time(DateTimeOffset t, TimeZoneInfo zone) =>
        TimeZoneInfo.ConvertTime(t, zone).ToString("dd MMM yyyy, HH:mm", CultureInfo.InvariantCulture) + " " + zone.Id;

    private static string Signed(double mv) => (mv < 0 ? "−" : "+") + Math.Abs(mv).ToString("0.0", CultureInfo.InvariantCulture);
}
