using System.Net;
using System.Net.Http.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Products;

public class ProductsEndpointsTests : IntegrationTest
{
    protected override bool CreateProducts => false;

    [Fact]
    public async Task PostProduct_Valid_Returns201AndIsListed()
    {
        var response = await Client.PostAsJsonAsync("/api/products", TestProducts.Request("P1"));
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal("/api/products/P1", response.Headers.Location?.OriginalString);
        var list = await ReadJsonAsync(await Client.GetAsync("/api/products"));
        var p = Assert.Single(list.EnumerateArray());
        Assert.Equal("P1", p.GetProperty("code").GetString());
        Assert.Equal("tri-gate", p.GetProperty("gate_faces").GetString());
        Assert.Equal(42.0, p.GetProperty("nominal").GetProperty("fin_height_nm").GetDouble());
        var spec = Assert.Single(p.GetProperty("specs").EnumerateArray());
        Assert.Equal("taper_deg", spec.GetProperty("parameter").GetString());
        Assert.Equal(JsonValueKindNull, spec.GetProperty("lower").ValueKind);
        Assert.Equal(4.0, spec.GetProperty("upper").GetDouble());
    }

    private const System.Text.Json.JsonValueKind JsonValueKindNull = System.Text.Json.JsonValueKind.Null;

    [Fact]
    public async Task PutProduct_ChangesSpecsAndNominal()
    {
        await Client.PostAsJsonAsync("/api/products", TestProducts.Request("P2"));
        var specs = new[]
        {
            new { parameter = "top_width_nm", lower = (double?)5.0, target = (double?)6.0, upper = (double?)7.0 },
            new { parameter = "corner_radius_nm", lower = (double?)null, target = (double?)null, upper = (double?)3.5 },
        };
        var response = await Client.PutAsJsonAsync("/api/products/P2", TestProducts.Request("P2", "double-gate", specs));
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var p = await ReadJsonAsync(await Client.GetAsync("/api/products/P2"));
        Assert.Equal("double-gate", p.GetProperty("gate_faces").GetString());
        Assert.Equal(2, p.GetProperty("specs").GetArrayLength());
        Assert.Equal("top_width_nm", p.GetProperty("specs")[0].GetProperty("parameter").GetString());
    }

    [Fact]
    public async Task PostProduct_DuplicateCode_Returns409()
    {
        await Client.PostAsJsonAsync("/api/products", TestProducts.Request("P3"));
        var response = await Client.PostAsJsonAsync("/api/products", TestProducts.Request("P3"));
        Assert.Equal(HttpStatusCode.Conflict, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task GetProduct_Unknown_Returns404Problem()
    {
        var response = await Client.GetAsync("/api/products/NOPE");
        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        var problem = await ReadJsonAsync(response);
        Assert.Contains("NOPE", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    public static TheoryData<string, object, string> Invalid => new()
    {
        { "unknown gate faces", TestProducts.Request("X1", "quad-gate"), "gate_faces" },
        { "unknown parameter", TestProducts.Request("X2", specs: new[] { new { parameter = "colour", lower = 1.0, target = 2.0, upper = 3.0 } }), "specs[0].parameter" },
        { "lower above upper", TestProducts.Request("X3", specs: new[] { new { parameter = "taper_deg", lower = 5.0, target = 4.0, upper = 3.0 } }), "specs[0]" },
        { "no limit given", TestProducts.Request("X4", specs: new[] { new { parameter = "taper_deg", lower = (double?)null, target = (double?)null, upper = (double?)null } }), "specs[0]" },
        { "bad code", TestProducts.Request("has space"), "code" },
    };

    [Theory]
    [MemberData(nameof(Invalid))]
    public async Task PostProduct_Invalid_Returns400NamingTheField(string name, object request, string field)
    {
        var response = await Client.PostAsJsonAsync("/api/products", request);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.BadRequest, $"{name}: {(int)response.StatusCode} {body}");
        var problem = System.Text.Json.JsonDocument.Parse(body).RootElement;
        var keys = problem.GetProperty("errors").EnumerateObject().Select(p => p.Name).ToList();
        Assert.True(keys.Contains(field), $"{name}: expected {field} in {string.Join(", ", keys)}");
    }

    [Fact]
    public async Task PostProduct_NominalRadiusLargerThanTopAllows_Returns400()
    {
        var request = new
        {
            code = "X5",
            name = "too round",
            gate_faces = "tri-gate",
            // r_max = (Wt/2)·tan(45° + θ/2) ≈ 3.15 nm for Wt 6, Wb 10, H 42 (docs/model.md §A.4).
            nominal = new { top_width_nm = 6.0, bottom_width_nm = 10.0, fin_height_nm = 42.0, corner_radius_nm = 3.5, liner_thickness_nm = 2.5 },
        };
        var response = await Client.PostAsJsonAsync("/api/products", request);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("nominal.corner_radius_nm", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }
}
