using System.Net.Http.Json;

namespace FinWatch.Testing;

/// <summary>Invented test products, created through the API as a user would.</summary>
public static class TestProducts
{
    public const string TriGate = "TP-TRI";
    public const string DoubleGate = "TP-DG";

    public static object Request(string code, string faces = "tri-gate", object? specs = null) => new
    {
        code,
        name = "Test product " + code,
        description = "invented for tests",
        gate_faces = faces,
        nominal = new { top_width_nm = 6.0, bottom_width_nm = 10.0, fin_height_nm = 42.0, corner_radius_nm = 2.0, liner_thickness_nm = 2.5 },
        specs = specs ?? new[] { new { parameter = "taper_deg", lower = (double?)null, target = (double?)2.7, upper = (double?)4.0 } },
    };

    /// <summary>Creates the tri-gate and the double-gate test products.</summary>
    public static async Task CreateBothAsync(HttpClient client)
    {
        (await client.PostAsJsonAsync("/api/products", Request(TriGate))).EnsureSuccessStatusCode();
        (await client.PostAsJsonAsync("/api/products", Request(DoubleGate, "double-gate"))).EnsureSuccessStatusCode();
    }
}
