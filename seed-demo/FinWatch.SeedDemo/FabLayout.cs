namespace FinWatch.SeedDemo;

/// <summary>
/// The equipment, people and planted history of the invented fab "Quorvale Fab 2". All names are invented.
/// </summary>
internal static class FabLayout
{
    public static readonly DateTime EndUtc = new(2026, 11, 30, 0, 0, 0, DateTimeKind.Utc);

    public const int MaxDays = 90;

    /// <summary>Wafer radius inside which sites may lie (300 mm wafer, 3 mm edge exclusion).</summary>
    public const double UsableRadiusMm = 147.0;

    public static readonly TimeSpan MaintenanceDowntime = TimeSpan.FromHours(8);

    // Offsets are "a few tenths of a nm" so that chamber matching charts have something to show (planted behaviour 5).
    public static readonly EtchTool[] EtchTools =
    [
        new("FX07",
            new EtchChamber("FX07", "FX07-L", 0.00, 0.00, 0.0, 0.00),
            new EtchChamber("FX07", "FX07-R", 0.15, 0.10, -0.3, 0.05)),
        new("FX08",
            new EtchChamber("FX08", "FX08-L", -0.20, -0.15, 0.4, 0.10),
            new EtchChamber("FX08", "FX08-R", 0.25, 0.20, 0.2, -0.05)),
    ];

    public static readonly LinerChamber[] LinerChambers =
    [
        new("LD03", "LD03-1", 0.04),
        new("LD03", "LD03-2", -0.03),
    ];

    /// <summary>Two scatterometry-style profile tools that are matched to within a few hundredths of a nm.</summary>
    public static readonly MetrologyTool[] ProfileTools =
    [
        new("MP11", 0.00, 0.00, 0.00, 0.000, 0.12, 0.15),
        new("MP12", 0.04, 0.03, -0.15, 0.010, 0.12, 0.15),
    ];

    /// <summary>
    /// The profile tool that the demo simulates live after the history (a third tool, matched like the other two): it
    /// measures one new lot at a time through the server's normal ingest.
    /// </summary>
    public static readonly MetrologyTool LiveProfileTool = new("MP13", 0.02, 0.01, -0.05, 0.005, 0.12, 0.15);

    /// <summary>The CD tool of the post-etch step reads the top a little wide and the foot a little narrow.</summary>
    public static readonly MetrologyTool CdTool = new("MC21", 0.20, -0.15, 0.0, 0.0, 0.15, 0.20);

    /// <summary>Invented badge ids, four per shift: 06–14, 14–22 and 22–06 UTC.</summary>
    public static readonly string[][] ShiftCrews =
    [
        ["OP-0132", "OP-0248", "OP-0417", "OP-0563"],
        ["OP-0629", "OP-0705", "OP-0871", "OP-0936"],
        ["OP-1054", "OP-1182", "OP-1217", "OP-1390"],
    ];

    // Taper creep of the chamber named by the TaperCreepReset events (planted behaviour 1):
    // the chamber runs RF about 70 % of the wall-clock time, and its sidewall angle grows 0.12° per 100 RF hours.
    public const double RfHoursPerHour = 0.7;
    public const double TaperCreepDegPerRfHour = 0.0012;

    // Corner radius step after the CornerRadiusStep maintenance (planted behaviour 2).
    public const double CornerRadiusStepNm = -0.5;

    // Liner thinning after LinerThinningStart (planted behaviour 3): −0.3 nm over 90 days.
    public const double LinerThinningNmPerDay = -0.3 / 90.0;

