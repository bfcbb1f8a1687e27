using System.Globalization;
using System.Text;
using FinWatch.Testing;
using FsCheck;
using FsCheck.Fluent;

namespace FinWatch.Server.Tests.Features.Measurements;

/// <summary>A generated request body and how it was made (shown when a property fails).</summary>
public sealed record FuzzBody(string Recipe, byte[] Bytes)
{
    public override string ToString()
    {
        var text = Encoding.UTF8.GetString(Bytes);
        var shown = text.Length > 400 ? text[..400] + $"… ({Bytes.Length} bytes)" : text;
        return $"{Recipe}: {shown.Replace("\r", "\\r", StringComparison.Ordinal).Replace("\n", "\\n", StringComparison.Ordinal)}";
    }
}

/// <summary>Marks a generated CSV body.</summary>
public sealed record CsvFuzz(FuzzBody Body)
{
    public override string ToString() => Body.ToString();
}

/// <summary>Marks a generated JSON body.</summary>
public sealed record JsonFuzz(FuzzBody Body)
{
    public override string ToString() => Body.ToString();
}

/// <summary>Marks a generated multipart form body with the Content-Type it is sent under.</summary>
public sealed record MultipartFuzz(string ContentType, FuzzBody Body)
{
    public override string ToString() => $"Content-Type: {ContentType}; {Body}";
}

/// <summary>
/// FsCheck generators of ingest bodies: random bytes; a valid CSV of a random invented lot, mutated (cells and lines
/// deleted, duplicated or swapped, cells replaced by hostile values, quotes broken, line ends mixed, BOMs, bytes
/// flipped, cut short); JSON of valid shape with wrong types, nested garbage, broken structure or cut short.
/// </summary>
public static class IngestFuzzGenerators
{
    // Hostile cell values: broken quoting, numbers beyond double, non-finite, other notations, odd unicode, times.
    private static readonly string[] HostileCells =
    [
        "\"", "\"unterminated", "a\"b", "\"\"", "\"\"\"", "\"6\"x", "1e308", "1e309", "-1e309", "1.7976931348623157E+308", "4.9E-324",
        "NaN", "nan", "Infinity", "-Infinity", "∞", "1,5", "0x10", "99999999999999999999999999999", "-0", "+6", " 6 ", "6nm",
        "", " ", "\t", "true", "null", "é", "𝔣𝔦𝔫", "\u200b", "\uFEFF", "\0", "\u0085", "\u2028", "a\nb", "a\rb",
        "2026-13-45T99:99:99Z", "2026-11-20T10:00:00", "9999-12-31T23:59:59Z", "0001-01-01T00:00:00Z", "2026-11-20T10:00:00+25:00",
        "2026-11-20", "1764000000", "-2147483649", "2147483648", "26", "0", "-1",
        new string('x', 70_000),
    ];

    // Edges of the measured values' ranges and spellings of zero (a "-0" radius once answered 500).
    private static readonly string[] EdgeValues = ["-0", "0", "0.0", "+0", "-0.0", "0e0", "-0e-5", "1e-300", "5e-324", "20", "50", "100", "300", "20.000000000000004"];

    private static readonly string[] LineEnds = ["\n", "\r\n", "\r", "\n\r", ""];

    private static readonly string[] HostileJsonValues =
    [
        "true", "false", "null", "[]", "{}", "[1,[2,[3,[{}]]]]", "{\"x\":[1,{\"y\":null}]}", "1e400", "-1e400", "0.1e-400",
        "123456789012345678901234567890", "-0", "\"\"", "\" \"", "\"NaN\"", "\"Infinity\"", "\"-Infinity\"", "\"\\ud800\"",
        "\"\\u0000\"", "\"é𝔣\"", "\"1,5\"", "\"6nm\"", "\"2026-11-20T10:00:00\"", "\"26\"", "26", "2.5", "-3", "1e308",
        "NaN", "Infinity", "'6'", "06", ".5", "\"" + new string('y', 70_000) + "\"",
    ];

    // Kinds of mutation that keep a batch valid (swap data lines, quote a cell, blank lines; reorder JSON properties,
    // send a measured value as text), so that some generated batches are accepted and the accepted branch is checked.
    private static readonly int[] HarmlessCsv = [5, 10, 11, 12, 12];
    private static readonly int[] HarmlessJson = [12, 13, 14, 14];

