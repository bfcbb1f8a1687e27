namespace FinWatch.Testing;

/// <summary>Locations in the checkout that tests read (documentation examples, generated schema scripts).</summary>
public static class TestPaths
{
    /// <summary>The folder holding FinWatch.sln, found upwards from the test binaries.</summary>
    public static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "FinWatch.sln")))
            {
                return dir.FullName;
            }
        }

        throw new DirectoryNotFoundException("FinWatch.sln not found above " + AppContext.BaseDirectory);
    }

    /// <summary>README.md and every page of docs/, one after the other: the project's documentation, whose examples tests run.</summary>
    public static string DocumentationText()
    {
        var root = RepositoryRoot();
        var pages = Directory.GetFiles(Path.Combine(root, "docs"), "*.md").Order(StringComparer.Ordinal);
        return string.Join("\n", new[] { Path.Combine(root, "README.md") }.Concat(pages).Select(File.ReadAllText));
    }
}
