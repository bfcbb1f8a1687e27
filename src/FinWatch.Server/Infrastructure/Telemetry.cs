using System.Diagnostics;
using System.Diagnostics.Metrics;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// FinWatch's own instruments: one meter and one activity source, both named <see cref="Name"/>. Everything is
/// counted per batch, per evaluation or per push, never per row, so the ingest loop does not pay for it. Without a
/// listener (no exporter configured, <see cref="TelemetryExtensions"/>) an instrument call is a check of a flag and
/// <see cref="Source"/> starts no activity.
/// </summary>
public sealed class Telemetry
{
    public const string Name = "FinWatch";

    public const string SourceTag = "finwatch.ingest.source";
    public const string ResultTag = "finwatch.ingest.result";
    public const string SeverityTag = "finwatch.alert.severity";
    public const string RuleTag = "finwatch.alert.rule";
    public const string GroupTag = "finwatch.push.group";

    /// <summary>Spans of FinWatch's own work: a batch's ingest and a monitor evaluation.</summary>
    public static readonly ActivitySource Source = new(Name, typeof(Telemetry).Assembly.GetName().Version?.ToString());

    // Seconds: a small JSON batch takes milliseconds, a million-row file a minute or more.
    private static readonly IReadOnlyList<double> DurationBuckets = [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30, 60, 120, 300, 600];

    private readonly Counter<long> rows;
    private readonly Counter<long> batches;
    private readonly Counter<long> rowErrors;
    private readonly Histogram<double> batchDuration;
    private readonly Counter<long> points;
    private readonly Histogram<double> evaluationDuration;
    private readonly Counter<long> alertsRaised;
    private readonly Counter<long> alertsEscalated;
    private readonly Counter<long> pushFrames;
    private readonly UpDownCounter<long> screens;

    public Telemetry(IMeterFactory meters)
    {
        var meter = meters.Create(new MeterOptions(Name) { Version = typeof(Telemetry).Assembly.GetName().Version?.ToString() });
        var seconds = new InstrumentAdvice<double> { HistogramBucketBoundaries = DurationBuckets };
        rows = meter.CreateCounter<long>("finwatch.ingest.rows", "{row}",
            "Site rows of accepted batches: inserted, or already present from an earlier batch");
        batches = meter.CreateCounter<long>("finwatch.ingest.batches", "{batch}",
            "Ingest batches by source and result: stored, rejected (nothing stored) or failed (an error or a dropped request)");
        rowErrors = meter.CreateCounter<long>("finwatch.ingest.row_errors", "{error}",
            "Problems found in rejected batches (a bad cell, a row twice, an unreadable file)");
        batchDuration = meter.CreateHistogram("finwatch.ingest.batch.duration", "s",
            "Time from a batch's arrival to its answer, the monitor evaluation of a stored batch included", advice: seconds);
        points = meter.CreateCounter<long>("finwatch.monitor.points", "{point}",
            "Chart points evaluated (judged against their limits and run rules) and committed");
        evaluationDuration = meter.CreateHistogram("finwatch.monitor.evaluation.duration", "s",
            "Time of one monitor evaluation over every chart context with batches pending", advice: seconds);
        alertsRaised = meter.CreateCounter<long>("finwatch.monitor.alerts.raised", "{alert}",
            "Alerts raised (a new signal of a rule with no open alert in its context), by severity and rule");
        alertsEscalated = meter.CreateCounter<long>("finwatch.monitor.alerts.escalated", "{alert}",
            "Open alerts escalated to the supervisors because nobody acknowledged them in time");
        pushFrames = meter.CreateCounter<long>("finwatch.monitor.push.frames", "{frame}",
            "Live-feed frames pushed to a group of screens (everything, or one chart context), and frames that failed");
        screens = meter.CreateUpDownCounter<long>("finwatch.monitor.screens", "{connection}",
            "Screens connected to the live monitor on this server instance");
    }

    /// <summary>Starts measuring one ingest batch; dispose it when the batch is over.</summary>
    public IngestBatchTelemetry StartBatch(string source) => new(this, source);

    /// <summary>Starts measuring one monitor evaluation; dispose it when the evaluation is over.</summary>
    public MonitorEvaluationTelemetry StartEvaluation() => new(this);

    /// <summary>
    /// An upload refused before a row was read (its form holds no readable file): a rejected batch with one problem,
    /// left out of the duration, which times batches that were read.
    /// </summary>
    public void BatchRefused(string source)
    {
        rowErrors.Add(1, new KeyValuePair<string, object?>(SourceTag, source));
        batches.Add(1, new KeyValuePair<string, object?>(SourceTag, source), new KeyValuePair<string, object?>(ResultTag, "rejected"));
    }

    public void AlertsEscalated(int count) => alertsEscalated.Add(count);

    public void FramePushed(string group, bool sent) =>
        pushFrames.Add(1, new KeyValuePair<string, object?>(GroupTag, group), new KeyValuePair<string, object?>("finwatch.push.result", sent ? "sent" : "failed"));

    public void ScreenConnected() => screens.Add(1);

    public void ScreenDisconnected() => screens.Add(-1);

