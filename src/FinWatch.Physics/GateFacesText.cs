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

    /// <summary>Every allowed spelling, in the order of the enum.</summary>
    public static IReadOnlyList<string> Names { get; } = [TriGate, DoubleGate];

    /// <summary>Both spellings with what each means, for messages to the people who send them.</summary>
    public const string Described = TriGate + " (top and both sidewalls gated) or " + DoubleGate + " (hard mask on top, sidewalls only)";

    /// <summary>The spelling of <paramref name="faces"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not a defined <see cref="GateFaces"/>.</exception>
    public static string ToText(GateFaces faces) => faces switch
    {
        GateFaces.TriGate => TriGate,
        GateFaces.DoubleGate => DoubleGate,
        _ => throw new ArgumentOutOfRangeException(nameof(faces), faces, "not a gate configuration"),
    };

    /// <summary>Reads an exact spelling (<see cref="TriGate"/> or <see cref="DoubleGate"/>, case-sensitive); false for anything else, null included.</summary>
    public static bool TryParse([NotNullWhen(true)] string? text, out GateFaces faces)
    {
        switch (text)
        {
            case TriGate:
                faces = GateFaces.TriGate;
                return true;
            case DoubleGate:
                faces = GateFaces.DoubleGate;
                return true;
            default:
                faces = default;
                return false;
        }
    }

    /// <summary>Reads an exact spelling, as <see cref="TryParse"/>.</summary>
    /// <exception cref="FormatException">The text is not one of <see cref="Names"/>.</exception>
    public static GateFaces Parse(string text) =>
        TryParse(text, out var faces) ? faces : throw new FormatException($"'{text}' is not a gate configuration; expected {Described}");
}
