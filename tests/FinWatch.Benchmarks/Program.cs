using FinWatch.Benchmarks;

// Benchmarks are not part of the test run. Usage (README, Performance):
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- ingest [rows]
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- rules
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- model
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- solver
return args.FirstOrDefault() switch
{
    "ingest" => await IngestBenchmark.RunAsync(args.Length > 1 ? int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture) : 1_000_000),
    "rules" => RulesBenchmark.Run(),
    "model" => ModelBenchmark.Run(),
    "solver" => SolverBenchmark.Run(),
    _ => Usage(),
};

static int Usage()
{
    Console.Error.WriteLine("usage: FinWatch.Benchmarks ingest [rows] | rules | model | solver");
    return 2;
}
