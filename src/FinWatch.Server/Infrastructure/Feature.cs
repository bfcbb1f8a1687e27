namespace FinWatch.Server.Infrastructure;

/// <summary>
/// One feature of the server (a folder under Features/): what it registers, what middleware it needs, what it runs at
/// start-up, and the endpoints it maps. Program.cs lists the features; <see cref="FeatureList"/> runs each hook of
/// every feature, in the order the features were added. Only <see cref="Map"/> is required.
/// </summary>
public interface IFeature
{
    /// <summary>Registers the feature's services and options. <paramref name="args"/> is the command line.</summary>
    static virtual void Add(WebApplicationBuilder builder, string[] args)
    {
    }

    /// <summary>Middleware that must see every answer, the pages' static files included (it runs before routing).</summary>
    static virtual void UseBeforeRouting(WebApplication app)
    {
    }

    /// <summary>Middleware that needs the chosen endpoint (authentication, authorization, rate limits).</summary>
    static virtual void UseAfterRouting(WebApplication app)
    {
    }

    /// <summary>
    /// Runs once the database is migrated, before the server listens. Returns an exit code to stop there (a
    /// command-line command of the feature ran instead of the server), or null to go on.
    /// </summary>
    static virtual Task<int?> StartAsync(WebApplication app, string[] args) => Task.FromResult<int?>(null);

    /// <summary>Maps the feature's endpoints (and hubs).</summary>
    static abstract void Map(IEndpointRouteBuilder endpoints);
}

/// <summary>
/// The server's features in the order Program.cs adds them; the one way a feature joins the server:
/// <c>features.Add&lt;XFeature&gt;()</c>.
/// </summary>
public sealed class FeatureList(WebApplicationBuilder builder, string[] args)
{
    private readonly List<Action<WebApplication>> beforeRouting = [];
    private readonly List<Action<WebApplication>> afterRouting = [];
    private readonly List<Func<WebApplication, string[], Task<int?>>> starts = [];
    private readonly List<Action<IEndpointRouteBuilder>> maps = [];

    /// <summary>Adds a feature: registers its services now and keeps its other hooks for <see cref="StartAsync"/> and <see cref="Use"/>.</summary>
    public FeatureList Add<T>()
        where T : IFeature
    {
        T.Add(builder, args);
        beforeRouting.Add(T.UseBeforeRouting);
        afterRouting.Add(T.UseAfterRouting);
        starts.Add(T.StartAsync);
        maps.Add(T.Map);
        return this;
    }

    /// <summary>
    /// Migrates the database, then runs each feature's start-up step; returns the exit code of the first that ends
    /// the process (a command ran), or null when the server should go on to listen.
    /// </summary>
    public async Task<int?> StartAsync(WebApplication app)
    {
        await app.MigrateFinWatchDatabaseAsync();
        foreach (var start in starts)
        {
            if (await start(app, args) is { } exitCode)
            {
                return exitCode;
            }
        }

        return null;
    }

    /// <summary>
    /// The request pipeline and the endpoints: errors and health, the features' early middleware, the pages and
    /// routing, the features' middleware after routing, then every feature's endpoints.
    /// </summary>
    public void Use(WebApplication app)
    {
        app.UseFinWatchApiDefaults();
        beforeRouting.ForEach(use => use(app));
        app.UseFinWatchPages();
        afterRouting.ForEach(use => use(app));
        maps.ForEach(map => map(app));
    }
}
