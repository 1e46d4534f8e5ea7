
namespace Anneal.Tests.Fixtures;

/// <summary>A command test: a temporary folder plus captured stdout and stderr.</summary>
public abstract class CommandTest : TempFolderTest
{
    protected StringWriter Out { get; } = new();

    protected StringWriter Err { get; } = new();

    protected string All => Out.ToString() + Err.ToString();
}
