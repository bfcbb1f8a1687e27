using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// The problem answers the endpoints share: a request that fails validation (400, <c>errors</c> keyed by the JSON field
/// path in snake_case), a thing that does not exist (404 with a <c>detail</c> that names it) and a step the procedure
/// does not allow (403).
/// </summary>
public static class Problems
{
    /// <summary>400 problem+json with <c>errors</c>; <paramref name="type"/> and a <c>detail</c> joined from the messages when asked.</summary>
    public static ValidationProblem Invalid(ValidationErrors errors, string? type = null, bool detailFromMessages = false) =>
        TypedResults.ValidationProblem(errors.ToDictionary(), type: type,
            detail: detailFromMessages ? string.Join(" ", errors.ToDictionary().SelectMany(e => e.Value)) : null);

    /// <summary>400 problem+json for one field.</summary>
    public static ValidationProblem Invalid(string field, string message) => Invalid(new ValidationErrors { [field] = message });

    /// <summary>The message when a product code names no product; the field that gave it is the key.</summary>
    public static string NotAProduct(string? code) => $"'{code}' is not a product code";

    /// <summary>404 problem+json: <paramref name="title"/> says what kind of thing, <paramref name="detail"/> names it.</summary>
    public static ProblemHttpResult NotFound(string title, string detail) => TypedResults.Problem(new ProblemDetails
    {
        Type = "/problems/not-found",
        Title = title,
        Status = StatusCodes.Status404NotFound,
        Detail = detail,
    });

    /// <summary>403 problem+json for a rule of the fab's procedure, not of the role: <paramref name="detail"/> says which and what to do.</summary>
    public static ProblemHttpResult Forbidden(string title, string detail) => TypedResults.Problem(new ProblemDetails
    {
        Type = "/problems/not-allowed",
        Title = title,
        Status = StatusCodes.Status403Forbidden,
        Detail = detail,
    });
}
