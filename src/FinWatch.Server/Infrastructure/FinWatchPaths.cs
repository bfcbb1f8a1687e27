namespace FinWatch.Server.Infrastructure;

/// <summary>
/// Where relative data paths (db/finwatch.db, db/inbox) are anchored: the repository root when the server runs from a
/// checkout (the folder holding FinWatch.sln above the content root), else the content root of a published server.
/// </summary>
public static class FinWatchPaths
{
    public static string Home(string contentRoot)
    {
        for (var dir = new DirectoryInfo(contentRoot); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "FinWatch.sln")))
            {
                return dir.FullName;
            }
        }

        return contentRoot;
    }

    public static string Resolve(string contentRoot, string path) =>
        Path.IsPathRooted(path) ? path : Path.GetFullPath(Path.Combine(Home(contentRoot), path));
}
