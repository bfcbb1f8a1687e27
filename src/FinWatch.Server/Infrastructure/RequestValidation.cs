using System.Reflection;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// The problems of one request, keyed by the JSON field path in snake_case (<c>nominal.corner_radius_nm</c>,
/// <c>specs[2].parameter</c>, <c>sigma_multiplier</c>). Setting a field's message replaces what the field had;
/// <see cref="Add"/> appends another message to it.
/// </summary>
public sealed class ValidationErrors
{
    private readonly Dictionary<string, List<string>> byField = new(StringComparer.Ordinal);

    public int Count => byField.Count;

    public bool Has(string field) => byField.ContainsKey(field);

    /// <summary>Replaces the field's messages by this one.</summary>
    public string this[string field]
    {
        set => byField[field] = [value];
    }

    public void Add(string field, string message)
    {
        if (!byField.TryGetValue(field, out var list))
        {
            byField[field] = list = [];
        }

        list.Add(message);
    }

    /// <summary>Replaces the field's messages by these (e.g. the password rules a person's password breaks).</summary>
    public void Set(string field, IEnumerable<string> messages) => byField[field] = [.. messages];

    /// <summary>
    /// The same problems under other field names (a field not in <paramref name="names"/> keeps its name); messages of
    /// fields that end up under one name are joined.
    /// </summary>
    public ValidationErrors Renamed(IReadOnlyDictionary<string, string> names)
    {
        var renamed = new ValidationErrors();
        foreach (var (field, messages) in byField)
        {
            foreach (var message in messages)
            {
                if (!renamed.byField.TryGetValue(names.GetValueOrDefault(field, field), out var list) || !list.Contains(message))
                {
                    renamed.Add(names.GetValueOrDefault(field, field), message);
                }
            }
        }

        return renamed;
    }

    public Dictionary<string, string[]> ToDictionary() => byField.ToDictionary(e => e.Key, e => e.Value.ToArray(), StringComparer.Ordinal);
}

/// <summary>
/// A request (a JSON body, or an <c>[AsParameters]</c> record of query parameters) whose fields can be checked without
/// the database. <see cref="RequestValidation.ValidateRequests{TBuilder}"/> runs the check before the handler.
/// </summary>
public interface IValidatedRequest
{
    /// <summary>Adds the request's problems, keyed by JSON field path; adds nothing when the request is consistent.</summary>
    void Validate(ValidationErrors errors);
}

/// <summary>Marks an endpoint whose <see cref="IValidatedRequest"/> arguments are checked by the validation filter.</summary>
public sealed class ValidatesRequests
{
    public static readonly ValidatesRequests Instance = new();

    private ValidatesRequests()
    {
    }
}

public static class RequestValidation
{
    /// <summary>
    /// The one way requests are validated: every endpoint of the group with an <see cref="IValidatedRequest"/> argument
    /// answers 400 problem+json (<see cref="Problems.Invalid(ValidationErrors, string?, bool)"/>) before its handler runs
    /// when that argument has problems; the handler then sees consistent input only. Checks that need the database
    /// (does the product exist?) stay in the handler and answer through the same <see cref="Problems.Invalid(ValidationErrors, string?, bool)"/>.
    /// </summary>
    public static TBuilder ValidateRequests<TBuilder>(this TBuilder builder) where TBuilder : IEndpointConventionBuilder
    {
        builder.Add(endpoint =>
        {
            if (endpoint.Metadata.OfType<MethodInfo>().FirstOrDefault() is { } method && ValidatedParameters(method).Length > 0)
            {
                endpoint.Metadata.Add(ValidatesRequests.Instance);
                endpoint.Metadata.Add(new ProducesResponseTypeMetadata(StatusCodes.Status400BadRequest, typeof(HttpValidationProblemDetails), ["application/problem+json"]));
            }
        });
        builder.AddEndpointFilterFactory((factory, next) =>
        {
            var positions = ValidatedParameters(factory.MethodInfo);
            if (positions.Length == 0)
            {
                return next;
            }

            return context =>
            {
                var errors = new ValidationErrors();
                foreach (var i in positions)
                {
                    (context.Arguments[i] as IValidatedRequest)?.Validate(errors);
                }

                return errors.Count > 0 ? ValueTask.FromResult<object?>(Problems.Invalid(errors)) : next(context);
            };
        });
        return builder;
    }

    /// <summary>Positions of the handler's parameters that are checked requests.</summary>
    public static int[] ValidatedParameters(MethodInfo method) =>
        [.. method.GetParameters().Select((p, i) => (p, i)).Where(x => typeof(IValidatedRequest).IsAssignableFrom(x.p.ParameterType)).Select(x => x.i)];
}
