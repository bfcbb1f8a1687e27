namespace FinWatch.Server.Infrastructure;

/// <summary>
/// The floor pages: static HTML, CSS and ES modules from wwwroot (the browser libraries under wwwroot/lib come from
/// LibMan at build time). "/" serves the floor overview.
/// </summary>
public static class PagesExtensions
{
    public static WebApplication UseFinWatchPages(this WebApplication app)
    {
        app.UseDefaultFiles();
        app.UseStaticFiles(new StaticFileOptions
        {
            // Pages and modules change with every release; the browser revalidates them instead of guessing.
            OnPrepareResponse = c => c.Context.Response.Headers.CacheControl = "no-cache",
        });
        // UseDefaultFiles rewrites "/" to "/index.html"; routing must come after it.
        app.UseRouting();
        return app;
    }
}