    internal void RecordStored(string source, int inserted, int alreadyPresent, double seconds)
    {
        var from = new KeyValuePair<string, object?>(SourceTag, source);
        rows.Add(inserted, from, new KeyValuePair<string, object?>(ResultTag, "inserted"));
        rows.Add(alreadyPresent, from, new KeyValuePair<string, object?>(ResultTag, "already_present"));
        RecordBatch(source, "stored", seconds);
    }

    internal void RecordRejected(string source, int errorCount, double seconds)
    {
        rowErrors.Add(errorCount, new KeyValuePair<string, object?>(SourceTag, source));
        RecordBatch(source, "rejected", seconds);
    }

    internal void RecordBatch(string source, string result, double seconds)
    {
        var from = new KeyValuePair<string, object?>(SourceTag, source);
        var outcome = new KeyValuePair<string, object?>(ResultTag, result);
        batches.Add(1, from, outcome);
        batchDuration.Record(seconds, from, outcome);
    }

    internal void RecordCommitted(int pointCount, IReadOnlyList<(string Severity, string Rule)> raised)
    {
        foreach (var (severity, rule) in raised)
        {
            alertsRaised.Add(1, new KeyValuePair<string, object?>(SeverityTag, severity), new KeyValuePair<string, object?>(RuleTag, rule));
        }

        points.Add(pointCount);
    }

    internal void RecordEvaluation(bool completed, double seconds) =>
        evaluationDuration.Record(seconds, new KeyValuePair<string, object?>("finwatch.monitor.result", completed ? "evaluated" : "failed"));
}

/// <summary>One ingest batch being measured: its span and, when it ends, its counts and duration.</summary>
public sealed class IngestBatchTelemetry : IDisposable
{
    private readonly Telemetry telemetry;
    private readonly string source;
    private readonly long started = Stopwatch.GetTimestamp();
    private readonly Activity? activity;
    private bool answered;

    internal IngestBatchTelemetry(Telemetry telemetry, string source)
    {
        this.telemetry = telemetry;
        this.source = source;
        activity = Telemetry.Source.StartActivity("finwatch.ingest.batch");
        activity?.SetTag(Telemetry.SourceTag, source);
    }

    public void Stored(long batchId, int rowsRead, int inserted, int alreadyPresent)
    {
        answered = true;
        telemetry.RecordStored(source, inserted, alreadyPresent, Stopwatch.GetElapsedTime(started).TotalSeconds);
        activity?.SetTag(Telemetry.ResultTag, "stored").SetTag("finwatch.ingest.batch_id", batchId).SetTag("finwatch.ingest.rows_read", rowsRead)
            .SetTag("finwatch.ingest.inserted", inserted).SetTag("finwatch.ingest.already_present", alreadyPresent);
    }

    public void Rejected(int rowsRead, int errorCount)
    {
        answered = true;
        telemetry.RecordRejected(source, errorCount, Stopwatch.GetElapsedTime(started).TotalSeconds);
        activity?.SetTag(Telemetry.ResultTag, "rejected").SetTag("finwatch.ingest.rows_read", rowsRead).SetTag("finwatch.ingest.errors", errorCount);
    }

    /// <summary>Ends the span; a batch that got no answer (an exception, a dropped request) counts as failed.</summary>
    public void Dispose()
    {
        if (!answered)
        {
            telemetry.RecordBatch(source, "failed", Stopwatch.GetElapsedTime(started).TotalSeconds);
            activity?.SetTag(Telemetry.ResultTag, "failed").SetStatus(ActivityStatusCode.Error, "the batch ended without an answer; nothing was stored");
        }

        activity?.Dispose();
    }
}

/// <summary>
/// One monitor evaluation being measured: its span, the points and raised alerts of each context as it commits, and
/// when it ends its duration.
/// </summary>
public sealed class MonitorEvaluationTelemetry : IDisposable
{
    private readonly Telemetry telemetry;
    private readonly long started = Stopwatch.GetTimestamp();
    private readonly Activity? activity = Telemetry.Source.StartActivity("finwatch.monitor.evaluate");
    private int points;
    private int raised;
    private bool completed;

    internal MonitorEvaluationTelemetry(Telemetry telemetry) => this.telemetry = telemetry;

    /// <summary>One context's committed transaction: the points it judged and the alerts it raised (severity, rule).</summary>
    public void Committed(int pointCount, IReadOnlyList<(string Severity, string Rule)> raisedAlerts)
    {
        telemetry.RecordCommitted(pointCount, raisedAlerts);
        points += pointCount;
        raised += raisedAlerts.Count;
    }

    public void Completed() => completed = true;

    /// <summary>Ends the span; an evaluation that did not complete (an error, a stop) counts as failed.</summary>
    public void Dispose()
    {
        telemetry.RecordEvaluation(completed, Stopwatch.GetElapsedTime(started).TotalSeconds);
        activity?.SetTag("finwatch.monitor.points", points).SetTag("finwatch.monitor.alerts_raised", raised);
        if (!completed)
        {
            activity?.SetStatus(ActivityStatusCode.Error, "the evaluation ended early; contexts committed before the error keep their points");
        }

        activity?.Dispose();
    }
}
