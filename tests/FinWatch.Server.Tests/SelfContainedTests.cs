using System.Text.RegularExpressions;
using FinWatch.Testing;

namespace FinWatch.Server.Tests;

/// <summary>
/// The repository documents itself: no tracked text file names a document outside it (a sibling folder of notes or
/// their file names) or a work-tracking number. The forbidden words are assembled here so this file does not match
/// itself.
/// </summary>
public partial class SelfContainedTests
{
    private static readonly string[] Extensions = [".cs", ".md", ".csproj", ".props", ".targets", ".json", ".js", ".css", ".html", ".sh", ".yml", ".yaml", ".conf", ".sql", ".svg", ".editorconfig", ".sln"];

    private static readonly string[] SkippedFolders = ["bin", "obj", "node_modules", "lib", ".git", "TestResults"];

    [GeneratedRegex(@"\b[Ii]ssue\s*#?\d+\b")]
    private static partial Regex IssueNumber();

    private static IEnumerable<string> TextFiles(string root)
    {
        var pending = new Stack<string>([root]);
        while (pending.Count > 0)
        {
            var folder = pending.Pop();
            foreach (var sub in Directory.EnumerateDirectories(folder))
            {
                if (!SkippedFolders.Contains(Path.GetFileName(sub)))
                {
                    pending.Push(sub);
                }
            }

            foreach (var file in Directory.EnumerateFiles(folder))
            {
                var name = Path.GetFileName(file);
                if (Extensions.Any(e => name.EndsWith(e, StringComparison.OrdinalIgnoreCase)) || name == "run")
                {
                    yield return file;
                }
            }
        }
    }

    [Fact]
    public void No_file_names_an_outside_document_or_an_issue_number()
    {
        var root = TestPaths.RepositoryRoot();
        string[] outside = ["../" + "shared", "shared" + "/design", "shared" + "/RECIPES", "shared" + "/STYLE", "fin-" + "model.md", "spc" + ".md"];
        var found = new List<string>();
        foreach (var file in TextFiles(root))
        {
            var lineNumber = 0;
            foreach (var line in File.ReadLines(file))
            {
                lineNumber++;
                var hit = outside.FirstOrDefault(o => line.Contains(o, StringComparison.Ordinal))
                    ?? (IssueNumber().Match(line) is { Success: true } m ? m.Value : null);
                if (hit is not null)
                {
                    found.Add($"{Path.GetRelativePath(root, file)}:{lineNumber}: {hit}");
                }
            }
        }

        Assert.True(found.Count == 0, "References outside the repository:\n" + string.Join('\n', found.Take(40)));
    }
}
