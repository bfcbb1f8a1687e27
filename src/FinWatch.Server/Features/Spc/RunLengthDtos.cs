using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// POST /api/contexts/run-length: the alarm budget of a rule set not saved yet. The point rate comes from a stored
/// context (<see cref="Context"/>) or is given (<see cref="PointsPerDay"/>); with neither the answer is in points only.
/// </summary>
public sealed record RunLengthRequest : IValidatedRequest
{
    public void Validate(ValidationErrors errors) => RunLengthRules.Check(this, errors);

    /// <summary>"xbar" or "individuals".</summary>
    public string? ChartType { get; init; }

    /// <summary>Rule ids (WE1..WE4, N1..N8) or set names (westernElectric, nelson).</summary>
    public string?[]? Rules { get; init; }

    /// <summary>Code of a chart context whose recent point rate is used.</summary>
    public string? Context { get; init; }

    /// <summary>The point rate to use instead of a context's.</summary>
    public double? PointsPerDay { get; init; }
}

/// <summary>One average run length: in points, in hours at the chart's point rate, and how it was obtained.</summary>
/// <param name="ShiftSigma">The mean shift in sigmas of the plotted statistic (0: in control, a false alarm).</param>
/// <param name="Points">Expected points up to and including the first signal; null when too long to resolve.</param>
/// <param name="Hours">The same as time at the point rate; null without a rate or without a resolved number of points.</param>
/// <param name="StandardErrorPoints">0 for the exact chain, the simulation's standard error otherwise; null when not resolved.</param>
/// <param name="Method">"exact Markov chain" or "simulation, R runs, standard error x points".</param>
public sealed record RunLengthFigure(double ShiftSigma, double? Points, double? Hours, double? StandardErrorPoints, string Method);

/// <summary>The alarm budget of one chart (a stored context, or a rule set sent to be tried).</summary>
public sealed record RunLengthResponse(
    string? Context,
    string? Title,
    string? Phase,
    string ChartType,
    string PlottedStatistic,
    IReadOnlyList<string> Rules,
    double? PointsPerDay,
    RunLengthRate? Rate,
    RunLengthFigure FalseAlarm,
    double? FalseAlarmsPerDay,
    IReadOnlyList<RunLengthFigure> Detection,
    IReadOnlyList<string> Notes);

/// <summary>Where a context's point rate comes from: the points measured between two times (UTC).</summary>
public sealed record RunLengthRate(int Points, DateTime From, DateTime To, double Days);

/// <summary>Expected false alarms of the whole floor in one shift of the pattern.</summary>
public sealed record ShiftFalseAlarms(string Name, double LengthHours, double ExpectedFalseAlarms);

/// <summary>GET /api/run-length: every chart's budget and the floor's expected false alarms per day and per shift.</summary>
public sealed record FloorRunLengthResponse(
    DateTime At,
    IReadOnlyList<RunLengthResponse> Charts,
    int ChartsCounted,
    double ExpectedFalseAlarmsPerDay,
    IReadOnlyList<ShiftFalseAlarms> Shifts,
    string Note);
