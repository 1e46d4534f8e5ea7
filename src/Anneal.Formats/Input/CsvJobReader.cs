namespace Anneal.Formats.Input;

public static class CsvJobReader
{
    public static LoadedInput Read(string folder) => throw new InputException(new InputProblem(folder, null, null, null, "not implemented", "wait"));
}
