using System.Security.Cryptography;
using System.Text;
using FinWatch.Data;
using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Access;

/// <summary>
/// Tool keys and display tokens: "fwk_" + a 12-character public prefix + "_" + 40 random characters. Only the SHA-256 of
/// the whole key is stored (a random 240-bit secret needs no slow hash); the key is shown once, when created.
/// </summary>
public static class ApiKeys
{
    public const string IngestScope = "ingest";
    public const string DisplayScope = "display";
    public static readonly string[] Scopes = [IngestScope, DisplayScope];

    private const string Alphabet = "abcdefghijkmnopqrstuvwxyzABCDEFGHJKLMNPQRSTUVWXYZ23456789";

    public static string Hash(string key) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(key)));

    /// <summary>Creates a key; returns the stored row and the key itself (the only time it exists in clear).</summary>
    public static (ApiKey Row, string Key) Create(string name, string scope, string by, long nowMs)
    {
        var prefix = RandomNumberGenerator.GetString(Alphabet, 12);
        var key = $"fwk_{prefix}_{RandomNumberGenerator.GetString(Alphabet, 40)}";
        return (new ApiKey { Name = name, Prefix = prefix, Hash = Hash(key), Scope = scope, CreatedBy = by, CreatedAtMs = nowMs }, key);
    }

    /// <summary>The live (not revoked) key row for a presented key, or null; compares hashes in constant time.</summary>
    public static async Task<ApiKey?> FindAsync(FinWatchDbContext db, string presented, CancellationToken cancellationToken)
    {
        var parts = presented.Split('_');
        if (parts.Length != 3 || parts[0] != "fwk" || parts[1].Length != 12)
        {
            return null;
        }

        var row = await db.ApiKeys.SingleOrDefaultAsync(k => k.Prefix == parts[1], cancellationToken);
        if (row is null || row.RevokedAtMs is not null)
        {
            return null;
        }

        var expected = Encoding.ASCII.GetBytes(row.Hash);
        var actual = Encoding.ASCII.GetBytes(Hash(presented));
        return CryptographicOperations.FixedTimeEquals(expected, actual) ? row : null;
    }
}
