using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Formats.Input;

/// <summary>Temporary stub so the `evaluate` command compiles; the lead replaces it with the real route-file reader.</summary>
public static class RouteFileReader
{
    /// <exception cref="InputException">always, until the real reader lands.</exception>
    public static Plan Read(string path, Instance instance) =>
        throw new InputException(new InputProblem(path, null, null, null, "route files cannot be read yet in this build", "use a build with the route-file reader"));
}