    public static Arbitrary<CsvFuzz> Csv() => Gen.Frequency(
            (2, RandomBytes()), (5, MutatedCsv(AnyMutation)), (2, FlippedBytes(ValidCsv())), (3, MutatedCsv(Harmless(HarmlessCsv))))
        .Select(b => new CsvFuzz(b)).ToArbitrary();

    public static Arbitrary<JsonFuzz> Json() => Gen.Frequency(
            (2, RandomBytes()), (5, MutatedJson(AnyMutation)), (2, FlippedBytes(ValidJson())), (3, MutatedJson(Harmless(HarmlessJson))))
        .Select(b => new JsonFuzz(b)).ToArbitrary();

    // A form with the CSV as a file part, with the framing broken in one of several ways, or bytes under a form type.
    public static Arbitrary<MultipartFuzz> Multipart() =>
        (from csv in Gen.OneOf(ValidCsv(), MutatedCsv(Harmless(HarmlessCsv)), RandomBytes())
         from boundary in Gen.Elements("b0undary", "\"quoted b\"", "", "a-very-long-boundary-" + new string('x', 80), "é")
         from framing in Gen.Choose(0, 9)
         from cut in Gen.Choose(0, 100_000)
         select Form(csv, boundary, framing, cut)).ToArbitrary();

    private static MultipartFuzz Form(FuzzBody csv, string boundary, int framing, int cut)
    {
        var b = boundary.Trim('"');
        var head = $"--{b}\r\nContent-Disposition: form-data; name=\"file\"; filename=\"lots.csv\"\r\nContent-Type: text/csv\r\n\r\n";
        var tail = $"\r\n--{b}--\r\n";
        var (prefix, suffix, recipe) = framing switch
        {
            0 => (head, tail, "form"),
            1 => (head, "", "form without closing boundary"),
            2 => ("", tail, "form without part header"),
            3 => ($"--{b}\r\nContent-Disposition: form-data; name=\"note\"\r\n\r\n", tail, "form with a field and no file part"),
            4 => (head.Replace("\r\n\r\n", "\r\n", StringComparison.Ordinal), tail, "form with part headers not ended"),
            5 => ($"--{b}\r\nContent-Disposition: form-data; name=\"file\"; filename=\"\u0000../x.csv\"\r\n\r\n", tail, "form with an odd file name"),
            6 => ($"--{b}\r\nContent-Disposition: garbage\r\n\r\n", tail, "form with a bad disposition"),
            7 => ($"--{b}\r\n" + new string('h', 20_000) + "\r\n\r\n", tail, "form with a huge part header"),
            8 => (head, tail, "form cut short"),
            _ => ("", "", "bytes sent as a form"),
        };
        var bytes = Encoding.UTF8.GetBytes(prefix).Concat(csv.Bytes).Concat(Encoding.UTF8.GetBytes(suffix)).ToArray();
        if (framing == 8)
        {
            bytes = bytes[..(cut % (bytes.Length + 1))];
        }

        var type = boundary.Length == 0 ? "multipart/form-data" : $"multipart/form-data; boundary={boundary}";
        return new MultipartFuzz(type, new FuzzBody($"{recipe} around {csv.Recipe}", bytes));
    }

    // Mostly fresh lots; sometimes one of four, so that a later case re-sends rows an earlier one stored.
    private static Gen<string> Lot { get; } = Gen.Frequency(
        (4, Gen.Choose(0, 999_999).Select(i => $"F{i:000000}")),
        (1, Gen.Choose(0, 3).Select(i => $"R{i:000000}")));

    private static List<List<string>> ValidCsvCells(string lot, int wafers, int sites)
    {
        var rows = SiteRow.Wafers(lot, wafers, sites, new DateTimeOffset(2026, 11, 20, 6, 0, 0, TimeSpan.Zero));
        return [[.. SiteRow.Columns], .. rows.Select(r => r.Values().Select(v => v ?? "").ToList())];
    }

    private static Gen<FuzzBody> ValidCsv() =>
        from lot in Lot
        from wafers in Gen.Choose(1, 3)
        from sites in Gen.Choose(1, 4)
        select new FuzzBody("valid csv", Encoding.UTF8.GetBytes(SiteRow.Csv(SiteRow.Wafers(lot, wafers, sites,
            new DateTimeOffset(2026, 11, 20, 6, 0, 0, TimeSpan.Zero)))));

