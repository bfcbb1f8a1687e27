namespace FinWatch.Testing;

/// <summary>
/// Hands out at most <c>bytesPerRead</c> bytes per read and refuses synchronous reads, as Kestrel's request body does:
/// for readers that must cope with a body arriving in pieces.
/// </summary>
public sealed class TrickleStream(byte[] data, int bytesPerRead) : Stream
{
    private int position;

    public override bool CanRead => true;
    public override bool CanSeek => false;
    public override bool CanWrite => false;
    public override long Length => data.Length;
    public override long Position { get => position; set => throw new NotSupportedException(); }

    public override int Read(byte[] buffer, int offset, int count) => throw new InvalidOperationException("Synchronous operations are disallowed.");

    public override ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
    {
        var n = Math.Min(Math.Min(buffer.Length, bytesPerRead), data.Length - position);
        data.AsSpan(position, n).CopyTo(buffer.Span);
        position += n;
        return new(n);
    }

    public override Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        ReadAsync(buffer.AsMemory(offset, count), cancellationToken).AsTask();

    public override void Flush() => throw new NotSupportedException();
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
    public override void SetLength(long value) => throw new NotSupportedException();
    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();
}
