using FinWatch.Server.Features.Products;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>Products: nominal fin profile, gate configuration, specification limits, the model's inputs and the site plans per step.</summary>
public sealed class ProductsFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints)
    {
        ProductsEndpoints.Map(endpoints);
        SitePlanEndpoints.Map(endpoints);
    }
}
