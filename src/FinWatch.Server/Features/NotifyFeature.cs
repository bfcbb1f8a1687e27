using FinWatch.Data;
using FinWatch.Server.Features.Notify;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features;

/// <summary>
/// Alerts reach people where they are: notification rules per person, the shift roster, e-mail and signed webhooks
/// sent from an outbox written with each alert change, and escalation by shift (the monitor's worker takes the steps).
/// </summary>
public sealed class NotifyFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args)
    {
        var services = builder.Services;
        services.AddOptions<NotifyOptions>().BindConfiguration(NotifyOptions.Section).ValidateOnStart();
        services.AddSingleton<IValidateOptions<NotifyOptions>, NotifyOptionsValidator>();
        // No redirects: a webhook call goes to the configured address and nowhere else.
        services.AddHttpClient(WebhookSender.ClientName).ConfigurePrimaryHttpMessageHandler(() => new SocketsHttpHandler { AllowAutoRedirect = false });
        services.AddSingleton<WebhookSender>();
        services.AddSingleton<MailSender>();
        services.AddSingleton<OutboxSignal>();
        services.AddSingleton<OutboxSender>();
        services.AddHostedService(sp => sp.GetRequiredService<OutboxSender>());
    }

    /// <summary>
    /// Before the server listens: the mail server must answer (unless its check at start is switched off), or the start
    /// stops with the reason; escalation levels naming people FinWatch does not know are logged as errors.
    /// </summary>
    public static async Task<int?> StartAsync(WebApplication app, string[] args)
    {
        var options = app.Services.GetRequiredService<IOptions<NotifyOptions>>().Value;
        await using (var scope = app.Services.CreateAsyncScope())
        {
            var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
            var named = options.Escalation.SelectMany(l => l.People).Distinct().ToList();
            var known = await db.Users.Where(u => named.Contains(u.UserName!)).Select(u => u.UserName!).ToListAsync();
            var unknown = named.Except(known).ToList();
            if (unknown.Count > 0)
            {
                // Not fatal (people are added after the first start); each escalation step to them says so in the alert's history.
                app.Services.GetRequiredService<ILoggerFactory>().CreateLogger<NotifyFeature>().LogError(
                    "{Section}:Escalation names {People}, who are not people in FinWatch; add them (people page or 'admin add') or correct the names",
                    NotifyOptions.Section, string.Join(", ", unknown));
            }
        }

        if (options.Smtp is { Configured: true, CheckAtStart: true })
        {
            try
            {
                using var client = await MailSender.ConnectAsync(options, CancellationToken.None);
                await client.DisconnectAsync(quit: true);
            }
            catch (Exception e) when (e is not OutOfMemoryException)
            {
                throw new InvalidOperationException($"E-mail: the mail server {options.Smtp.Host}:{options.Smtp.Port} ({options.Smtp.Security}) could not be used: " +
                    $"{e.Message}. Correct {NotifyOptions.Section}:Smtp, or set {NotifyOptions.Section}:Smtp:CheckAtStart to false to start without checking it.", e);
            }
        }

        return null;
    }

    public static void Map(IEndpointRouteBuilder endpoints) => NotifyEndpoints.Map(endpoints);
}
