using BenchmarkDotNet.Running;

// Run with: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*'
// (or a class name, e.g. --filter '*Kendall*'). Not run by CI.
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
