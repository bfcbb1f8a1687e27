using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests;

/// <summary>The one text spelling of the gate configuration and of the sidewall orientation.</summary>
public sealed class TextSpellingTests
{
    [Theory]
    [InlineData(GateFaces.TriGate, "tri-gate")]
    [InlineData(GateFaces.DoubleGate, "double-gate")]
    public void GateFacesText_EachValue_RoundTripsThroughItsSpelling(GateFaces faces, string text)
    {
        Assert.Equal(text, GateFacesText.ToText(faces));
        Assert.True(GateFacesText.TryParse(text, out var parsed));
        Assert.Equal(faces, parsed);
        Assert.Equal(faces, GateFacesText.Parse(text));
    }

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    [InlineData("tri")]
    [InlineData("double")]
    [InlineData("TriGate")]
    [InlineData("Tri-Gate")]
    [InlineData(" tri-gate")]
    public void GateFacesText_AnyOtherText_IsRejected(string? text)
    {
        Assert.False(GateFacesText.TryParse(text, out _));
        if (text is not null)
        {
            Assert.Throws<FormatException>(() => GateFacesText.Parse(text));
        }
    }

    [Fact]
    public void GateFacesText_Names_ListEverySpellingInEnumOrder()
    {
        Assert.Equal(["tri-gate", "double-gate"], GateFacesText.Names);
        Assert.All(GateFacesText.Names, name => Assert.Contains(name, GateFacesText.Spelling.Described, StringComparison.Ordinal));
    }

    [Fact]
    public void GateFacesText_UndefinedValue_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => GateFacesText.ToText((GateFaces)7));

    [Theory]
    [InlineData(ConfinementSurface.Si110, "110")]
    [InlineData(ConfinementSurface.Si100, "100")]
    public void ConfinementSurfaceText_EachValue_RoundTripsThroughItsSpelling(ConfinementSurface surface, string text)
    {
        Assert.Equal(text, ConfinementSurfaceText.Spelling.ToText(surface));
        Assert.Equal(surface, ConfinementSurfaceText.Spelling.Parse(text));
        Assert.False(ConfinementSurfaceText.Spelling.TryParse("111", out _));
    }

    [Theory]
    [InlineData(MaintenanceKind.WetClean, "wet_clean")]
    [InlineData(MaintenanceKind.PartReplacement, "part_replacement")]
    [InlineData(MaintenanceKind.Seasoning, "seasoning")]
    [InlineData(MaintenanceKind.PreventiveMaintenance, "preventive_maintenance")]
    [InlineData(MaintenanceKind.Repair, "repair")]
    [InlineData(MaintenanceKind.Other, "other")]
    public void MaintenanceKindText_EachValue_RoundTripsThroughItsSpelling(MaintenanceKind kind, string text)
    {
        Assert.Equal(text, MaintenanceKindText.ToText(kind));
        Assert.Equal(kind, MaintenanceKindText.Spelling.Parse(text));
        Assert.Contains(text, MaintenanceKindText.Spelling.Described, StringComparison.Ordinal);
        Assert.False(MaintenanceKindText.Spelling.TryParse(text.ToUpperInvariant(), out _)); // one spelling, case-sensitive
    }

    [Fact]
    public void TextSpelling_ValueMissingOrTextRepeated_Throws()
    {
        Assert.Throws<ArgumentException>(() => new TextSpelling<GateFaces>("x", (GateFaces.TriGate, "a")));
        Assert.Throws<ArgumentException>(() => new TextSpelling<GateFaces>("x", (GateFaces.TriGate, "a"), (GateFaces.DoubleGate, "a")));
    }
}
