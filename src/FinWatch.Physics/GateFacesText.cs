using System.Diagnostics.CodeAnalysis;

namespace FinWatch.Physics;

/// <summary>
/// The one text spelling of <see cref="GateFaces"/>, used by the API (<c>gate_faces</c>), the database column and the
/// demo data: <c>"tri-gate"</c> and <c>"double-gate"</c>.
/// </summary>
public static class GateFacesText
{
    /// <summary>Gate on the flat top, the top corners and both sidewalls (<see cref="GateFaces.TriGate"/>).</summary>
    public const string TriGate = "tri-gate";

    /// <summary>Hard mask on top, only the two sidewalls gated (<see cref="GateFaces.DoubleGate"/>).</summary>
    public const string DoubleGate = "double-gate";

    /// <summary>The spelling itself, with the allowed names and their meaning for messages.</summary>
    public static TextSpelling<GateFaces> Spelling { get; } = new(
        TriGate + " (top and both sidewalls gated) or " + DoubleGate + " (hard mask on top, sidewalls only)",
        (GateFaces.TriGate, TriGate), (GateFaces.DoubleGate, DoubleGate));

    /// <summary>Every allowed spelling, in the order of the enum.</summary>
    public static IReadOnlyList<string> Names => Spelling.Names;

    /// <inheritdoc cref="TextSpelling{T}.ToText"/>
    public static string ToText(GateFaces faces) => Spelling.ToText(faces);

    /// <inheritdoc cref="TextSpelling{T}.TryParse"/>
    public static bool TryParse([NotNullWhen(true)] string? text, out GateFaces faces) => Spelling.TryParse(text, out faces);

    /// <inheritdoc cref="TextSpelling{T}.Parse"/>
    public static GateFaces Parse(string text) => Spelling.Parse(text);
}
