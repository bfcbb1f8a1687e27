namespace FinWatch.Server.Infrastructure.Csv;

/// <summary>The file cannot be read as CSV from this point on (bad quoting, invalid UTF-8, an endless line).</summary>
public sealed class CsvFormatException(int row, long line, string message) : Exception(message)
{
    public int Row { get; } = row;
    public long Line { get; } = line;
}
