using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// A batch refused as a whole (measurements or electrical tests): nothing was stored. <see cref="Errors"/> holds the
/// first problems; <see cref="ErrorCount"/> counts them all.
/// </summary>
public sealed record RejectedBatch(int RowsRead, int ErrorCount, IReadOnlyList<RowError> Errors)
{
    /// <summary>The problem type of every rejected batch.</summary>
    public const string ProblemType = "/problems/invalid-batch";

    /// <summary>A batch refused before a row was read, for one reason (a broken form, a bad query parameter).</summary>
    public static RejectedBatch Refused(RowError error) => new(0, 1, [error]);

    /// <summary>The one shape of a rejected batch: problem details listing each bad row, column, value and reason.</summary>
    public ProblemDetails ToProblem()
    {
        var shown = Errors.Count < ErrorCount ? $" The first {Errors.Count} are listed." : "";
        return new ProblemDetails
        {
            Type = ProblemType,
            Title = "The batch was rejected; nothing was stored.",
            Status = StatusCodes.Status400BadRequest,
            Detail = $"{ErrorCount} problem{(ErrorCount == 1 ? "" : "s")} in {RowsRead} row{(RowsRead == 1 ? "" : "s")} read.{shown} Correct them and send the whole batch again.",
            Extensions =
            {
                ["error_count"] = ErrorCount,
                ["rows_read"] = RowsRead,
                ["errors"] = Errors,
            },
        };
    }

    /// <summary>The 400 answer of <see cref="ToProblem"/>.</summary>
    public ProblemHttpResult ToResult() => TypedResults.Problem(ToProblem());
}
