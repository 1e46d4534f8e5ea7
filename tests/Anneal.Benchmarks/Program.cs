using Anneal.Benchmarks;
using BenchmarkDotNet.Running;

// Without the shared benchmark files there is nothing to measure; say so and succeed, as the tests skip.
var folder = BenchmarkFolder.Locate();
if (folder is null)
{
    var given = Environment.GetEnvironmentVariable(BenchmarkFolder.Variable);
    Console.WriteLine(string.IsNullOrEmpty(given)
        ? $"Kernel benchmarks not run: ../shared/benchmarks is absent beside the repository (set ${BenchmarkFolder.Variable} to the folder elsewhere)."
        : $"Kernel benchmarks not run: ${BenchmarkFolder.Variable} is {given}, which is not a folder.");
    return 0;
}

// The benchmarks run in child processes; hand them the folder found here.
Environment.SetEnvironmentVariable(BenchmarkFolder.Variable, folder);
BenchmarkSwitcher.FromAssembly(typeof(BenchmarkFolder).Assembly).Run(args);
return 0;
