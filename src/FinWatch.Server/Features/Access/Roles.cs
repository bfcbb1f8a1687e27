using System.Security.Claims;

namespace FinWatch.Server.Features.Access;

/// <summary>
/// Who may do what. People have one role each on a ladder; each role includes the rights of the ones below it:
/// technicians ingest, enter data and acknowledge alerts; supervisors also disposition and close alerts and record
/// chamber maintenance; engineers also manage products, specifications, chart contexts, limits, reaction plans and
/// model calibrations; administrators also manage people and keys. Everyone signed in reads. A tool key only ingests; a display token only reads the floor
/// overview and the charts.
/// </summary>
public static class Roles
{
    public const string Technician = "technician";
    public const string Supervisor = "supervisor";
    public const string Engineer = "engineer";
    public const string Administrator = "administrator";

    /// <summary>The principal of a wall screen (display token).</summary>
    public const string Display = "display";

    /// <summary>The principal of a metrology tool or script (ingest key).</summary>
    public const string IngestKey = "ingest-key";

    public static readonly string[] Ladder = [Technician, Supervisor, Engineer, Administrator];

    /// <summary>The role and every role below it, as role claims.</summary>
    public static IEnumerable<string> Including(string role)
    {
        var i = Array.IndexOf(Ladder, role);
        return i < 0 ? [role] : Ladder[..(i + 1)];
    }

    public static bool IsPersonRole(string role) => Array.IndexOf(Ladder, role) >= 0;

    /// <summary>How the request was authenticated: cookie, demo, key, display (claim <see cref="ViaClaim"/>).</summary>
    public const string ViaClaim = "finwatch:via";

    public static string? Via(this ClaimsPrincipal user) => user.FindFirst(ViaClaim)?.Value;

    /// <summary>The name an audit entry, an alert event or a limit version records.</summary>
    public static string Who(this ClaimsPrincipal user) => user.Identity?.IsAuthenticated == true ? user.Identity.Name ?? "unnamed" : "not signed in";
}

/// <summary>The authorization policies, one per kind of action.</summary>
public static class Permissions
{
    /// <summary>Read anything (every signed-in person, the demo engineer).</summary>
    public const string Read = "read";

    /// <summary>Read what the floor overview and the chart page show (people and display tokens).</summary>
    public const string Floor = "floor";

    public const string Ingest = "ingest";
    public const string Acknowledge = "acknowledge";
    /// <summary>Disposition and close alerts; record chamber maintenance; write and sign shift handovers (supervisors and up).</summary>
    public const string Disposition = "disposition";
    public const string Engineer = "engineer";
    public const string Administer = "administer";

    /// <summary>Every policy, in the order /api/auth/me lists what a caller may do.</summary>
    public static readonly string[] All = [Read, Floor, Ingest, Acknowledge, Disposition, Engineer, Administer];
}
