using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace FinWatch.Server.Features.Notify;

/// <summary>
/// How a webhook call is signed. The signed text is the timestamp (Unix seconds, decimal), a line feed, then the body's
/// bytes; the signature is HMAC-SHA256 of it with the webhook's shared secret (UTF-8), in lowercase hex, sent as
/// "hmac-sha256=&lt;hex&gt;". A receiver recomputes it, compares in constant time, and refuses a timestamp too far from
/// its own clock (a replayed call). HMAC: RFC 2104; SHA-256: FIPS 180-4.
/// </summary>
public static class WebhookSignature
{
    public const string IdempotencyKeyHeader = "FinWatch-Idempotency-Key";
    public const string TimestampHeader = "FinWatch-Timestamp";
    public const string SignatureHeader = "FinWatch-Signature";
    public const string Prefix = "hmac-sha256=";

    public static string Sign(string secret, long timestamp, ReadOnlySpan<byte> body)
    {
        var head = Encoding.UTF8.GetBytes(timestamp.ToString(CultureInfo.InvariantCulture) + "\n");
        var signed = new byte[head.Length + body.Length];
        head.CopyTo(signed, 0);
        body.CopyTo(signed.AsSpan(head.Length));
        return Prefix + Convert.ToHexStringLower(HMACSHA256.HashData(Encoding.UTF8.GetBytes(secret), signed));
    }

    /// <summary>What a receiver does: true when the signature is the body's and the timestamp within <paramref name="tolerance"/> of <paramref name="now"/>.</summary>
    public static bool Verify(string secret, string? timestamp, string? signature, ReadOnlySpan<byte> body, DateTimeOffset now, TimeSpan tolerance)
    {
        if (!long.TryParse(timestamp, NumberStyles.None, CultureInfo.InvariantCulture, out var t) || signature is null
            || Math.Abs(now.ToUnixTimeSeconds() - t) > tolerance.TotalSeconds)
        {
            return false;
        }

        var expected = Encoding.ASCII.GetBytes(Sign(secret, t, body));
        return CryptographicOperations.FixedTimeEquals(expected, Encoding.ASCII.GetBytes(signature));
    }
}
