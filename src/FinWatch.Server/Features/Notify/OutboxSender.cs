using System.Diagnostics;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Notify;

/// <summary>Wakes the <see cref="OutboxSender"/> after a commit that wrote to the outbox in this instance.</summary>
public sealed class OutboxSignal : IDisposable
{
    private readonly SemaphoreSlim signal = new(0, 1);

    public void Nudge()
    {
        try
        {
            signal.Release();
        }
        catch (SemaphoreFullException)
        {
            // already nudged
        }
    }

    public Task<bool> WaitAsync(TimeSpan timeout, CancellationToken cancellationToken) => signal.WaitAsync(timeout, cancellationToken);

    public void Dispose() => signal.Dispose();
}

/// <summary>
/// Sends the outbox, at least once per message. A batch of due messages is claimed in one transaction under the
/// monitor lock (<see cref="IDatabaseDialect.LockMonitorAsync"/>), so with several instances on one database each
/// message is claimed by one of them; the claim lapses after <see cref="NotifyOptions.ClaimSeconds"/>, so a message whose
/// sender died (after the claim, before or after the send) is sent again by whoever looks next: receivers drop the
/// repeat by its idempotency key. Each attempt is logged; a failure waits with exponential backoff, and after
/// <see cref="NotifyOptions.MaxAttempts"/> the message is marked failed for a person to send again.
/// </summary>
public sealed partial class OutboxSender(IServiceScopeFactory scopes, IOptions<NotifyOptions> options, TimeProvider clock, OutboxSignal signal,
    WebhookSender webhooks, MailSender mail, ILogger<OutboxSender> logger) : BackgroundService
{
    /// <summary>Messages claimed at a time.</summary>
    private const int Batch = 20;

    private readonly SemaphoreSlim one = new(1, 1);

    /// <summary>This instance, as claims and delivery logs name it.</summary>
    public string Instance { get; } = $"{Environment.MachineName}/{Environment.ProcessId}/{Guid.NewGuid().ToString("N")[..6]}";

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                while (await SendDueAsync(stoppingToken) > 0)
                {
                }
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                LogSendLoopFailed(e);
            }

            // Polled on the real clock: the due times themselves are read from the (possibly fake) TimeProvider.
            await signal.WaitAsync(TimeSpan.FromSeconds(options.Value.PollSeconds), stoppingToken);
        }
    }

    public override void Dispose()
    {
        one.Dispose();
        base.Dispose();
    }

    /// <summary>Claims the due messages, sends them and records each attempt; returns how many were attempted.</summary>
    public async Task<int> SendDueAsync(CancellationToken cancellationToken)
    {
        await one.WaitAsync(cancellationToken);
        try
        {
            var claimed = await ClaimAsync(cancellationToken);
            await Task.WhenAll(claimed.Select(m => SendOneAsync(m, cancellationToken)));
            return claimed.Count;
        }
        finally
        {
            one.Release();
        }
    }

    private async Task<List<OutboxMessage>> ClaimAsync(CancellationToken cancellationToken)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var due = db.Outbox.Where(m => (m.Status == OutboxStates.Waiting && m.NextAttemptAtMs <= now) || (m.Status == OutboxStates.Sending && m.ClaimedUntilMs < now));
        if (!await due.AnyAsync(cancellationToken))
        {
            return [];
        }

        await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
        await scope.ServiceProvider.GetRequiredService<IDatabaseDialect>().LockMonitorAsync(db, cancellationToken);
        var messages = await due.OrderBy(m => m.Id).Take(Batch).ToListAsync(cancellationToken); // read again under the lock
        foreach (var m in messages)
        {
            m.Status = OutboxStates.Sending;
            m.ClaimedBy = Instance;
            m.ClaimedUntilMs = now + (long)(options.Value.ClaimSeconds * 1000);
            m.Attempts++;
        }

        await db.SaveChangesAsync(cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        return messages;
    }

    private async Task SendOneAsync(OutboxMessage m, CancellationToken cancellationToken)
    {
        var started = Stopwatch.GetTimestamp();
        SendOutcome outcome;
        try
        {
            outcome = m.Channel switch
            {
                NotificationChannels.Webhook => await webhooks.SendAsync(m, cancellationToken),
                NotificationChannels.Email => await mail.SendAsync(m, cancellationToken),
                _ => SendOutcome.GiveUp($"'{m.Channel}' is not a channel the outbox sends"),
            };
        }
        catch (Exception e) when (e is not OperationCanceledException || !cancellationToken.IsCancellationRequested)
        {
            outcome = SendOutcome.Retry($"sending failed: {e.Message}");
        }

        await RecordAsync(m, outcome, (int)Stopwatch.GetElapsedTime(started).TotalMilliseconds, cancellationToken);
    }

    private async Task RecordAsync(OutboxMessage claimed, SendOutcome outcome, int durationMs, CancellationToken cancellationToken)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var m = await db.Outbox.SingleAsync(x => x.Id == claimed.Id, cancellationToken);
        db.DeliveryAttempts.Add(new DeliveryAttempt
        {
            MessageId = m.Id, AlertId = m.AlertId, Attempt = claimed.Attempts, AtMs = now, DurationMs = durationMs,
            Outcome = outcome.Sent ? "sent" : "error", Detail = Trim(outcome.Detail), By = Instance,
        });
        if (m.ClaimedBy == Instance && m.Status == OutboxStates.Sending)
        {
            m.ClaimedBy = null;
            m.ClaimedUntilMs = null;
            if (outcome.Sent)
            {
                m.Status = OutboxStates.Sent;
                m.SentAtMs = now;
                m.LastError = null;
            }
            else if (outcome.Permanent || m.Attempts >= options.Value.MaxAttempts)
            {
                m.Status = OutboxStates.Failed;
                m.LastError = Trim(outcome.Detail);
                LogGaveUp(m.Key, m.Attempts, outcome.Detail);
            }
            else
            {
                m.Status = OutboxStates.Waiting;
                m.NextAttemptAtMs = now + (long)options.Value.RetryDelay(m.Attempts).TotalMilliseconds;
                m.LastError = Trim(outcome.Detail);
            }
        }

        await db.SaveChangesAsync(cancellationToken);
    }

    private static string Trim(string s) => s.Length <= 2000 ? s : s[..2000];

    [LoggerMessage(Level = LogLevel.Error, Message = "Notifications: the send loop failed; it tries again at the next poll")]
    private partial void LogSendLoopFailed(Exception e);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Notification {Key} failed after {Attempts} attempt(s): {Detail}")]
    private partial void LogGaveUp(string key, int attempts, string detail);
}
