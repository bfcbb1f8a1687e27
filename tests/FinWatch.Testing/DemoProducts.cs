using System.Net.Http.Json;
using FinWatch.Physics;
using FinWatch.SeedDemo;

namespace FinWatch.Testing;

/// <summary>The invented demo fab's products (<see cref="DemoFab.Products"/>), created through POST /api/products.</summary>
public static class DemoProducts
{
    public static async Task CreateAsync(HttpClient http)
    {
        foreach (var p in DemoFab.Products)
        {
            var response = await http.PostAsJsonAsync("/api/products", new
            {
                code = p.Code,
                name = p.Name,
                description = p.Description,
                gate_faces = GateFacesText.ToText(p.GateFaces),
                nominal = new
                {
                    top_width_nm = p.Nominal.TopWidthNm,
                    bottom_width_nm = p.Nominal.BottomWidthNm,
                    fin_height_nm = p.Nominal.FinHeightNm,
                    corner_radius_nm = p.Nominal.CornerRadiusNm,
                    liner_thickness_nm = p.Nominal.LinerThicknessNm,
                },
            });
            response.EnsureSuccessStatusCode();
        }
    }

    /// <summary>
    /// Writes the demo fab's last <paramref name="days"/> days as one ingest CSV (the demo writer's own output) and
    /// returns the number of data rows per lot in it.
    /// </summary>
    public static Dictionary<string, int> WriteCsv(string path, int days)
    {
        using (var file = new StreamWriter(path, false, new System.Text.UTF8Encoding(false), 1 << 16))
        {
            DemoFab.WriteMeasurementsCsv(file, DemoFab.DefaultSeed, new DemoScale(days));
        }

        var lots = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var line in File.ReadLines(path).Skip(1))
        {
            var lot = line[..line.IndexOf(',', StringComparison.Ordinal)];
            lots[lot] = lots.GetValueOrDefault(lot) + 1;
        }

        return lots;
    }
}
