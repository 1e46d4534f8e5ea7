namespace Anneal.Tests.Fixtures;

/// <summary>A test class that owns a fresh temporary folder, deleted after each test.</summary>
public abstract class TempFolderTest : IDisposable
{
    protected string Dir { get; } = Directory.CreateTempSubdirectory("anneal-test-").FullName;

    public void Dispose()
    {
        Directory.Delete(Dir, recursive: true);
        GC.SuppressFinalize(this);
    }
}
