using System.Buffers;
using System.Collections.Concurrent;
using System.Net;
using System.Net.Sockets;
using FinWatch.Server.Features.Notify;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Logging;
using MimeKit;
using SmtpServer;
using SmtpServer.Protocol;
using SmtpServer.Storage;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>An SMTP server on a loopback port (the SmtpServer package), keeping every message it accepts, parsed by MimeKit.</summary>
public sealed class SmtpSink : IAsyncDisposable
{
    private readonly CancellationTokenSource stop = new();
    private readonly Task running;

    public SmtpSink()
    {
        Port = FreePort.Next();
        var options = new SmtpServerOptionsBuilder().ServerName("localhost")
            .Endpoint(b => b.Endpoint(new IPEndPoint(IPAddress.Loopback, Port)).IsSecure(false)).Build();
        var provider = new SmtpServer.ComponentModel.ServiceProvider();
        provider.Add(new Store(Messages));
        running = new SmtpServer.SmtpServer(options, provider).StartAsync(stop.Token);
    }

    public int Port { get; }

    public ConcurrentQueue<MimeMessage> Messages { get; } = new();

    public async Task<MimeMessage> NextAsync(TimeSpan within)
    {
        var until = DateTime.UtcNow + within;
        while (DateTime.UtcNow < until)
        {
            if (Messages.TryDequeue(out var m))
            {
                return m;
            }

            await Task.Delay(50);
        }

        throw new TimeoutException($"no e-mail arrived within {within.TotalSeconds} s");
    }

    public async ValueTask DisposeAsync()
    {
        await stop.CancelAsync();
        try
        {
            await running;
        }
        catch (OperationCanceledException)
        {
        }

        stop.Dispose();
    }

    private sealed class Store(ConcurrentQueue<MimeMessage> messages) : MessageStore
    {
        public override async Task<SmtpResponse> SaveAsync(ISessionContext context, IMessageTransaction transaction, ReadOnlySequence<byte> buffer,
            CancellationToken cancellationToken)
        {
            using var stream = new MemoryStream(buffer.ToArray());
            messages.Enqueue(await MimeMessage.LoadAsync(stream, cancellationToken));
            return SmtpResponse.Ok;
        }
    }
}

/// <summary>One call a <see cref="WebhookReceiver"/> received: its key, whether the signature checked out, the body, and the status it answered.</summary>
public sealed record WebhookCall(string? Key, bool SignatureValid, string Body, int Answered, DateTimeOffset At);

/// <summary>
/// A webhook receiver on a loopback port (Kestrel), verifying each call's signature as a receiver would
/// (<see cref="WebhookSignature.Verify"/>, against its <see cref="Now"/>) and answering with the next scripted status (then 200).
/// </summary>
public sealed class WebhookReceiver : IAsyncDisposable
{
    public const string Secret = "a-test-secret-of-some-length";

    private readonly WebApplication app;
    private readonly ConcurrentQueue<int> script = new();
    private readonly TaskCompletionSource hold = new(TaskCreationOptions.RunContinuationsAsynchronously);

    private WebhookReceiver(bool holdFirst)
    {
        var builder = WebApplication.CreateSlimBuilder();
        builder.Logging.ClearProviders();
        builder.WebHost.UseUrls("http://127.0.0.1:0");
        app = builder.Build();
        var first = holdFirst;
        app.MapPost("/hook", async (HttpContext http) =>
        {
            using var buffer = new MemoryStream();
            await http.Request.Body.CopyToAsync(buffer);
            var body = buffer.ToArray();
            var key = http.Request.Headers[WebhookSignature.IdempotencyKeyHeader].ToString();
            if (Interlocked.Exchange(ref first, false))
            {
                Held.TrySetResult(key);
                await hold.Task; // never answers while the test kills the sender
            }

            var valid = WebhookSignature.Verify(Secret, http.Request.Headers[WebhookSignature.TimestampHeader], http.Request.Headers[WebhookSignature.SignatureHeader],
                body, Now(), TimeSpan.FromMinutes(5));
            var status = script.TryDequeue(out var s) ? s : 200;
            Calls.Enqueue(new WebhookCall(key, valid, System.Text.Encoding.UTF8.GetString(body), status, DateTimeOffset.UtcNow));
            if (status is >= 300 and < 400)
            {
                http.Response.Headers.Location = "/elsewhere"; // a sender must not follow it
            }

            return Results.StatusCode(status);
        });
        app.MapPost("/elsewhere", () =>
        {
            Interlocked.Increment(ref redirected);
            return Results.Ok();
        });
    }

    public static async Task<WebhookReceiver> StartAsync(bool holdFirst = false)
    {
        var r = new WebhookReceiver(holdFirst);
        await r.app.StartAsync();
        r.Url = r.app.Urls.First() + "/hook";
        return r;
    }

    public string Url { get; private set; } = "";

    private int redirected;

    /// <summary>Calls that arrived at the address a redirect pointed to.</summary>
    public int Redirected => Volatile.Read(ref redirected);

    /// <summary>The receiver's clock for the timestamp check (the sending server's fake clock in the in-process tests).</summary>
    public Func<DateTimeOffset> Now { get; set; } = () => DateTimeOffset.UtcNow;

    /// <summary>The statuses of the next calls, in order (after them, 200).</summary>
    public void Answer(params int[] statuses)
    {
        foreach (var s in statuses)
        {
            script.Enqueue(s);
        }
    }

    public ConcurrentQueue<WebhookCall> Calls { get; } = new();

    /// <summary>Completes with the key of the first call when it is held unanswered (<c>holdFirst</c>).</summary>
    public TaskCompletionSource<string> Held { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);

    public async Task<List<WebhookCall>> WaitForAsync(Func<IReadOnlyCollection<WebhookCall>, bool> done, TimeSpan within)
    {
        var until = DateTime.UtcNow + within;
        while (!done(Calls))
        {
            if (DateTime.UtcNow > until)
            {
                throw new TimeoutException($"the webhook receiver has {Calls.Count} call(s) after {within.TotalSeconds} s");
            }

            await Task.Delay(50);
        }

        return [.. Calls];
    }

    public async ValueTask DisposeAsync()
    {
        hold.TrySetResult();
        await app.StopAsync();
        await app.DisposeAsync();
    }
}

public static class FreePort
{
    public static int Next()
    {
        using var l = new TcpListener(IPAddress.Loopback, 0);
        l.Start();
        return ((IPEndPoint)l.LocalEndpoint).Port;
    }
}
