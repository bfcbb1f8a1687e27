using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Measurements;

/// <summary>The header row names unknown, repeated or too few columns; each problem is listed.</summary>
public sealed class IngestHeaderException(IReadOnlyList<RowError> errors) : Exception("the header row is not usable")
{
    public IReadOnlyList<RowError> Errors { get; } = errors;
}
