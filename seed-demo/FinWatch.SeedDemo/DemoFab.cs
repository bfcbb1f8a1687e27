namespace FinWatch.SeedDemo;

/// <summary>
/// The deterministic generator of <b>Quorvale Fab 2</b>, an <b>invented</b> demo fab of the invented company
/// Quorvale Devices. Its products, tools, chambers, operators and history are all made up; no real company,
/// person, product or tool is meant. See <c>seed-demo/README.md</c> for the fab and its planted events.
/// </summary>
/// <remarks>
/// The output depends only on the seed and the <see cref="DemoScale"/>: every random stream is a
/// <c>new Random(int)</c> seeded from <c>seed</c>, and the time window is fixed (it ends at <see cref="EndUtc"/>),
/// so the same arguments always give byte-identical CSV and no time lies in the future.
/// </remarks>
public static class DemoFab
{
    /// <summary>The seed of the published demo data set.</summary>
    public const int DefaultSeed = 20261202;

    /// <summary>The CSV header of FinWatch's ingest format, in column order.</summary>
    public const string CsvHeader =
        "lot_id,wafer_slot,site_id,site_x_mm,site_y_mm,product,step,etch_tool,etch_chamber,liner_tool,liner_chamber,"
        + "metrology_tool,measured_at,operator,top_width_nm,bottom_width_nm,fin_height_nm,corner_radius_nm,liner_thickness_nm";

    /// <summary>The post-liner profile step: all five values on every wafer, 13 (TRN7) or 9 (BRM7) sites.</summary>
    public const string ProfileStep = "FIN-PROFILE";

    /// <summary>The post-etch CD step: top and bottom width only, on 3 wafers of the lot at 5 sites.</summary>
    public const string EtchCdStep = "POST-ETCH-CD";

    /// <summary>Every generated time is strictly before this fixed end: 2026-11-30T00:00:00Z.</summary>
    public static DateTime EndUtc => FabLayout.EndUtc;

    /// <summary>How long a maintenance takes a chamber down (its lots run on the tool's other chamber meanwhile).</summary>
    public static TimeSpan MaintenanceDowntime => FabLayout.MaintenanceDowntime;

    /// <summary>The invented products: TRN7 (tri-gate logic) and BRM7 (double-gate, hard mask).</summary>
    public static IReadOnlyList<DemoProduct> Products { get; } = [.. ProductRecipe.All.Select(r => r.Product)];

    /// <summary>
    /// The site plans the generator measures by: per product, its profile sites at <see cref="ProfileStep"/> and the
    /// shared CD sites at <see cref="EtchCdStep"/>, with the same ids and positions the rows carry.
    /// </summary>
    public static IReadOnlyList<DemoSitePlan> SitePlans { get; } =
    [
        .. ProductRecipe.All.SelectMany(r => new[]
        {
            new DemoSitePlan(r.Product.Code, ProfileStep, [.. r.ProfileSites.Select(s => new DemoPlanSite(s.Id, s.XMm, s.YMm))]),
            new DemoSitePlan(r.Product.Code, EtchCdStep, [.. ProductRecipe.CdSites.Select(s => new DemoPlanSite(s.Id, s.XMm, s.YMm))]),
        }),
    ];

    /// <summary>The planted maintenances and drifts, in time order; the same for every seed and scale.</summary>
    public static IReadOnlyList<DemoEvent> Events => FabLayout.Events;

    /// <summary>The first day of the data window: <see cref="EndUtc"/> minus <see cref="DemoScale.Days"/>.</summary>
    public static DateTime StartUtc(DemoScale? scale = null) => FabLayout.StartUtc(Validate(scale));

    /// <summary>
    /// Streams the whole demo data set as CSV in FinWatch's ingest format: header first, LF line ends, invariant
    /// culture, UTC ISO-8601 times with 'Z', rows in measurement-time order. Nothing but one line is held in memory.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static void WriteMeasurementsCsv(TextWriter writer, int seed = DefaultSeed, DemoScale? scale = null) =>
        WriteMeasurementsCsv(writer, seed, scale, null, null);

