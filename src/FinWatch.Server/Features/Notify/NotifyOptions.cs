using System.Globalization;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Notify;

/// <summary>
/// Notification settings (section "FinWatch:Notify"): the address people open links at, the mail server, the webhooks an
/// administrator allows (rules can only name these: FinWatch posts to no other address), the retry schedule and the
/// escalation levels after the on-shift supervisor.
/// </summary>
public sealed class NotifyOptions
{
    public const string Section = "FinWatch:Notify";

    /// <summary>The address of FinWatch as people open it (links in e-mails and webhooks), for example https://finwatch.fab.example.</summary>
    public string PublicUrl { get; set; } = "http://localhost:5000";

    public SmtpOptions Smtp { get; set; } = new();

    /// <summary>The only addresses FinWatch posts alerts to; rules name them.</summary>
    public List<WebhookOptions> Webhooks { get; set; } = [];

    /// <summary>How often the sender looks for messages that are due, seconds (it also starts at once after each alert change in this instance).</summary>
    public double PollSeconds { get; set; } = 5;

    /// <summary>The wait before the second attempt, seconds; it doubles at each further attempt up to <see cref="MaxRetryDelaySeconds"/>.</summary>
    public double FirstRetryDelaySeconds { get; set; } = 30;

    public double MaxRetryDelaySeconds { get; set; } = 3600;

    /// <summary>Attempts before a message is given up as failed (it can still be sent again by hand).</summary>
    public int MaxAttempts { get; set; } = 8;

    /// <summary>How long a claimed message is left to its sender before another instance may take it, seconds.</summary>
    public double ClaimSeconds { get; set; } = 120;

    /// <summary>A webhook call or an SMTP conversation gives up after this many seconds.</summary>
    public double TimeoutSeconds { get; set; } = 10;

    /// <summary>The levels after the on-shift supervisors (who come first, after the monitor's escalation minutes).</summary>
    public List<EscalationLevelOptions> Escalation { get; set; } = [];

    public TimeSpan RetryDelay(int attempts) =>
        TimeSpan.FromSeconds(Math.Min(MaxRetryDelaySeconds, FirstRetryDelaySeconds * Math.Pow(2, Math.Max(0, attempts - 1))));
}

/// <summary>The mail server. No host: e-mail is not configured, and rules cannot choose it.</summary>
public sealed class SmtpOptions
{
    public string Host { get; set; } = "";
    public int Port { get; set; } = 25;

    /// <summary>"none", "starttls" (upgrade after connecting) or "tls" (TLS from the start, usually port 465).</summary>
    public string Security { get; set; } = "starttls";

    public string User { get; set; } = "";
    public string Password { get; set; } = "";

    /// <summary>The sender address, for example "FinWatch &lt;finwatch@fab.example&gt;".</summary>
    public string From { get; set; } = "";

    /// <summary>Connect to the server when FinWatch starts, and refuse to start when it cannot be reached.</summary>
    public bool CheckAtStart { get; set; } = true;

    public bool Configured => Host.Length > 0;
}

/// <summary>One webhook: a name rules refer to, the address, and the shared secret its receiver checks the signature with.</summary>
public sealed class WebhookOptions
{
    public string Name { get; set; } = "";
    public string Url { get; set; } = "";
    public string Secret { get; set; } = "";
}

/// <summary>An escalation level after the on-shift supervisors: this many minutes after the alert was raised, these people.</summary>
public sealed class EscalationLevelOptions
{
    public int AfterMinutes { get; set; }
    public List<string> People { get; set; } = [];
}

/// <summary>Checks the notification settings at start, each problem with its setting and value.</summary>
public sealed class NotifyOptionsValidator(IOptions<Monitor.MonitorOptions> monitor) : IValidateOptions<NotifyOptions>
{
    public const int MinSecretLength = 16;

