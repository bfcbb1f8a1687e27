namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// Serialises ingest transactions within the process. SQLite has one writer at a time; queueing here keeps a
/// second upload waiting its turn instead of failing on the database's busy timeout during a long batch.
/// </summary>
public sealed class IngestGate : IDisposable
{
    private readonly SemaphoreSlim semaphore = new(1, 1);

    public async Task<IDisposable> EnterAsync(CancellationToken cancellationToken)
    {
        await semaphore.WaitAsync(cancellationToken);
        return new Turn(semaphore);
    }

    public void Dispose() => semaphore.Dispose();

    private sealed class Turn(SemaphoreSlim semaphore) : IDisposable
    {
        private int released;

        public void Dispose()
        {
            if (Interlocked.Exchange(ref released, 1) == 0)
            {
                semaphore.Release();
            }
        }
    }
}
