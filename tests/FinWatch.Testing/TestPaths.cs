namespace FinWatch.Testing;

/// <summary>Locations in the checkout that tests read (README examples, generated schema scripts).</summary>
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
}
