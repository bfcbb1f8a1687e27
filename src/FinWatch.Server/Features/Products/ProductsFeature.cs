using FinWatch.Server.Features.Products;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>Products: nominal fin profile, gate configuration, specification limits and the model's inputs.</summary>
public sealed class ProductsFeature : IFeature
{
    public static void Map(IEndpointRouteBuilder endpoints) => ProductsEndpoints.Map(endpoints);
}
