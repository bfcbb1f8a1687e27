namespace FinWatch.Server.Features.Series;

/// <summary>The sites of one wafer at one step: its first row (time, lot, chambers) and every site value.</summary>
public sealed record WaferGroup(SeriesRow First, List<double> Values)
{
    /// <summary>
    /// Groups time-ordered rows into wafers (a wafer's point sits at the time of its first site), at most
    /// <paramref name="max"/> wafers; interleaved wafers are kept apart by lot and slot.
    /// </summary>
    public static async Task<(List<WaferGroup> Wafers, bool Truncated)> CollectAsync(IAsyncEnumerable<SeriesRow> rows, int max, CancellationToken cancellationToken)
    {
        var index = new Dictionary<(string, int), WaferGroup>();
        var wafers = new List<WaferGroup>();
        await foreach (var r in rows.WithCancellation(cancellationToken))
        {
            if (!index.TryGetValue((r.Lot, r.Slot), out var w))
            {
                if (wafers.Count == max)
                {
                    return (wafers, true);
                }

                w = new WaferGroup(r, []);
                index[(r.Lot, r.Slot)] = w;
                wafers.Add(w);
            }

            w.Values.Add(r.Value);
        }

        return (wafers, false);
    }
}
