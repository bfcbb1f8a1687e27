namespace FinWatch.Server.Infrastructure.Csv;

/// <summary>
/// The body of a multipart form's file part. A form that ends before the part's closing boundary makes the multipart
/// reader throw a plain <see cref="IOException"/>; here it becomes an <see cref="InvalidDataException"/> that ingest
/// reports as a problem of the upload (a 400) rather than a server fault. Kestrel's own request-body errors (its
/// subclasses of IOException: a bad request, a reset connection) pass through unchanged.
/// </summary>
public sealed class MultipartFileStream(Stream inner) : Stream
{
    public const string CutShort = "the multipart form ends before the file part's closing boundary (is the upload cut short?)";

    public override bool CanRead => true;
    public override bool CanSeek => false;
    public override bool CanWrite => false;
    public override long Length => throw new NotSupportedException();
    public override long Position { get => throw new NotSupportedException(); set => throw new NotSupportedException(); }

    public override async ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
    {
        try
        {
            return await inner.ReadAsync(buffer, cancellationToken);
        }
        catch (IOException e) when (e.GetType() == typeof(IOException))
        {
            throw new InvalidDataException(CutShort, e);
        }
    }

    public override Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        ReadAsync(buffer.AsMemory(offset, count), cancellationToken).AsTask();

    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException("the request body is read asynchronously");

    public override void Flush() => throw new NotSupportedException();

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            inner.Dispose();
        }

        base.Dispose(disposing);
    }
}
