using PairFit.Cli;
using PairFit.Core.Common;

namespace PairFit.Tests.Cli;

public class OutputFolderTests : IDisposable
{
    private readonly string _root = Path.Combine(Path.GetTempPath(), "pairfit-outfolder-" + Guid.NewGuid().ToString("N"));

    public OutputFolderTests() => Directory.CreateDirectory(_root);

    public void Dispose() => Directory.Delete(_root, recursive: true);

    [Fact]
    public void ExistingNonEmptyFolderIsRefusedWithoutForceAndLeftUntouched()
    {
        string target = Path.Combine(_root, "report");
        Directory.CreateDirectory(target);
        File.WriteAllText(Path.Combine(target, "mine.txt"), "user data");
        var e = Assert.Throws<PairFitInputException>(() => OutputFolder.Begin(target, force: false));
        Assert.Contains("--force", e.Message);
        Assert.Equal("user data", File.ReadAllText(Path.Combine(target, "mine.txt")));
        Assert.Single(Directory.GetFileSystemEntries(_root)); // no staging folder left behind
    }

    [Fact]
    public void FilesAppearOnlyOnCommitAndForceReplacesTheOldFolder()
    {
        string target = Path.Combine(_root, "report");
        Directory.CreateDirectory(target);
        File.WriteAllText(Path.Combine(target, "old.txt"), "old");
        var folder = OutputFolder.Begin(target, force: true);
        File.WriteAllText(Path.Combine(folder.Staging, "new.txt"), "new");
        Assert.False(File.Exists(Path.Combine(target, "new.txt"))); // not visible before commit
        folder.Commit();
        Assert.True(File.Exists(Path.Combine(target, "new.txt")));
        Assert.False(File.Exists(Path.Combine(target, "old.txt")));
        Assert.Single(Directory.GetFileSystemEntries(_root));
    }

    [Fact]
    public void AbandonRemovesTheStagingFolder()
    {
        var folder = OutputFolder.Begin(Path.Combine(_root, "r2"), force: false);
        File.WriteAllText(Path.Combine(folder.Staging, "partial.txt"), "x");
        folder.Abandon();
        Assert.Empty(Directory.GetFileSystemEntries(_root));
    }
}
