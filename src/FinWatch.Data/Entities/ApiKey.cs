namespace FinWatch.Data.Entities;

/// <summary>
/// A key for a metrology tool or script (scope "ingest") or a wall screen (scope "display"). Only a SHA-256 hash of
/// the key is stored; the key itself is shown once when created.
/// </summary>
public sealed class ApiKey
{
    public int Id { get; set; }
    public required string Name { get; set; }

    /// <summary>The key's public first part, by which it is looked up (not secret).</summary>
    public required string Prefix { get; set; }

    /// <summary>Lower-case hex SHA-256 of the whole key.</summary>
    public required string Hash { get; set; }

    public required string Scope { get; set; }
    public required string CreatedBy { get; set; }
    public long CreatedAtMs { get; set; }
    public string? RevokedBy { get; set; }
    public long? RevokedAtMs { get; set; }
    public long? LastUsedAtMs { get; set; }
}
