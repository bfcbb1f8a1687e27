using System.Text.RegularExpressions;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Infrastructure;

/// <summary>
/// The server's seams as DEVELOPERS.md (Seams) describes them, read from the source: Infrastructure knows no feature,
/// ingest does not know the monitor, the hub reads no database, and Program.cs adds every feature one way.
/// </summary>
public partial class SeamTests
{
    private static readonly string Server = Path.Combine(TestPaths.RepositoryRoot(), "src", "FinWatch.Server");

    private static IEnumerable<(string File, string Text)> Sources(string folder) =>
        Directory.EnumerateFiles(Path.Combine(Server, folder), "*.cs", SearchOption.AllDirectories)
            .Select(f => (Path.GetRelativePath(Server, f), File.ReadAllText(f)));

    [Fact]
    public void Infrastructure_UsesNoFeature()
    {
        var offending = Sources("Infrastructure").Where(s => s.Text.Contains("FinWatch.Server.Features", StringComparison.Ordinal)).Select(s => s.File).ToList();
        Assert.Empty(offending);
    }

    [Fact]
    public void Measurements_DoNotKnowTheMonitor_TheyAnnounceStoredBatches()
    {
        var sources = Sources(Path.Combine("Features", "Measurements")).ToList();
        Assert.Empty(sources.Where(s => s.Text.Contains("Features.Monitor", StringComparison.Ordinal) || s.Text.Contains("MonitorEvaluator", StringComparison.Ordinal)).Select(s => s.File));
        Assert.Contains(sources, s => s.Text.Contains("IBatchStoredListener", StringComparison.Ordinal));
    }

    [Fact]
    public void Calibrations_DoNotBorrowFromMeasurements()
    {
        var offending = Sources(Path.Combine("Features", "Model")).Where(s => s.Text.Contains("Features.Measurements", StringComparison.Ordinal)).Select(s => s.File).ToList();
        Assert.Empty(offending);
    }

    [Fact]
    public void MonitorHub_ReadsNoDatabase()
    {
        var hub = File.ReadAllText(Path.Combine(Server, "Features", "Monitor", "MonitorHub.cs"));
        Assert.DoesNotContain("DbContext", hub, StringComparison.Ordinal);
        Assert.Contains("FeedReader", hub, StringComparison.Ordinal);
    }

    [Fact]
    public void Program_IsUnder40Lines_AndAddsEachFeatureOnce_TheSameWay()
    {
        var program = File.ReadAllLines(Path.Combine(Server, "Program.cs"));
        Assert.True(program.Length < 40, $"Program.cs has {program.Length} lines");
        var added = program.Select(l => FeatureAdd().Match(l)).Where(m => m.Success).Select(m => m.Groups[1].Value).ToList();
        var features = Directory.EnumerateFiles(Path.Combine(Server, "Features"), "*Feature.cs", SearchOption.AllDirectories)
            .Select(f => Path.GetFileNameWithoutExtension(f)!).Order(StringComparer.Ordinal).ToList();
        Assert.Equal(features, added.Order(StringComparer.Ordinal).ToList());
        Assert.DoesNotContain(program, l => l.Contains(".Map", StringComparison.Ordinal) || l.Contains("Services.", StringComparison.Ordinal));
    }

    [GeneratedRegex(@"^\s*\.Add<(\w+Feature)>\(\)")]
    private static partial Regex FeatureAdd();
}