    /// <summary>
    /// As <see cref="WriteMeasurementsCsv(TextWriter, int, DemoScale?)"/>, keeping only the rows measured in
    /// [<paramref name="fromUtc"/>, <paramref name="toUtc"/>) (either end open when null).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static void WriteMeasurementsCsv(TextWriter writer, int seed, DemoScale? scale, DateTime? fromUtc, DateTime? toUtc) =>
        WriteMeasurementsCsv(writer, seed, scale, fromUtc, toUtc, TimeSpan.Zero);

    /// <summary>
    /// As <see cref="WriteMeasurementsCsv(TextWriter, int, DemoScale?, DateTime?, DateTime?)"/> with every written time
    /// moved by <paramref name="shift"/> (whole seconds), so that the history can end when a demo starts.
    /// <paramref name="fromUtc"/> and <paramref name="toUtc"/> are in the data set's own time, before the shift.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the documented ranges, or the shift is not whole seconds.</exception>
    public static void WriteMeasurementsCsv(TextWriter writer, int seed, DemoScale? scale, DateTime? fromUtc, DateTime? toUtc, TimeSpan shift)
    {
        ArgumentNullException.ThrowIfNull(writer);
        WriteCsv(writer, GenerateRows(seed, scale).Where(row => (fromUtc is null || row.MeasuredAtUtc >= fromUtc) && (toUtc is null || row.MeasuredAtUtc < toUtc)), shift);
    }

