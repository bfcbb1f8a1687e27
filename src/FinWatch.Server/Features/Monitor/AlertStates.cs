namespace FinWatch.Server.Features.Monitor;

/// <summary>The states of an alert, in their only order: open → acknowledged → dispositioned → closed.</summary>
public static class AlertStates
{
    public const string Open = "open";
    public const string Acknowledged = "acknowledged";
    public const string Dispositioned = "dispositioned";
    public const string Closed = "closed";

    public static readonly string[] All = [Open, Acknowledged, Dispositioned, Closed];
}

/// <summary>A chart context's state: no approved limits yet, in control, or with an alert not closed.</summary>
public static class ContextStates
{
    public const string Baseline = "baseline";
    public const string InControl = "in_control";
    public const string OutOfControl = "out_of_control";
}
