using System.Globalization;

namespace Anneal.Tests.Fixtures;

/// <summary>
/// How many mutants each fuzz test tries: a few hundred in the suite, or ANNEAL_FUZZ_CASES for a long run
/// (`ANNEAL_FUZZ_CASES=10000 dotnet test tests/Anneal.Tests -c Release --filter Category=Fuzz`). Seeds stay fixed,
/// so a long run repeats too.
/// </summary>
public static class FuzzBudget
{
    public const string Category = "Fuzz";

    public static int Cases(int suite) =>
        int.TryParse(Environment.GetEnvironmentVariable("ANNEAL_FUZZ_CASES"), NumberStyles.None, CultureInfo.InvariantCulture, out int n) && n > 0 ? n : suite;
}