    private static Gen<FuzzBody> ValidJson() =>
        from lot in Lot
        from wafers in Gen.Choose(1, 3)
        from sites in Gen.Choose(1, 4)
        select new FuzzBody("valid json", Encoding.UTF8.GetBytes(SiteRow.Json(SiteRow.Wafers(lot, wafers, sites,
            new DateTimeOffset(2026, 11, 20, 6, 0, 0, TimeSpan.Zero)))));

    private static Gen<FuzzBody> RandomBytes() =>
        Gen.OneOf(
            Gen.Constant(Array.Empty<byte>()),
            Gen.Choose(0, 255).Select(i => (byte)i).ArrayOf(),
            Gen.Elements((byte)'"', (byte)',', (byte)'\n', (byte)'\r', (byte)'[', (byte)'{', (byte)'a', (byte)0xEF, (byte)0xBB, (byte)0xBF, (byte)0xC3).ArrayOf())
        .Select(b => new FuzzBody("random bytes", b));

    // Random byte positions overwritten with random bytes (often invalid UTF-8), or the body cut at a random point.
    private static Gen<FuzzBody> FlippedBytes(Gen<FuzzBody> valid) =>
        from body in valid
        from count in Gen.Choose(0, 4)
        from flips in Gen.Zip(Gen.Choose(0, 100_000), Gen.Choose(0, 255)).ListOf(count)
        from cut in Gen.Frequency((2, Gen.Constant(-1)), (1, Gen.Choose(0, 100_000)))
        select Flip(body, flips, cut);

    private static FuzzBody Flip(FuzzBody body, IEnumerable<(int Position, int Value)> flips, int cut)
    {
        var bytes = body.Bytes.ToArray();
        var recipe = new StringBuilder(body.Recipe);
        foreach (var (position, value) in flips)
        {
            var at = position % bytes.Length;
            bytes[at] = (byte)value;
            recipe.Append(CultureInfo.InvariantCulture, $", byte {at} = 0x{value:x2}");
        }

        if (cut >= 0)
        {
            bytes = bytes[..(cut % (bytes.Length + 1))];
            recipe.Append(CultureInfo.InvariantCulture, $", cut at {bytes.Length}");
        }

        return new FuzzBody(recipe.ToString(), bytes);
    }

    private sealed record Mutation(int Kind, int A, int B, int C);

    private static Gen<Mutation> AnyMutation { get; } =
        from kind in Gen.Choose(0, 11)
        from a in Gen.Choose(0, 1_000)
        from b in Gen.Choose(0, 1_000)
        from c in Gen.Choose(0, 1_000)
        select new Mutation(kind, a, b, c);

    private static Gen<Mutation> Harmless(int[] kinds) =>
        from kind in Gen.Elements(kinds)
        from a in Gen.Choose(1, 1_000)
        from b in Gen.Choose(0, 1_000)
        from c in Gen.Choose(1, 1_000)
        select new Mutation(kind, a, b, c);

    private static Gen<FuzzBody> MutatedCsv(Gen<Mutation> mutation) =>
        from lot in Lot
        from wafers in Gen.Choose(1, 3)
        from sites in Gen.Choose(1, 4)
        from count in Gen.Choose(0, 6)
        from mutations in mutation.ListOf(count)
        from unicode in ArbMap.Default.GeneratorFor<string>()
        from bom in Gen.Elements(0, 0, 0, 1, 2)
        from ends in Gen.Elements(LineEnds).ArrayOf().Select(e => mutation == AnyMutation ? e : e.Where(x => x.Length > 0).ToArray())
        select MutateCsv(ValidCsvCells(lot, wafers, sites), mutations, unicode ?? "", bom, ends);

