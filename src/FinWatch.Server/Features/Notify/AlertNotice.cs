using FinWatch.Data.Entities;
using FinWatch.Server.Features.Monitor;

namespace FinWatch.Server.Features.Notify;

/// <summary>
/// The body of a webhook call (JSON, snake_case) and what an e-mail is written from: the idempotency key, what happened
/// ("raised" or "escalated"), why this receiver gets it, the alert's summary and, for an escalation, its level and people.
/// </summary>
public sealed record AlertNotice(string IdempotencyKey, string Event, string SentFor, AlertNoticeAlert Alert, AlertNoticeEscalation? Escalation);

/// <summary>
/// The alert as a notification tells it: chart, product, step, rule(s), severity, state, the last signal's lot, wafer,
/// chamber and measured time, the predicted ΔVT sat in mV with the words saying it is an engineering estimate, and the
/// address of the alert's page.
/// </summary>
public sealed record AlertNoticeAlert(
    long Id, string Url, string Chart, string ChartTitle, string Product, string Step, string Rule, string RuleText, IReadOnlyList<string> RuleTexts,
    string Severity, string State, string Condition, string LotId, int? WaferSlot, string? Chamber,
    DateTimeOffset RaisedAt, DateTimeOffset FirstSignalMeasuredAt, DateTimeOffset LastSignalMeasuredAt, int SignalCount,
    double? PredictedDvtSatMv, string PredictedDvtNote);

/// <summary>An escalation step: its level (1 the on-shift supervisors), whom it goes to, and why.</summary>
public sealed record AlertNoticeEscalation(int Level, IReadOnlyList<string> To, string Reason);

public static class AlertNotices
{
    public const string Raised = "raised";
    public const string Escalated = "escalated";

    public static AlertNoticeAlert Describe(Alert a, ChartContext context, string productCode, string publicUrl)
    {
        var m = AlertViews.ToMessage(a, context);
        return new AlertNoticeAlert(a.Id, AlertUrl(publicUrl, a.Id), context.Code, context.Title, productCode, context.Step, m.Rule, m.RuleText, m.RuleTexts,
            m.Severity, m.State, m.Condition, m.LotId, m.WaferSlot, m.Chamber, m.RaisedAt, m.FirstSignalMeasuredAt, m.LastSignalMeasuredAt, m.SignalCount,
            m.PredictedDvtSatMv, Model.EvaluateModel.PredictionCaution);
    }

    public static string AlertUrl(string publicUrl, long id) => $"{publicUrl.TrimEnd('/')}/alerts.html?state=all&alert={id}";
}
