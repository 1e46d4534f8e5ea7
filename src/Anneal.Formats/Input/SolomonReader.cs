using Anneal.Core.Model;

namespace Anneal.Formats.Input;

public static class SolomonReader
{
    public static bool LooksLike(string text) => false;

    public static Instance Parse(string text, string fileName) => throw new InputException(new InputProblem(fileName, null, null, null, "not implemented", "wait"));
}
