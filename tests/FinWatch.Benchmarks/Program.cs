using FinWatch.Benchmarks;

// Benchmarks are not part of the test run. Usage (README, Performance):
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- ingest [rows]
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- csv [rows] [rounds]
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- csv-agree [inputs] [seed]
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- rules
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- run-length
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- model
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- solver
//   dotnet run -c Release --project tests/FinWatch.Benchmarks -- push [minutes] [clients[,clients…]] [lots-per-minute]
//   FINWATCH_BENCH_POSTGRES=... dotnet run -c Release --project tests/FinWatch.Benchmarks -- timerange [rows]
return args.FirstOrDefault() switch
{
    "ingest" => await IngestBenchmark.RunAsync(args.Length > 1 ? int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture) : 1_000_000),
    "csv" => await CsvReadBenchmark.RunAsync((int)Arg(1, 1_000_000), (int)Arg(2, 7)),
    "csv-agree" => await CsvAgreement.RunAsync((int)Arg(1, 5000), (int)Arg(2, 1)),
    "rules" => RulesBenchmark.Run(),
    "run-length" => RunLengthBenchmark.Run(),
    "model" => ModelBenchmark.Run(),
    "solver" => SolverBenchmark.Run(),
    "push" => await PushBenchmark.RunAsync(Arg(1, 3.0), args.Length > 2 ? [.. args[2].Split(',').Select(c => int.Parse(c, System.Globalization.CultureInfo.InvariantCulture))] : [500, 1000], Arg(3, 50)),
    "timerange" => await TimeRangeBenchmark.RunAsync((long)Arg(1, 10_000_000)),
    _ => Usage(),
};

static int Usage()
{
    Console.Error.WriteLine("usage: FinWatch.Benchmarks ingest [rows] | csv [rows] [rounds] | csv-agree [inputs] [seed] | rules | run-length | model | solver | push [minutes] [clients[,clients…]] [lots-per-minute] | timerange [rows]");
    return 2;
}

double Arg(int i, double fallback) => args.Length > i ? double.Parse(args[i], System.Globalization.CultureInfo.InvariantCulture) : fallback;
