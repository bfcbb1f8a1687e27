namespace FinWatch.Server.Infrastructure;

/// <summary>
/// Where the server listens when nothing says: <c>http://localhost:5080</c>. Any address given the usual ASP.NET Core
/// ways wins: <c>--urls</c> or <c>Urls</c>, ASPNETCORE_URLS (the container image sets <c>http://+:8080</c>),
/// ASPNETCORE_HTTP_PORTS / HTTPS_PORTS, or Kestrel endpoints. (A default in appsettings.json would not do: it is read
/// after ASPNETCORE_URLS and would override the image's address.)
/// </summary>
public static class ListenAddress
{
    public const string Default = "http://localhost:5080";

    public static WebApplicationBuilder UseDefaultListenAddress(this WebApplicationBuilder builder)
    {
        var c = builder.Configuration;
        if (string.IsNullOrEmpty(c["urls"]) && string.IsNullOrEmpty(c["http_ports"]) && string.IsNullOrEmpty(c["https_ports"])
            && !c.GetSection("Kestrel:Endpoints").Exists())
        {
            builder.WebHost.UseUrls(Default);
        }

        return builder;
    }
}
