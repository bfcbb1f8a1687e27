using Microsoft.AspNetCore.Http.HttpResults;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Model;

public static class ModelEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/model").WithTags("Model").ValidateRequests();
        group.MapPost("/evaluate", Evaluate)
            .WithSummary("The analytic model's whole working for one device: scale length, confinement, roll-off, slices");
        group.MapPost("/cross-section", Start)
            .WithSummary("Start a 2-D Poisson–Boltzmann solve of a fin cross-section; returns a job to poll");
        group.MapGet("/cross-section/{id}", Get).WithSummary("Progress and, when done, the result of a cross-section solve");
        group.MapDelete("/cross-section/{id}", Cancel).WithSummary("Cancel a cross-section solve");
    }

    private static Ok<EvaluateResponse> Evaluate(EvaluateRequest request) => TypedResults.Ok(EvaluateModel.Run(request));

    private static Accepted<CrossSectionJobResponse> Start(CrossSectionRequest request, CrossSectionJobs jobs)
    {
        var job = jobs.Start(CrossSectionMapping.ToSolver(request));
        return TypedResults.Accepted($"/api/model/cross-section/{job.Id}", job);
    }

    private static Results<Ok<CrossSectionJobResponse>, ProblemHttpResult> Get(string id, CrossSectionJobs jobs) =>
        jobs.Get(id) is { } job ? TypedResults.Ok(job) : NoSuchJob(id);

    private static Results<Ok<CrossSectionJobResponse>, ProblemHttpResult> Cancel(string id, CrossSectionJobs jobs) =>
        jobs.Cancel(id) is { } job ? TypedResults.Ok(job) : NoSuchJob(id);

    private static ProblemHttpResult NoSuchJob(string id) =>
        Problems.NotFound("No such solve.", $"There is no cross-section solve '{id}' (jobs are kept until the server restarts).");
}
