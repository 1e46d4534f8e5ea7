using Anneal.Formats.Output;

namespace Anneal.Tests.Formats.Output;

public sealed class AtomicFileTests : TempFolderTest
{
    [Fact]
    public void Writes_the_content_and_leaves_no_temporary_file()
    {
        string path = Path.Combine(Dir, "out.txt");
        AtomicFile.WriteText(path, w => w.Write("new"));
        AtomicFile.WriteText(path, w => w.Write("newer"));

        Assert.Equal("newer", File.ReadAllText(path));
        Assert.Equal(["out.txt"], Directory.GetFiles(Dir).Select(Path.GetFileName));
    }

    [Fact]
    public void A_failure_midway_keeps_the_old_file_and_removes_the_temporary_one()
    {
        string path = Path.Combine(Dir, "out.txt");
        File.WriteAllText(path, "old");

        var e = Assert.Throws<InvalidOperationException>(() => AtomicFile.WriteText(path, w =>
        {
            w.Write("half of the new con");
            w.Flush();
            throw new InvalidOperationException("writer broke");
        }));

        Assert.Equal("writer broke", e.Message);
        Assert.Equal("old", File.ReadAllText(path));
        Assert.Single(Directory.GetFiles(Dir));
    }

    [Fact]
    public void An_unwritable_place_is_anOutputError_naming_the_path()
    {
        string path = Path.Combine(Dir, "no-such-folder", "out.txt");

        var e = Assert.Throws<OutputException>(() => AtomicFile.WriteText(path, w => w.Write("x")));

        Assert.Equal(path, e.Path);
        Assert.Contains(path, e.Message, StringComparison.Ordinal);
    }
}