    private static FuzzBody MutateCsv(List<List<string>> lines, IEnumerable<Mutation> mutations, string unicode, int bom, string[] ends)
    {
        var recipe = new StringBuilder("csv");
        foreach (var m in mutations)
        {
            if (lines.Count == 0)
            {
                break;
            }

            var line = lines[m.A % lines.Count];
            var cell = line.Count == 0 ? 0 : m.B % line.Count;
            switch (m.Kind)
            {
                case 0 when line.Count > 0:
                    line.RemoveAt(cell);
                    recipe.Append(CultureInfo.InvariantCulture, $", delete cell {cell} of line {m.A % lines.Count}");
                    break;
                case 1 when line.Count > 0:
                    line.Insert(cell, line[cell]);
                    recipe.Append(CultureInfo.InvariantCulture, $", duplicate cell {cell} of line {m.A % lines.Count}");
                    break;
                case 2 when line.Count > 0:
                    var other = m.C % line.Count;
                    (line[cell], line[other]) = (line[other], line[cell]);
                    recipe.Append(CultureInfo.InvariantCulture, $", swap cells {cell} and {other} of line {m.A % lines.Count}");
                    break;
                case 3:
                    lines.RemoveAt(m.A % lines.Count);
                    recipe.Append(CultureInfo.InvariantCulture, $", delete line {m.A % (lines.Count + 1)}");
                    break;
                case 4:
                    lines.Insert(m.A % lines.Count, [.. line]);
                    recipe.Append(CultureInfo.InvariantCulture, $", duplicate line {m.A % lines.Count}");
                    break;
                case 5:
                    var j = m.C % lines.Count;
                    (lines[m.A % lines.Count], lines[j]) = (lines[j], lines[m.A % lines.Count]);
                    recipe.Append(CultureInfo.InvariantCulture, $", swap lines {m.A % lines.Count} and {j}");
                    break;
                case 6 or 7 or 8 when line.Count > 0:
                    line[cell] = HostileCells[m.C % HostileCells.Length];
                    recipe.Append(CultureInfo.InvariantCulture, $", cell {cell} of line {m.A % lines.Count} = hostile {m.C % HostileCells.Length}");
                    break;
                case 9 when line.Count > 0:
                    line[cell] = unicode;
                    recipe.Append(CultureInfo.InvariantCulture, $", cell {cell} of line {m.A % lines.Count} = generated text");
                    break;
                case 10 when line.Count > 0:
                    line[cell] = "\"" + line[cell].Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
                    recipe.Append(CultureInfo.InvariantCulture, $", quote cell {cell} of line {m.A % lines.Count}");
                    break;
                case 11:
                    lines.Insert(m.A % lines.Count, []);
                    recipe.Append(CultureInfo.InvariantCulture, $", empty line at {m.A % lines.Count}");
                    break;
                case 12 when line.Count == SiteRow.Columns.Length && m.A % lines.Count > 0:
                    var measured = 14 + (m.B % 5);
                    line[measured] = EdgeValues[m.C % EdgeValues.Length];
                    recipe.Append(CultureInfo.InvariantCulture, $", cell {measured} of line {m.A % lines.Count} = {line[measured]}");
                    break;
            }
        }

        var text = new StringBuilder();
        if (bom == 1)
        {
            text.Append('\uFEFF');
            recipe.Append(", BOM");
        }

        for (var i = 0; i < lines.Count; i++)
        {
            if (bom == 2 && i == 1)
            {
                text.Append('\uFEFF');
                recipe.Append(", BOM in line 1");
            }

            text.Append(string.Join(',', lines[i])).Append(ends.Length == 0 ? "\n" : ends[i % ends.Length]);
        }

        if (ends.Length > 0)
        {
            recipe.Append(", line ends ").Append(string.Join('|', ends.Select(e => e.Replace("\r", "CR", StringComparison.Ordinal).Replace("\n", "LF", StringComparison.Ordinal))));
        }

        return new FuzzBody(recipe.ToString(), Encoding.UTF8.GetBytes(text.ToString()));
    }

    private static Gen<FuzzBody> MutatedJson(Gen<Mutation> mutation) =>
        from lot in Lot
        from wafers in Gen.Choose(1, 3)
        from sites in Gen.Choose(1, 3)
        from count in Gen.Choose(0, 6)
        from mutations in mutation.ListOf(count)
        from wrap in mutation == AnyMutation ? Gen.Choose(0, 9) : Gen.Elements(5, 9)
        from unicode in ArbMap.Default.GeneratorFor<string>()
        select MutateJson(lot, wafers, sites, mutations, wrap, unicode ?? "");

