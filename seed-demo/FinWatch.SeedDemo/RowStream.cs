namespace FinWatch.SeedDemo;

/// <summary>
/// Turns the lot plan into rows sorted by measurement time without holding them: each lot step is a lazy stream of
/// its own rows (already in time order), and a k-way merge over the few steps running at once interleaves them.
/// </summary>
internal static class RowStream
{
    /// <summary>The rows in time order; nothing (not even the lot plan) is computed before the first MoveNext.</summary>
    public static IEnumerable<DemoSiteRow> Generate(int seed, DemoScale scale)
    {
        List<StepRun> runs = PlanRuns(seed, scale);
        var active = new PriorityQueue<IEnumerator<DemoSiteRow>, (DateTime At, int Run)>();
        int next = 0;
        try
        {
            while (true)
            {
                // Admit every run that starts no later than the earliest pending row; each run's first row is at its start.
                while (next < runs.Count && (!active.TryPeek(out _, out var head) || runs[next].StartUtc <= head.At))
                {
                    IEnumerator<DemoSiteRow> rows = Rows(seed, scale, runs[next]).GetEnumerator();
                    if (rows.MoveNext())
                    {
                        active.Enqueue(rows, (rows.Current.MeasuredAtUtc, next));
                    }
                    else
                    {
                        rows.Dispose();
                    }

                    next++;
                }

                if (!active.TryDequeue(out var current, out var key))
                {
                    yield break;
                }

                yield return current.Current;
                if (current.MoveNext())
                {
                    active.Enqueue(current, (current.Current.MeasuredAtUtc, key.Run));
                }
                else
                {
                    current.Dispose();
                }
            }
        }
        finally
        {
            while (active.TryDequeue(out var rows, out _))
            {
                rows.Dispose();
            }
        }
    }

    /// <summary>Every lot step that fits the window, in start order.</summary>
    private static List<StepRun> PlanRuns(int seed, DemoScale scale)
    {
        List<StepRun> runs = [];
        foreach (LotPlan lot in LotPlan.PlanAll(seed, scale))
        {
            if (lot.CdAtUtc is { } cdAt)
            {
                runs.Add(new StepRun(cdAt, lot, IsProfile: false));
            }

            if (lot.ProfileAtUtc is { } profileAt)
            {
                runs.Add(new StepRun(profileAt, lot, IsProfile: true));
            }
        }

        // Ties (same start) are broken by lot and then step, so the order never depends on the sort algorithm.
        runs.Sort((a, b) => (a.StartUtc, a.Lot.Index, a.IsProfile).CompareTo((b.StartUtc, b.Lot.Index, b.IsProfile)));
        return runs;
    }

    private static IEnumerable<DemoSiteRow> Rows(int seed, DemoScale scale, StepRun run)
    {
        LotPlan lot = run.Lot;
        WaferState[] wafers = FinModel.Wafers(seed, lot, scale.WafersPerLot);
        string product = lot.Recipe.Product.Code;

        if (run.IsProfile)
        {
            foreach (DemoSiteRow row in ProfileRows(seed, lot, wafers, run.StartUtc))
            {
                yield return row;
            }
        }
        else
        {
            var noise = SeededRandom.Create(seed, lot.Index, SeededRandom.CdNoiseStream);
            IReadOnlyList<SitePosition> sites = ProductRecipe.CdSites;
            int[] slots = LotPlan.CdSlots(scale.WafersPerLot);
            for (int w = 0; w < slots.Length; w++)
            {
                WaferState wafer = wafers[slots[w] - 1];
                for (int s = 0; s < sites.Count; s++)
                {
                    var (top, bottom) = FinModel.CdSite(wafer, sites[s], FabLayout.CdTool, noise);
                    yield return new DemoSiteRow(
                        lot.LotId, wafer.Slot, sites[s].Id, sites[s].XMm, sites[s].YMm, product, DemoFab.EtchCdStep,
                        lot.EtchTool.Id, wafer.Chamber.Id, null, null, FabLayout.CdTool.Id,
                        At(run.StartUtc, w, s), lot.CdOperator, top, bottom, null, null, null);
                }
            }
        }
    }

    /// <summary>The profile step's rows of a lot whose first site is measured at <paramref name="startUtc"/>, in time order.</summary>
    public static IEnumerable<DemoSiteRow> ProfileRows(int seed, LotPlan lot, WaferState[] wafers, DateTime startUtc)
    {
        var noise = SeededRandom.Create(seed, lot.Index, SeededRandom.ProfileNoiseStream);
        IReadOnlyList<SitePosition> sites = lot.Recipe.ProfileSites;
        string product = lot.Recipe.Product.Code;
        for (int w = 0; w < wafers.Length; w++)
        {
            for (int s = 0; s < sites.Count; s++)
            {
                var (top, bottom, height, radius, liner) = FinModel.ProfileSite(wafers[w], sites[s], lot.ProfileTool, noise);
                yield return new DemoSiteRow(
                    lot.LotId, wafers[w].Slot, sites[s].Id, sites[s].XMm, sites[s].YMm, product, DemoFab.ProfileStep,
                    lot.EtchTool.Id, wafers[w].Chamber.Id, lot.Liner.Tool, lot.Liner.Id, lot.ProfileTool.Id,
                    At(startUtc, w, s), lot.ProfileOperator, top, bottom, height, radius, liner);
            }
        }
    }

    private static DateTime At(DateTime startUtc, int waferIndex, int siteIndex) =>
        startUtc.AddSeconds(waferIndex * LotPlan.SecondsPerWafer + siteIndex * LotPlan.SecondsPerSite);

    private readonly record struct StepRun(DateTime StartUtc, LotPlan Lot, bool IsProfile);
}
