using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Features.Access;

/// <summary>Sign-in and request limits (section "FinWatch:Auth").</summary>
public sealed class AccessOptions
{
    public const string Section = "FinWatch:Auth";

    /// <summary>
    /// Creates this administrator at start-up when the database has no administrator yet (for container deployments);
    /// leave empty otherwise and use <c>admin add</c>. There is no default password.
    /// </summary>
    public string? BootstrapAdminName { get; set; }

    public string? BootstrapAdminPassword { get; set; }

    /// <summary>Sign-in attempts per minute from one address.</summary>
    [Range(1, 10_000)]
    public int SignInPerMinute { get; set; } = 10;

    /// <summary>Ingest requests per minute per tool key or person (a flood guard; a tool sends a few a minute).</summary>
    [Range(1, 1_000_000)]
    public int IngestPerMinute { get; set; } = 1200;

    /// <summary>Largest body of any request other than ingest and calibration uploads.</summary>
    [Range(1024, 1L << 30)]
    public long MaxJsonBodyBytes { get; set; } = 1 << 20;

    /// <summary>Failed sign-ins before an account locks, and for how long.</summary>
    [Range(1, 100)]
    public int LockoutAttempts { get; set; } = 5;

    [Range(1, 10_080)]
    public int LockoutMinutes { get; set; } = 15;

    /// <summary>
    /// A folder every instance shares (README Scale-out): the key ring that protects session cookies and antiforgery
    /// tokens, so a person signed in through one instance stays signed in on the others. Empty: the default per-machine ring.
    /// </summary>
    public string? DataProtectionKeysPath { get; set; }
}