    public ValidateOptionsResult Validate(string? name, NotifyOptions o)
    {
        var failures = new List<string>();
        var s = NotifyOptions.Section;
        if (!IsHttpUrl(o.PublicUrl))
        {
            failures.Add($"{s}:PublicUrl '{o.PublicUrl}' is not an http or https address");
        }

        if (o.Smtp.Configured)
        {
            if (o.Smtp.Port is < 1 or > 65535)
            {
                failures.Add($"{s}:Smtp:Port {o.Smtp.Port} is not a port (1 to 65535)");
            }

            if (Array.IndexOf(SmtpSecurity, o.Smtp.Security) < 0)
            {
                failures.Add($"{s}:Smtp:Security '{o.Smtp.Security}' is one of {string.Join(", ", SmtpSecurity)}");
            }

            if (!MimeKit.MailboxAddress.TryParse(o.Smtp.From, out _) || !o.Smtp.From.Contains('@', StringComparison.Ordinal))
            {
                failures.Add($"{s}:Smtp:From '{o.Smtp.From}' is not an e-mail address");
            }
        }

        foreach (var (w, i) in o.Webhooks.Select((w, i) => (w, i)))
        {
            var where = $"{s}:Webhooks:{i}";
            if (string.IsNullOrWhiteSpace(w.Name) || w.Name.Length > 64 || !w.Name.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.'))
            {
                failures.Add($"{where}:Name '{w.Name}' must be 1 to 64 letters, digits, '-', '_' or '.'");
            }

            if (!IsHttpUrl(w.Url))
            {
                failures.Add($"{where}:Url '{w.Url}' is not an http or https address; a webhook is called only at an http(s) address an administrator configures");
            }

            if (w.Secret.Length < MinSecretLength)
            {
                failures.Add($"{where}:Secret is {w.Secret.Length} characters; it must be at least {MinSecretLength} for the signature to mean anything");
            }
        }

        var twice = o.Webhooks.GroupBy(w => w.Name, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1).Select(g => g.Key).ToList();
        if (twice.Count > 0)
        {
            failures.Add($"{s}:Webhooks names a webhook more than once: {string.Join(", ", twice)}");
        }

        Check(o.PollSeconds is >= 0.05 and <= 3600, $"{s}:PollSeconds {F(o.PollSeconds)} is 0.05 to 3600");
        Check(o.FirstRetryDelaySeconds is >= 0.01 and <= 86_400, $"{s}:FirstRetryDelaySeconds {F(o.FirstRetryDelaySeconds)} is 0.01 to 86400");
        Check(o.MaxRetryDelaySeconds >= o.FirstRetryDelaySeconds && o.MaxRetryDelaySeconds <= 86_400,
            $"{s}:MaxRetryDelaySeconds {F(o.MaxRetryDelaySeconds)} is from FirstRetryDelaySeconds to 86400");
        Check(o.MaxAttempts is >= 1 and <= 100, $"{s}:MaxAttempts {o.MaxAttempts} is 1 to 100");
        Check(o.ClaimSeconds >= (2 * o.TimeoutSeconds) + 1, $"{s}:ClaimSeconds {F(o.ClaimSeconds)} must exceed twice TimeoutSeconds, so a slow send is not taken over");
        Check(o.TimeoutSeconds is >= 0.5 and <= 300, $"{s}:TimeoutSeconds {F(o.TimeoutSeconds)} is 0.5 to 300");

        var previous = monitor.Value.EscalateAfterMinutes;
        foreach (var (level, i) in o.Escalation.Select((l, i) => (l, i)))
        {
            var where = $"{s}:Escalation:{i}";
            if (level.AfterMinutes <= previous || level.AfterMinutes > 100_000)
            {
                failures.Add($"{where}:AfterMinutes {level.AfterMinutes} must come after the level before it ({previous} min)");
            }

            if (level.People.Count == 0 || level.People.Any(string.IsNullOrWhiteSpace))
            {
                failures.Add($"{where}:People names nobody; list the user names of this level");
            }

            previous = Math.Max(previous, level.AfterMinutes);
        }

        return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;

        void Check(bool ok, string failure)
        {
            if (!ok)
            {
                failures.Add(failure);
            }
        }
    }

    public static readonly string[] SmtpSecurity = ["none", "starttls", "tls"];

    public static bool IsHttpUrl(string? url) =>
        Uri.TryCreate(url, UriKind.Absolute, out var u) && (u.Scheme == Uri.UriSchemeHttp || u.Scheme == Uri.UriSchemeHttps) && u.Host.Length > 0;

    private static string F(double v) => v.ToString(CultureInfo.InvariantCulture);
}
