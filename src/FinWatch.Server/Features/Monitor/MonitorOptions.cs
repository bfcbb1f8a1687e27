using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Features.Monitor;

/// <summary>Monitor settings (section "FinWatch:Monitor").</summary>
public sealed class MonitorOptions
{
    public const string Section = "FinWatch:Monitor";

    /// <summary>An open alert nobody has acknowledged after this many minutes escalates to the supervisors' view.</summary>
    [Range(1, 10_080)]
    public int EscalateAfterMinutes { get; set; } = 30;

    /// <summary>How often the escalation check runs, seconds.</summary>
    [Range(1, 3600)]
    public int CheckEverySeconds { get; set; } = 30;
}
