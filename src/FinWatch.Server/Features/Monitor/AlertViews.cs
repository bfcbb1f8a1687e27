using FinWatch.Data.Entities;
using FinWatch.Statistics.Rules;

namespace FinWatch.Server.Features.Monitor;

public static class AlertViews
{
    public const string Signalling = "signalling";
    public const string BackInControl = "back in control";

    public static AlertMessage ToMessage(Alert a, ChartContext context)
    {
        static DateTimeOffset? T(long? ms) => ms is { } v ? DateTimeOffset.FromUnixTimeMilliseconds(v) : null;
        var rules = a.Rules.Split(',', StringSplitOptions.RemoveEmptyEntries);
        return new AlertMessage(a.Id, context.Code, context.Title, a.Rule, Text(a.Rule), rules, [.. rules.Select(Text)], a.State,
            a.BackInControlAtMs is null ? Signalling : BackInControl, a.Severity, a.SeverityRank,
            DateTimeOffset.FromUnixTimeMilliseconds(a.RaisedAtMs), DateTimeOffset.FromUnixTimeMilliseconds(a.UpdatedAtMs), a.EscalatedAtMs is not null,
            DateTimeOffset.FromUnixTimeMilliseconds(a.FirstSignalAtMs), DateTimeOffset.FromUnixTimeMilliseconds(a.LastSignalAtMs), T(a.BackInControlAtMs),
            a.PointCount, a.SignalCount, a.LotCount, a.WaferCount, a.FirstSeq, a.LastSeq, a.LotId, a.WaferSlot, a.Chamber, a.PredictedDvtSatMv,
            a.AcknowledgedBy, T(a.AcknowledgedAtMs), a.ClosedBy, T(a.ClosedAtMs), a.EscalationLevel,
            a.EscalatedTo is { Length: > 0 } to ? to.Split(',') : []);
    }

    /// <summary>A rule id in words.</summary>
    public static string Text(string ruleId) => RunRules.TryParse(ruleId, out var r) && r.Count == 1 ? Severity.Describe(r[0]) : ruleId;
}