    // The batch as a list of objects of (name, raw JSON value) pairs, so that any text can be put in a value's place.
    private static FuzzBody MutateJson(string lot, int wafers, int sites, IEnumerable<Mutation> mutations, int wrap, string unicode)
    {
        var rows = SiteRow.Wafers(lot, wafers, sites, new DateTimeOffset(2026, 11, 20, 6, 0, 0, TimeSpan.Zero)).ToList();
        var elements = rows.Select(r => (Raw: (string?)null, Props: r.Values().Select((v, i) => (Name: SiteRow.Columns[i], Value: RawJson(SiteRow.Columns[i], v))).ToList())).ToList();
        var recipe = new StringBuilder("json");
        foreach (var m in mutations)
        {
            if (elements.Count == 0)
            {
                break;
            }

            var e = elements[m.A % elements.Count];
            var props = e.Props;
            var p = props.Count == 0 ? 0 : m.B % props.Count;
            switch (m.Kind)
            {
                case 0 or 1 or 2 or 3 when props.Count > 0:
                    props[p] = (props[p].Name, HostileJsonValues[m.C % HostileJsonValues.Length]);
                    recipe.Append(CultureInfo.InvariantCulture, $", {props[p].Name} of element {m.A % elements.Count} = hostile {m.C % HostileJsonValues.Length}");
                    break;
                case 4 when props.Count > 0:
                    props.RemoveAt(p);
                    recipe.Append(CultureInfo.InvariantCulture, $", delete property {p} of element {m.A % elements.Count}");
                    break;
                case 5 when props.Count > 0:
                    props.Insert(p, props[p]);
                    recipe.Append(CultureInfo.InvariantCulture, $", duplicate property {p} of element {m.A % elements.Count}");
                    break;
                case 6 when props.Count > 0:
                    props[p] = (unicode, props[p].Value);
                    recipe.Append(CultureInfo.InvariantCulture, $", rename property {p} of element {m.A % elements.Count} to generated text");
                    break;
                case 7 when props.Count > 0:
                    props[p] = (props[p].Name, System.Text.Json.JsonSerializer.Serialize(unicode));
                    recipe.Append(CultureInfo.InvariantCulture, $", {props[p].Name} of element {m.A % elements.Count} = generated text");
                    break;
                case 8:
                    elements[m.A % elements.Count] = (HostileJsonValues[m.C % HostileJsonValues.Length], props);
                    recipe.Append(CultureInfo.InvariantCulture, $", element {m.A % elements.Count} = hostile {m.C % HostileJsonValues.Length}");
                    break;
                case 9:
                    elements.Insert(m.A % elements.Count, (null, [.. props]));
                    recipe.Append(CultureInfo.InvariantCulture, $", duplicate element {m.A % elements.Count}");
                    break;
                case 10:
                    elements.RemoveAt(m.A % elements.Count);
                    recipe.Append(", delete an element");
                    break;
                case 11 when props.Count > 0:
                    props[p] = (props[p].Name, "{\"" + props[p].Name + "\":" + props[p].Value + "}");
                    recipe.Append(CultureInfo.InvariantCulture, $", nest {props[p].Name} of element {m.A % elements.Count} in an object");
                    break;
                case 12 when props.Count > 0:
                    var q = m.C % props.Count;
                    (props[p], props[q]) = (props[q], props[p]);
                    recipe.Append(CultureInfo.InvariantCulture, $", swap properties {p} and {q} of element {m.A % elements.Count}");
                    break;
                case 13 when props.Count > 0 && props[p].Value.Length > 0 && props[p].Value[0] is '-' or (>= '0' and <= '9'):
                    props[p] = (props[p].Name, "\"" + props[p].Value + "\"");
                    recipe.Append(CultureInfo.InvariantCulture, $", {props[p].Name} of element {m.A % elements.Count} as text");
                    break;
                case 14 when props.Count > 0 && props[p].Name.EndsWith("_nm", StringComparison.Ordinal):
                    props[p] = (props[p].Name, EdgeValues[m.C % EdgeValues.Length].TrimStart('+'));
                    recipe.Append(CultureInfo.InvariantCulture, $", {props[p].Name} of element {m.A % elements.Count} = {props[p].Value}");
                    break;
            }
        }

        var array = "[" + string.Join(",", elements.Select(e => e.Raw ?? "{" + string.Join(",", e.Props.Select(p =>
            System.Text.Json.JsonSerializer.Serialize(p.Name) + ":" + p.Value)) + "}")) + "]";
        var text = wrap switch
        {
            0 => "{\"rows\":" + array + "}",
            1 => "[" + array + "]",
            2 => array[..(array.Length / 2)],
            3 => array + "]",
            4 => array + " trailing",
            5 => "\uFEFF" + array,
            _ => array,
        };
        if (wrap <= 5)
        {
            recipe.Append(CultureInfo.InvariantCulture, $", wrap {wrap}");
        }

        return new FuzzBody(recipe.ToString(), Encoding.UTF8.GetBytes(text));
    }

    private static string RawJson(string column, string? value) =>
        value is null ? "null"
        : (column.EndsWith("_nm", StringComparison.Ordinal) || column.EndsWith("_mm", StringComparison.Ordinal) || column == "wafer_slot") ? value
        : System.Text.Json.JsonSerializer.Serialize(value);
}