    public static IReadOnlyList<DemoEvent> Events { get; } =
    [
        new(Utc(2026, 8, 19, 10, 0), "FX07", "FX07-R", DemoEventKind.TaperCreepReset,
            "Wet clean before the data window: FX07-R's taper is already creeping when the data start."),
        new(Utc(2026, 9, 1, 0, 0), "LD03", "LD03-2", DemoEventKind.LinerThinningStart,
            "LD03-2 liner starts thinning linearly: -0.3 nm over 90 days (invented showerhead ageing)."),
        new(Utc(2026, 9, 10, 8, 0), "FX08", "FX08-R", DemoEventKind.RoutineMaintenance,
            "Routine maintenance of FX08-R; no planted shift."),
        new(Utc(2026, 9, 24, 6, 0), "FX07", "FX07-R", DemoEventKind.TaperCreepReset,
            "Wet clean of FX07-R: taper drops back by about 0.7 deg and starts creeping again."),
        new(Utc(2026, 10, 8, 9, 30), "FX08", "FX08-L", DemoEventKind.CornerRadiusStep,
            "Maintenance of FX08-L with a new edge ring: corners sharpen, radius drops by 0.5 nm and stays."),
        new(Utc(2026, 10, 15, 7, 0), "FX07", "FX07-L", DemoEventKind.RoutineMaintenance,
            "Routine maintenance of FX07-L; no planted shift."),
        new(Utc(2026, 10, 29, 14, 0), "FX07", "FX07-R", DemoEventKind.TaperCreepReset,
            "Wet clean of FX07-R: taper drops back by about 0.7 deg and starts creeping again."),
        new(Utc(2026, 11, 5, 11, 0), "LD03", "LD03-1", DemoEventKind.RoutineMaintenance,
            "Routine maintenance of LD03-1; lots go to LD03-2 meanwhile; no planted shift."),
    ];

    public static DateTime StartUtc(DemoScale scale) => EndUtc.AddDays(-scale.Days);

    public static string OperatorOnShift(DateTime atUtc, Random random)
    {
        int shift = atUtc.Hour switch
        {
            >= 6 and < 14 => 0,
            >= 14 and < 22 => 1,
            _ => 2,
        };
        string[] crew = ShiftCrews[shift];
        return crew[random.Next(crew.Length)];
    }

    /// <summary>True while a maintenance event of the chamber keeps it down.</summary>
    public static bool IsDown(string chamberId, DateTime atUtc)
    {
        foreach (var e in Events)
        {
            if (e.IsMaintenance && e.Chamber == chamberId && atUtc >= e.AtUtc && atUtc < e.AtUtc + MaintenanceDowntime)
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>Extra sidewall angle (degrees) of a wafer etched at <paramref name="etchedAtUtc"/> in the chamber.</summary>
    public static double TaperCreepDeg(string chamberId, DateTime etchedAtUtc)
    {
        DemoEvent? last = LastEvent(chamberId, DemoEventKind.TaperCreepReset, etchedAtUtc);
        if (last is null)
        {
            return 0.0;
        }

        double runHours = (etchedAtUtc - last.AtUtc - MaintenanceDowntime).TotalHours;
        return Math.Max(0.0, runHours) * RfHoursPerHour * TaperCreepDegPerRfHour;
    }

    /// <summary>Corner radius step (nm) of a wafer etched at <paramref name="etchedAtUtc"/> in the chamber.</summary>
    public static double CornerRadiusStep(string chamberId, DateTime etchedAtUtc) =>
        LastEvent(chamberId, DemoEventKind.CornerRadiusStep, etchedAtUtc) is null ? 0.0 : CornerRadiusStepNm;

    /// <summary>Liner drift (nm) of a lot lined at <paramref name="linedAtUtc"/> in the chamber.</summary>
    public static double LinerDrift(string chamberId, DateTime linedAtUtc)
    {
        DemoEvent? start = LastEvent(chamberId, DemoEventKind.LinerThinningStart, linedAtUtc);
        return start is null ? 0.0 : (linedAtUtc - start.AtUtc).TotalDays * LinerThinningNmPerDay;
    }

    private static DemoEvent? LastEvent(string chamberId, DemoEventKind kind, DateTime atUtc)
    {
        DemoEvent? last = null;
        foreach (var e in Events)
        {
            if (e.Kind == kind && e.Chamber == chamberId && e.AtUtc <= atUtc)
            {
                last = e;
            }
        }

        return last;
    }

    private static DateTime Utc(int year, int month, int day, int hour, int minute) =>
        new(year, month, day, hour, minute, 0, DateTimeKind.Utc);
}