    /// <summary>
    /// Writes the given rows (for example one day of <see cref="GenerateRows"/>) as the same CSV, header first, every
    /// time moved by <paramref name="shift"/> (whole seconds).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The shift is not whole seconds.</exception>
    public static void WriteCsv(TextWriter writer, IEnumerable<DemoSiteRow> rows, TimeSpan shift)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(rows);
        RequireWholeSeconds(shift);
        var csv = new CsvLineWriter(writer);
        csv.WriteHeader();
        foreach (DemoSiteRow row in rows)
        {
            csv.Write(shift == TimeSpan.Zero ? row : row with { MeasuredAtUtc = row.MeasuredAtUtc + shift });
        }
    }

    private static void RequireWholeSeconds(TimeSpan shift)
    {
        if (shift.Ticks % TimeSpan.TicksPerSecond != 0)
        {
            throw new ArgumentOutOfRangeException(nameof(shift), shift, "The shift must be whole seconds (the CSV writes whole seconds).");
        }
    }

    /// <summary>
    /// The rows of the demo data set, generated lazily in measurement-time order (ties in lot, step, wafer and site
    /// order). Values are rounded as the CSV writes them.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static IEnumerable<DemoSiteRow> GenerateRows(int seed = DefaultSeed, DemoScale? scale = null) =>
        RowStream.Generate(seed, Validate(scale));

    /// <summary>
    /// The planted bad wafers (about 1 in 400) that appear in the data of this seed and scale, in lot and slot order.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static IEnumerable<DemoExcursionWafer> ExcursionWafers(int seed = DefaultSeed, DemoScale? scale = null)
    {
        DemoScale checkedScale = Validate(scale);
        return Enumerate(LotPlan.PlanAll(seed, checkedScale));

        IEnumerable<DemoExcursionWafer> Enumerate(List<LotPlan> lots)
        {
            int[] cdSlots = LotPlan.CdSlots(checkedScale.WafersPerLot);
            foreach (LotPlan lot in lots)
            {
                foreach (WaferState wafer in FinModel.Wafers(seed, lot, checkedScale.WafersPerLot))
                {
                    bool measured = lot.ProfileAtUtc is not null || (lot.CdAtUtc is not null && cdSlots.Contains(wafer.Slot));
                    if (wafer.Excursion is { } kind && measured)
                    {
                        yield return new DemoExcursionWafer(
                            lot.LotId, wafer.Slot, lot.Recipe.Product.Code, wafer.Chamber.Id, kind,
                            wafer.ExcursionWidthNm, wafer.ExcursionHeightNm);
                    }
                }
            }
        }
    }

    /// <summary>The first lot number after the history of <paramref name="scale"/> (lots are numbered Q30001, Q30002, … in start order).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static int FirstLotNumberAfter(DemoScale? scale = null)
    {
        DemoScale s = Validate(scale);
        return LotPlan.FirstLotNumber + (int)Math.Floor(s.Days * s.LotsPerDay);
    }

    /// <summary>The id of the simulated live profile tool (<see cref="LiveProfileLot"/>).</summary>
    public static string LiveProfileToolId => FabLayout.LiveProfileTool.Id;

    /// <summary>
    /// One more lot after the history, as the simulated live profile tool measures it: the <see cref="ProfileStep"/>
    /// rows of lot <c>Q{lotNumber}</c> whose last site is measured at <paramref name="lastSiteUtc"/> (in the data set's
    /// own time: it may lie after <see cref="EndUtc"/>, and the planted drifts go on). The same arguments give the same
    /// rows. Lot numbers at or after <see cref="FirstLotNumberAfter"/> do not repeat a lot of the history.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The lot number is below the first lot, or the wafer count is outside 1..25.</exception>
    public static IEnumerable<DemoSiteRow> LiveProfileLot(int seed, int lotNumber, DateTime lastSiteUtc, int wafersPerLot = 25)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(lotNumber, LotPlan.FirstLotNumber);
        ArgumentOutOfRangeException.ThrowIfLessThan(wafersPerLot, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(wafersPerLot, 25);
        return LiveLots.ProfileLot(seed, lotNumber, DateTime.SpecifyKind(lastSiteUtc, DateTimeKind.Utc), wafersPerLot);
    }

    /// <summary>The header of the electrical-test CSV that <c>POST /api/model/calibrations</c> reads.</summary>
    public const string ElectricalTestCsvHeader = "lot_id,wafer_slot,product,vt_lin_v,vt_sat_v,tested_at";

    /// <summary>The invented "true" electrical behaviour of each product that the electrical tests are made from.</summary>
    public static IReadOnlyList<DemoElectricalTruth> ElectricalTruths => ElectricalTestPlan.Truths;

    /// <summary>
    /// The invented electrical-test results: four wafers of every lot whose test (18 days after its fin profile) falls
    /// in the window, in lot order, made with the project's analytic model from each wafer's true fin under
    /// <see cref="ElectricalTruths"/>, plus 4 mV of wafer noise. They are consistent with the measured fins.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static IEnumerable<DemoElectricalTest> GenerateElectricalTests(int seed = DefaultSeed, DemoScale? scale = null) =>
        ElectricalTestPlan.Generate(seed, Validate(scale));

    /// <summary>Streams the electrical tests of <paramref name="product"/> (all products when null) as calibration CSV.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The scale is outside the ranges documented on <see cref="DemoScale"/>.</exception>
    public static void WriteElectricalTestsCsv(TextWriter writer, string? product = null, int seed = DefaultSeed, DemoScale? scale = null) =>
        WriteElectricalTestsCsv(writer, product, seed, scale, TimeSpan.Zero);

    /// <summary>As above, every test time moved by <paramref name="shift"/> (whole seconds), as the measurements are.</summary>
    public static void WriteElectricalTestsCsv(TextWriter writer, string? product, int seed, DemoScale? scale, TimeSpan shift)
    {
        ArgumentNullException.ThrowIfNull(writer);
        RequireWholeSeconds(shift);
        IEnumerable<DemoElectricalTest> tests = GenerateElectricalTests(seed, scale);
        writer.Write(ElectricalTestCsvHeader);
        writer.Write('\n');
        foreach (DemoElectricalTest t in tests)
        {
            if (product is null || t.Product == product)
            {
                writer.Write(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"{t.LotId},{t.WaferSlot},{t.Product},{t.VtLinV:0.0000},{t.VtSatV:0.0000},{t.TestedAtUtc + shift:yyyy-MM-ddTHH:mm:ss}Z\n"));
            }
        }
    }

    private static DemoScale Validate(DemoScale? scale)
    {
        scale ??= new DemoScale();
        ArgumentOutOfRangeException.ThrowIfLessThan(scale.Days, 1, nameof(scale));
        ArgumentOutOfRangeException.ThrowIfGreaterThan(scale.Days, FabLayout.MaxDays, nameof(scale));
        if (!(scale.LotsPerDay > 0.0 && scale.LotsPerDay <= 240.0))
        {
            throw new ArgumentOutOfRangeException(nameof(scale), scale.LotsPerDay, "LotsPerDay must be greater than 0 and at most 240.");
        }

        ArgumentOutOfRangeException.ThrowIfLessThan(scale.WafersPerLot, 1, nameof(scale));
        ArgumentOutOfRangeException.ThrowIfGreaterThan(scale.WafersPerLot, 25, nameof(scale));
        return scale;
    }
}
