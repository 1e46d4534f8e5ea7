using Anneal.Formats.Input;

namespace Anneal.Queue.Inputs;

/// <summary>Reads a job from its stored files, laid out in a scratch folder, so that what runs is exactly what was stored.</summary>
public static class StoredInput
{
    /// <param name="scratch">An empty folder of the caller's, removed by the caller.</param>
    /// <param name="shownAs">Replaces the scratch folder in problem messages (the submitted path's folder, or empty).</param>
    /// <exception cref="InputException">with every problem, naming files as the user knows them.</exception>
    public static LoadedInput Load(IInputKind kind, string jobName, IReadOnlyList<StoredFile> files, string scratch, string shownAs) =>
        Open(kind, jobName, files, scratch, shownAs).Input;

    /// <summary>As <see cref="Load"/>, also giving the path the job was laid out at (for a solver process to read it again).</summary>
    public static (LoadedInput Input, string Located) Open(IInputKind kind, string jobName, IReadOnlyList<StoredFile> files, string scratch, string shownAs)
    {
        Directory.CreateDirectory(scratch);
        try
        {
            string located = kind.Unpack(scratch, jobName, files);
            return (InputLoader.Load(located), located);
        }
        catch (InputException e)
        {
            var problems = new List<InputProblem>(e.Problems.Count);
            foreach (var p in e.Problems)
            {
                problems.Add(Relative(p, scratch, shownAs));
            }

            throw new InputException(problems);
        }
    }

    private static InputProblem Relative(InputProblem problem, string scratch, string shownAs)
    {
        string root = Path.GetFullPath(scratch) + Path.DirectorySeparatorChar;
        if (!problem.File.StartsWith(root, StringComparison.Ordinal))
        {
            return problem;
        }

        string rest = problem.File[root.Length..];
        return problem with { File = shownAs.Length == 0 ? rest : Path.Combine(shownAs, rest) };
    }
}
