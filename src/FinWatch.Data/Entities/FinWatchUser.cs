using Microsoft.AspNetCore.Identity;

namespace FinWatch.Data.Entities;

/// <summary>A person who signs in (ASP.NET Core Identity); the user name is what the audit trail and alerts record.</summary>
public sealed class FinWatchUser : IdentityUser
{
    /// <summary>One of technician, supervisor, engineer, administrator (each includes the rights of the ones before it).</summary>
    public string Role { get; set; } = "technician";

    public long CreatedAtMs { get; set; }

    /// <summary>Set when an administrator disables the account (people are never deleted: the audit trail names them).</summary>
    public long? DisabledAtMs { get; set; }
}
