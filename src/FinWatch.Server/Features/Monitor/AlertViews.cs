using FinWatch.Data.Entities;
using FinWatch.Statistics.Rules;

namespace FinWatch.Server.Features.Monitor;

public static class AlertViews
{
    public static AlertMessage ToMessage(Alert a, ChartContext context, long firstSeq, long lastSeq)
    {
        static DateTimeOffset? T(long? ms) => ms is { } v ? DateTimeOffset.FromUnixTimeMilliseconds(v) : null;
        var text = RunRules.TryParse(a.Rule, out var r) && r.Count == 1 ? Severity.Describe(r[0]) : a.Rule;
        return new AlertMessage(a.Id, context.Code, context.Title, a.Rule, text, a.State, a.Severity, a.SeverityRank,
            DateTimeOffset.FromUnixTimeMilliseconds(a.RaisedAtMs), DateTimeOffset.FromUnixTimeMilliseconds(a.UpdatedAtMs), a.EscalatedAtMs is not null,
            a.PointCount, firstSeq, lastSeq, a.LotId, a.WaferSlot, a.Chamber, a.PredictedDvtSatMv, a.AcknowledgedBy, T(a.AcknowledgedAtMs),
            a.ClosedBy, T(a.ClosedAtMs));
    }
}
