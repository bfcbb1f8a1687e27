namespace FinWatch.Server.Infrastructure;

/// <summary>What is wrong with one cell or row of an uploaded batch (measurements, electrical tests). Column is null for a whole-row problem.</summary>
public sealed record RowError(int Row, string? Column, string? Value, string Reason)
{
    private const int MaxValueLength = 80;

    /// <summary>Makes an error with the offending value shortened for display.</summary>
    public static RowError For(int row, string? column, string? value, string reason) =>
        new(row, column, value is { Length: > MaxValueLength } ? value[..MaxValueLength] + "…" : value, reason);
}
