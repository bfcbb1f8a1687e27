using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Measurements;

/// <summary>The input cannot be read any further (no header, broken quoting, invalid JSON); the batch is rejected.</summary>
public sealed class IngestFormatException(RowError error) : Exception(error.Reason)
{
    public RowError Error { get; } = error;
}
