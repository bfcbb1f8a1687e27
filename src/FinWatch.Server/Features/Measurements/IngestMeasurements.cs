using System.Diagnostics;
using System.Threading.Channels;
using FinWatch.Data;
using FinWatch.Physics;
using FinWatch.Server.Features.Model;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// The ingest use case: read rows, validate, derive the fin geometry, store, all in one transaction.
/// Every source (JSON, CSV, the inbox, the demo loader) comes through here, so they share one set of rules.
/// </summary>
public sealed class IngestMeasurements(
    FinWatchDbContext db, IngestGate gate, TimeProvider clock, IOptions<IngestOptions> options, ProductModels models, IEnumerable<IBatchStoredListener> listeners,
    Telemetry telemetry, ILogger<IngestMeasurements> logger)
{
    /// <summary>Ingests the rows as one batch. Nothing is stored unless every row is valid.</summary>
    public async Task<IngestOutcome> RunAsync(IAsyncEnumerable<RawRow> rows, string source, string? label, CancellationToken cancellationToken)
    {
        var o = options.Value;
        var started = Stopwatch.GetTimestamp();
        using var measured = telemetry.StartBatch(source);
        var products = await LoadProductsAsync(o.PredictShifts, cancellationToken);
        var validator = new RowValidator(products, clock.GetUtcNow(), TimeSpan.FromMinutes(o.FutureToleranceMinutes));
        var productsById = products.Values.ToDictionary(p => p.Id);

        using var turn = await gate.EnterAsync(cancellationToken);
        await using var writer = await SiteWriters.BeginAsync(db, source, label, clock.GetUtcNow().ToUnixTimeMilliseconds(), cancellationToken);

        var errors = new List<RowError>();
        var errorCount = 0;
        var rowsRead = 0;
        var inserted = 0;
        var presentRows = new List<int>();
        var present = 0;
        var reEntrant = 0;
        var radiusTooLarge = 0;
        var lotProducts = new Dictionary<string, int>(StringComparer.Ordinal);
        var lotSteps = new HashSet<(string, string)>();
        var chambers = new HashSet<(string, string, string)>();
        var rowErrors = new List<RowError>();
        var answers = new List<SiteAnswer>();

        void Report(RowError e)
        {
            errorCount++;
            if (errors.Count < o.MaxReportedErrors)
            {
                errors.Add(e);
            }
        }

        // The writer answers each site at once (SQLite) or a chunk at a time (PostgreSQL's COPY); either way here.
        void Take(SiteAnswer answer)
        {
            var site = answer.Site;
            switch (answer.Result)
            {
                case InsertResult.Inserted:
                    inserted++;
                    break;
                case InsertResult.AlreadyPresent:
                    present++;
                    if (presentRows.Count < o.MaxReportedErrors)
                    {
                        presentRows.Add(site.Row);
                    }

                    break;
                case InsertResult.DuplicateInBatch:
                    Report(RowError.For(site.Row, null, $"{site.LotId} / {site.WaferSlot} / {site.SiteId} / {site.Step} / {answer.MeasuredAtText}",
                        "the same lot, wafer, site, step and measured-at time appear earlier in this batch"));
                    return;
            }

            if (errorCount > 0)
            {
                return; // the batch is lost anyway; keep reading only to report every error
            }

            lotSteps.Add((site.LotId, site.Step));
            AddChamber(chambers, site, site.EtchChamber);
            AddChamber(chambers, site, site.LinerChamber);
            reEntrant += (site.Derived.Flags & GeometryFlags.ReEntrant) != 0 ? 1 : 0;
            radiusTooLarge += (site.Derived.Flags & GeometryFlags.RadiusExceedsMax) != 0 ? 1 : 0;
        }

        // Reading, validating, deriving and predicting run on one core while the inserts run on the other (with the
        // prediction there the two stages take about the same time); the bounded channel keeps the reader at most the
        // writer's lookahead ahead (a few thousand rows, a COPY chunk on PostgreSQL), so memory stays flat for any file size.
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        var channel = Channel.CreateBounded<ValidatedRow>(new BoundedChannelOptions(writer.Lookahead) { SingleReader = true, SingleWriter = true });
        var producer = Task.Run(() => ValidateAllAsync(rows, validator, productsById, channel.Writer, stop.Token), stop.Token);
        try
        {
            await foreach (var (raw, validated, problems) in channel.Reader.ReadAllAsync(cancellationToken))
            {
                rowsRead++;
                rowErrors.Clear();
                rowErrors.AddRange(problems);
                var site = validated;
                if (site is not null && !LotProductMatches(site, writer, lotProducts, products, rowErrors))
                {
                    site = null;
                }

                rowErrors.ForEach(Report);
                if (site is null)
                {
                    continue;
                }

                answers.Clear();
                writer.Insert(site, raw.Cells[(int)IngestColumn.MeasuredAt] ?? "", answers);
                foreach (var answer in answers)
                {
                    Take(answer);
                }
            }

            answers.Clear();
            writer.Flush(answers);
            foreach (var answer in answers)
            {
                Take(answer);
            }
        }
        catch (IngestFormatException e)
        {
            Report(e.Error);
        }
        catch (IngestHeaderException e)
        {
            foreach (var error in e.Errors)
            {
                Report(error);
            }
        }
        finally
        {
            await stop.CancelAsync();
            await producer.ContinueWith(_ => { }, CancellationToken.None, TaskContinuationOptions.ExecuteSynchronously, TaskScheduler.Default);
        }

        if (errorCount > 0)
        {
            logger.LogInformation("Rejected {Source} batch {Label}: {ErrorCount} errors in {Rows} rows", source, label, errorCount, rowsRead);
            measured.Rejected(rowsRead, errorCount);
            return new IngestOutcome(null, new RejectedBatch(rowsRead, errorCount, errors));
        }

        await writer.CommitAsync(lotSteps, chambers, rowsRead, inserted, present, clock.GetUtcNow().ToUnixTimeMilliseconds(), cancellationToken);
        turn.Dispose();

        // The next step of the one-way flow, announced: the monitor turns the stored batch into chart points, rule
        // signals and alerts, pushed live, before the sender hears that it was stored.
        foreach (var listener in listeners)
        {
            await listener.BatchStoredAsync(new StoredBatch(writer.BatchId, source), cancellationToken);
        }

        var ms = Stopwatch.GetElapsedTime(started).TotalMilliseconds;
        logger.LogInformation("Accepted {Source} batch {BatchId} {Label}: {Inserted} stored, {Present} already present, {Ms:0} ms",
            source, writer.BatchId, label, inserted, present, ms);
        measured.Stored(writer.BatchId, rowsRead, inserted, present);
        return new IngestOutcome(new IngestAccepted(writer.BatchId, rowsRead, inserted, present, presentRows, reEntrant, radiusTooLarge, Math.Round(ms, 1)), null);
    }

    private sealed record ValidatedRow(RawRow Raw, SiteRecord? Site, List<RowError> Problems);

    private static async Task ValidateAllAsync(IAsyncEnumerable<RawRow> rows, RowValidator validator, Dictionary<int, ProductRef> products,
        ChannelWriter<ValidatedRow> output, CancellationToken cancellationToken)
    {
        try
        {
            await foreach (var raw in rows.WithCancellation(cancellationToken))
            {
                var problems = new List<RowError>(0);
                var site = validator.Validate(raw, problems);
                if (site is not null)
                {
                    site.Predicted = RowValidator.Predict(products[site.ProductId], site);
                }

                await output.WriteAsync(new ValidatedRow(raw, site, problems), cancellationToken);
            }

            output.Complete();
        }
        catch (Exception e)
        {
            // The reader's format errors (and cancellation) reach the consumer through the channel, where they are reported.
            output.Complete(e);
        }
    }

    private static void AddChamber(HashSet<(string, string, string)> chambers, SiteRecord site, string? chamber)
    {
        if (chamber is not null)
        {
            chambers.Add((site.LotId, site.Step, chamber));
        }
    }

    // A lot belongs to one product: within the batch and against what is stored.
    private static bool LotProductMatches(SiteRecord site, ISiteWriter writer, Dictionary<string, int> lotProducts,
        IReadOnlyDictionary<string, ProductRef> products, List<RowError> errors)
    {
        if (!lotProducts.TryGetValue(site.LotId, out var productId))
        {
            productId = writer.StoredProductOfLot(site.LotId) ?? site.ProductId;
            lotProducts[site.LotId] = productId;
        }

        if (productId == site.ProductId)
        {
            return true;
        }

        var other = products.Values.FirstOrDefault(p => p.Id == productId)?.Code ?? productId.ToString(System.Globalization.CultureInfo.InvariantCulture);
        errors.Add(RowError.For(site.Row, "product", products.Values.First(p => p.Id == site.ProductId).Code,
            $"lot {site.LotId} belongs to product {other}; a lot has one product"));
        return false;
    }

    private async Task<IReadOnlyDictionary<string, ProductRef>> LoadProductsAsync(bool predict, CancellationToken cancellationToken)
    {
        var list = await db.Products.AsNoTracking().ToListAsync(cancellationToken);
        var calibrations = predict ? await ProductModels.CurrentCalibrationsAsync(db, cancellationToken) : [];
        return list.ToDictionary(
            p => p.Code,
            p => new ProductRef(p.Id, p.Code, p.GateFaces,
                predict ? models.TryFor(p, calibrations.GetValueOrDefault(p.Id)) : null),
            StringComparer.Ordinal);
    }
}
