using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;

namespace FinWatch.Server.Features.Model;

public static class ModelEndpoints
{
    public static IServiceCollection AddModel(this IServiceCollection services) =>
        services.AddSingleton<CrossSectionJobs>().AddSingleton<ProductModels>();

    public static IEndpointRouteBuilder MapModel(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/model").WithTags("Model");
        group.MapPost("/evaluate", Evaluate)
            .WithSummary("The analytic model's whole working for one device (fin-model.md A–E): scale length, confinement, roll-off, slices");
        group.MapPost("/cross-section", Start)
            .WithSummary("Start a 2-D Poisson–Boltzmann solve of a fin cross-section; returns a job to poll");
        group.MapGet("/cross-section/{id}", Get).WithSummary("Progress and, when done, the result of a cross-section solve");
        group.MapDelete("/cross-section/{id}", Cancel).WithSummary("Cancel a cross-section solve");
        return app;
    }

    private static Results<Ok<EvaluateResponse>, ValidationProblem> Evaluate(EvaluateRequest request) =>
        EvaluateModel.Check(request) is { Count: > 0 } errors
            ? TypedResults.ValidationProblem(errors)
            : TypedResults.Ok(EvaluateModel.Run(request));

    private static Results<Accepted<CrossSectionJobResponse>, ValidationProblem> Start(CrossSectionRequest request, CrossSectionJobs jobs)
    {
        if (CrossSectionMapping.Check(request) is { Count: > 0 } errors)
        {
            return TypedResults.ValidationProblem(errors);
        }

        var job = jobs.Start(CrossSectionMapping.ToSolver(request));
        return TypedResults.Accepted($"/api/model/cross-section/{job.Id}", job);
    }

    private static Results<Ok<CrossSectionJobResponse>, ProblemHttpResult> Get(string id, CrossSectionJobs jobs) =>
        jobs.Get(id) is { } job ? TypedResults.Ok(job) : NoSuchJob(id);

    private static Results<Ok<CrossSectionJobResponse>, ProblemHttpResult> Cancel(string id, CrossSectionJobs jobs) =>
        jobs.Cancel(id) is { } job ? TypedResults.Ok(job) : NoSuchJob(id);

    private static ProblemHttpResult NoSuchJob(string id) => TypedResults.Problem(new ProblemDetails
    {
        Type = "/problems/not-found",
        Title = "No such solve.",
        Status = StatusCodes.Status404NotFound,
        Detail = $"There is no cross-section solve '{id}' (jobs are kept until the server restarts).",
    });
}
