using FinWatch.Server.Features.Audit;
using FinWatch.Server.Features.Access;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Products;

public static class ProductsEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/products").WithTags("Products").ValidateRequests();
        group.MapGet("/", ListAsync).RequireAuthorization(Permissions.Floor).WithSummary("All products with nominal profile and specification limits");
        group.MapGet("/{code}", GetAsync).RequireAuthorization(Permissions.Floor).WithSummary("One product");
        group.MapPost("/", CreateAsync).RequireAuthorization(Permissions.Engineer).WithSummary("Create a product");
        group.MapPut("/{code}", UpdateAsync).RequireAuthorization(Permissions.Engineer).WithSummary("Replace a product's name, description, gate faces, nominal profile and specifications");
    }

    private static async Task<Ok<List<ProductResponse>>> ListAsync(FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var products = await db.Products.AsNoTracking().Include(p => p.Specs).OrderBy(p => p.Code).ToListAsync(cancellationToken);
        return TypedResults.Ok(products.Select(ToResponse).ToList());
    }

    private static async Task<Results<Ok<ProductResponse>, ProblemHttpResult>> GetAsync(
        string code, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var product = await db.Products.AsNoTracking().Include(p => p.Specs).SingleOrDefaultAsync(p => p.Code == code, cancellationToken);
        return product is null ? NotFound(code) : TypedResults.Ok(ToResponse(product));
    }

    private static async Task<Results<Created<ProductResponse>, ProblemHttpResult>> CreateAsync(
        ProductRequest request, FinWatchDbContext db, TimeProvider clock, HttpContext http, CancellationToken cancellationToken)
    {
        if (await db.Products.AnyAsync(p => p.Code == request.Code, cancellationToken))
        {
            return TypedResults.Problem(new ProblemDetails
            {
                Type = "/problems/product-exists",
                Title = "A product with this code exists already.",
                Status = StatusCodes.Status409Conflict,
                Detail = $"Product '{request.Code}' exists; change it with PUT /api/products/{request.Code}.",
            });
        }

        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var product = new Product { Code = request.Code, Name = request.Name, CreatedAtMs = now };
        Apply(product, request, now);
        db.Products.Add(product);
        AuditLog.Add(db, http.User.Who(), "product", product.Code, "created", null, ToResponse(product), clock);
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Created($"/api/products/{product.Code}", ToResponse(product));
    }

    private static async Task<Results<Ok<ProductResponse>, ValidationProblem, ProblemHttpResult>> UpdateAsync(
        string code, ProductRequest request, FinWatchDbContext db, TimeProvider clock, HttpContext http, CancellationToken cancellationToken)
    {
        if (request.Code != code)
        {
            return Problems.Invalid("code", $"the code in the body ('{request.Code}') differs from the one in the path ('{code}'); codes cannot be renamed");
        }

        var product = await db.Products.Include(p => p.Specs).SingleOrDefaultAsync(p => p.Code == code, cancellationToken);
        if (product is null)
        {
            return NotFound(code);
        }

        var before = ToResponse(product);
        Apply(product, request, clock.GetUtcNow().ToUnixTimeMilliseconds());
        AuditLog.Add(db, http.User.Who(), "product", product.Code, "changed", before, ToResponse(product), clock); // specifications included
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Ok(ToResponse(product));
    }

    internal static ProblemHttpResult NotFound(string code) => Problems.NotFound("No such product.", $"There is no product with code '{code}'.");

    private static void Apply(Product product, ProductRequest request, long nowMs)
    {
        product.Name = request.Name;
        product.Description = request.Description ?? "";
        product.GateFaces = GateFacesText.Parse(request.GateFaces);
        product.NominalTopWidthNm = request.Nominal.TopWidthNm;
        product.NominalBottomWidthNm = request.Nominal.BottomWidthNm;
        product.NominalFinHeightNm = request.Nominal.FinHeightNm;
        product.NominalCornerRadiusNm = request.Nominal.CornerRadiusNm;
        product.NominalLinerThicknessNm = request.Nominal.LinerThicknessNm;
        var model = request.Model ?? new ModelInputs();
        product.ModelEotNm = model.EotNm;
        product.ModelGateLengthNm = model.GateLengthNm;
        product.ModelChannelDopingCm3 = model.ChannelDopingCm3;
        product.ModelSidewallOrientation = model.SidewallOrientation;
        product.UpdatedAtMs = nowMs;
        product.Specs.Clear();
        foreach (var s in request.Specs ?? [])
        {
            product.Specs.Add(new SpecLimit { Parameter = s.Parameter, Lower = s.Lower, Target = s.Target, Upper = s.Upper });
        }
    }

    internal static ProductResponse ToResponse(Product p) => new(
        p.Code, p.Name, p.Description, GateFacesText.ToText(p.GateFaces),
        new NominalProfile(p.NominalTopWidthNm, p.NominalBottomWidthNm, p.NominalFinHeightNm, p.NominalCornerRadiusNm, p.NominalLinerThicknessNm),
        p.Specs.OrderBy(s => FinParameters.Position(s.Parameter))
            .Select(s => new SpecLimitDto(s.Parameter, s.Lower, s.Target, s.Upper)).ToList(),
        new ModelInputs(p.ModelEotNm, p.ModelGateLengthNm, p.ModelChannelDopingCm3, p.ModelSidewallOrientation),
        Time.FromMs(p.CreatedAtMs), Time.FromMs(p.UpdatedAtMs));
}
