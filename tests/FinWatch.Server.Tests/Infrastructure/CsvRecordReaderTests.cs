using System.Text;
using FinWatch.Testing;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Server.Tests.Infrastructure;

/// <summary>RFC 4180 (Common Format and MIME Type for CSV Files) cases, checked field by field.</summary>
public class CsvRecordReaderTests
{
    private static async Task<List<List<string>>> ReadAllAsync(string text) => await ReadAllAsync(Encoding.UTF8.GetBytes(text));

    private static async Task<List<List<string>>> ReadAllAsync(byte[] bytes)
    {
        using var reader = new CsvRecordReader(new MemoryStream(bytes));
        var records = new List<List<string>>();
        var fields = new List<string>();
        while (await reader.ReadRecordAsync(fields, CancellationToken.None))
        {
            records.Add([.. fields]);
        }

        return records;
    }

    [Fact]
    public async Task Read_QuotedFieldsWithCommasQuotesAndLineBreaks_FollowsRfc4180()
    {
        // RFC 4180 §2.5–2.7: fields may be quoted; a quoted field may hold commas and line breaks; "" is one quote.
        var records = await ReadAllAsync("a,\"b,c\",\"say \"\"hi\"\"\"\r\n\"line\nbreak\",,x\r\n");
        Assert.Equal(2, records.Count);
        Assert.Equal(["a", "b,c", "say \"hi\""], records[0]);
        Assert.Equal(["line\nbreak", "", "x"], records[1]);
    }

    [Theory]
    [InlineData("a,b\nc,d\n")]
    [InlineData("a,b\r\nc,d\r\n")]
    [InlineData("a,b\rc,d\r")]
    [InlineData("a,b\nc,d")]
    [InlineData("a,b\n\n\nc,d\n")]
    public async Task Read_AnyLineEnding_GivesTheSameRecords(string text)
    {
        var records = await ReadAllAsync(text);
        Assert.Equal([["a", "b"], ["c", "d"]], records);
    }

    [Fact]
    public async Task Read_Utf8Bom_IsSkipped()
    {
        var records = await ReadAllAsync([0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes("lot_id\nÅ1\n")]);
        Assert.Equal("lot_id", records[0][0]);
        Assert.Equal("Å1", records[1][0]);
    }

    [Fact]
    public async Task Read_RecordLongerThanLimit_Throws()
    {
        var e = await Assert.ThrowsAsync<CsvFormatException>(() => ReadAllAsync(new string('x', CsvRecordReader.MaxRecordChars + 1)));
        Assert.Equal(1, e.Row);
    }

    [Fact]
    public async Task Read_InvalidUtf8_ReportsItsLine()
    {
        var e = await Assert.ThrowsAsync<CsvFormatException>(() => ReadAllAsync([.. Encoding.ASCII.GetBytes("a\nb\nc"), 0xFF, .. Encoding.ASCII.GetBytes("\n")]));
        Assert.Equal(3, e.Row);
        Assert.Equal(3, e.Line);
    }

    [Fact]
    public async Task Read_TextAfterClosingQuote_Throws()
    {
        var e = await Assert.ThrowsAsync<CsvFormatException>(() => ReadAllAsync("a\n\"b\"c,d\n"));
        Assert.Equal(2, e.Row);
    }

    [Fact]
    public async Task Read_LargeInput_CrossesBufferBoundariesIntact()
    {
        // 200,000 records of varying length straddle the 64 Ki-character buffer many times, CR LF pairs included.
        var sb = new StringBuilder();
        for (var i = 0; i < 200_000; i++)
        {
            sb.Append(i).Append(",\"q").Append(i % 7).Append("\"\r\n");
        }

        var records = await ReadAllAsync(sb.ToString());
        Assert.Equal(200_000, records.Count);
        Assert.Equal(["199999", "q" + (199_999 % 7)], records[^1]);
        Assert.All(records, r => Assert.Equal(2, r.Count));
    }

    // Found by IngestFuzzTests (a body ending in CR answered 500): after a CR that was the last character read so far,
    // the reader refilled synchronously, which ASP.NET Core refuses for a request body; a CRLF split between two reads
    // of an upload took the same path. The stream here hands out a few bytes per read and throws on a synchronous read,
    // as Kestrel's request body does; RFC 4180 §2.1 gives the records.
    [Theory]
    [InlineData(1)]
    [InlineData(4)]
    [InlineData(3)]
    public async Task Read_CrLfSplitBetweenAsyncReads_ReadsRecordsWithoutSynchronousRead(int bytesPerRead)
    {
        using var reader = new CsvRecordReader(new TrickleStream(Encoding.UTF8.GetBytes("a,b\r\nc,d\r\n\"e\"\r\n"), bytesPerRead));
        var records = new List<List<string>>();
        var fields = new List<string>();
        while (await reader.ReadRecordAsync(fields, CancellationToken.None))
        {
            records.Add([.. fields]);
        }

        Assert.Equal([["a", "b"], ["c", "d"], ["e"]], records);
    }
}
