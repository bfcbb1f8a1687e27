using Microsoft.AspNetCore.Http.Features;
using Microsoft.AspNetCore.WebUtilities;
using Microsoft.Net.Http.Headers;

namespace FinWatch.Server.Infrastructure.Csv;

/// <summary>
/// A CSV file sent to an endpoint either as the request body (text/csv) or as the first file part of a multipart
/// form, read as it arrives. Measurements and electrical-test calibrations both take their files this way.
/// </summary>
public static class CsvUpload
{
    /// <summary>The stored length of an uploaded file's name (ingest_batches.label, model_parameter_sets.source_name).</summary>
    public const int MaxFileNameLength = 260;

    private const string NoFilePart = "the multipart form has no file part; send the CSV as a form file or as the request body";

    /// <summary>An opened upload: the file's stream and name, or why there is none (a row error on row 1).</summary>
    public sealed record Opened(Stream? Stream, string? Name, RowError? Refusal);

    /// <summary>
    /// The request body, or the first file part of a multipart form with the file's name, with the body limit raised
    /// to <paramref name="maxBodyBytes"/>. A form that is broken or holds no file part gives a <see cref="Opened.Refusal"/>.
    /// A form broken later, inside the file part, throws <see cref="InvalidDataException"/> from the stream.
    /// </summary>
    public static async Task<Opened> OpenAsync(HttpContext http, long maxBodyBytes, CancellationToken cancellationToken)
    {
        try
        {
            var (stream, name) = await OpenFileAsync(http, maxBodyBytes, cancellationToken);
            return stream is null ? new(null, null, RowError.For(1, null, null, NoFilePart)) : new(stream, name, null);
        }
        catch (InvalidDataException e)
        {
            return new(null, null, RowError.For(1, null, null, "the multipart form is broken: " + e.Message));
        }
    }

    private static async Task<(Stream? Stream, string? Name)> OpenFileAsync(HttpContext http, long maxBodyBytes, CancellationToken cancellationToken)
    {
        AllowLargeBody(http, maxBodyBytes);
        var request = http.Request;
        if (!MediaTypeHeaderValue.TryParse(request.ContentType, out var type)
            || !type.MediaType.Equals("multipart/form-data", StringComparison.OrdinalIgnoreCase))
        {
            return (request.Body, null);
        }

        var boundary = HeaderUtilities.RemoveQuotes(type.Boundary).Value;
        if (string.IsNullOrEmpty(boundary))
        {
            return (null, null);
        }

        var reader = new MultipartReader(boundary, request.Body);
        while (await NextSectionAsync(reader, cancellationToken) is { } section)
        {
            if (ContentDispositionHeaderValue.TryParse(section.ContentDisposition, out var disposition) && disposition.IsFileDisposition())
            {
                // Kept as the batch label or calibration source (260 characters): PostgreSQL refuses longer text, SQLite would not.
                var file = Path.GetFileName(HeaderUtilities.RemoveQuotes(disposition.FileName).Value);
                return (new MultipartFileStream(section.Body), file is { Length: > MaxFileNameLength } ? file[..MaxFileNameLength] : file);
            }
        }

        return (null, null);
    }

    /// <summary>Raises this request's body limit from the server-wide default (uploads are larger than other requests).</summary>
    public static void AllowLargeBody(HttpContext http, long maxBodyBytes)
    {
        if (http.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } limit)
        {
            limit.MaxRequestBodySize = maxBodyBytes;
        }
    }

    // A broken form (cut short, a header line over the reader's limit) is the sender's fault: InvalidDataException.
    private static async Task<MultipartSection?> NextSectionAsync(MultipartReader reader, CancellationToken cancellationToken)
    {
        try
        {
            return await reader.ReadNextSectionAsync(cancellationToken);
        }
        catch (IOException e) when (e.GetType() == typeof(IOException))
        {
            throw new InvalidDataException(MultipartFileStream.CutShort, e);
        }
    }
}
