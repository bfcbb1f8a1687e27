using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// One row as read from a file, before validation: the cells as text, indexed by <see cref="IngestColumn"/>
/// (null where the column is absent or the cell empty), and any structural problems the reader found in it.
/// </summary>
/// <param name="Row">Row number as a user sees it: CSV counts the header as row 1; JSON counts array elements from 1.</param>
/// <param name="Line">Line of the file where the row starts.</param>
public sealed record RawRow(int Row, long Line, string?[] Cells, IReadOnlyList<RowError>? Problems = null);
