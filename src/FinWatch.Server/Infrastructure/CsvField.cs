namespace FinWatch.Server.Infrastructure;

/// <summary>One field of a CSV file FinWatch writes (RFC 4180): quoted when it holds a comma, a quote or a line break.</summary>
public static class CsvField
{
    public static string Of(string? value) =>
        string.IsNullOrEmpty(value) ? ""
        : value.AsSpan().IndexOfAny(",\"\r\n") >= 0 ? "\"" + value.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : value;
}
