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

    /// <summary>An excursion is marked back in control when this many points in a row fire no rule (it stays open until a person closes it).</summary>
    [Range(1, 1000)]
    public int BackInControlAfterPoints { get; set; } = 8;

    /// <summary>Limits are approved by someone other than the person who computed them (off in demo mode).</summary>
    public bool ApproverMustDiffer { get; set; } = true;
}
