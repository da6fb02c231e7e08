using PairFit.Core.Common;

namespace PairFit.Cli;

/// <summary>
/// A report folder is built complete in a temporary sibling folder and only then moved into
/// place, so an interrupted run never leaves a half-written report; an existing folder is never
/// replaced without --force.
/// </summary>
public sealed class OutputFolder
{
    private OutputFolder(string target, string staging)
    {
        Target = target;
        Staging = staging;
    }

    /// <summary>The folder the user asked for.</summary>
    public string Target { get; }

    /// <summary>Where files are written until <see cref="Commit"/>.</summary>
    public string Staging { get; }

    public static OutputFolder Begin(string path, bool force)
    {
        string target = Path.GetFullPath(path);
        if (File.Exists(target))
            throw new PairFitInputException($"--out '{path}' is a file; give a folder name.");
        if (Directory.Exists(target) && Directory.EnumerateFileSystemEntries(target).Any() && !force)
            throw new PairFitInputException($"output folder '{path}' already exists and is not empty; choose another with --out or add --force to replace it.");
        string parent = Path.GetDirectoryName(target) ?? ".";
        Directory.CreateDirectory(parent);
        string staging = Path.Combine(parent, $".{Path.GetFileName(target)}.partial-{Environment.ProcessId}");
        if (Directory.Exists(staging)) Directory.Delete(staging, recursive: true);
        Directory.CreateDirectory(staging);
        return new OutputFolder(target, staging);
    }

    /// <summary>Moves the finished folder into place (replacing the old one, which --force allowed).</summary>
    public void Commit()
    {
        string? old = null;
        if (Directory.Exists(Target))
        {
            old = Target + $".old-{Environment.ProcessId}";
            Directory.Move(Target, old);
        }
        Directory.Move(Staging, Target);
        if (old is not null) Directory.Delete(old, recursive: true);
    }

    /// <summary>Removes the staging folder after a failure.</summary>
    public void Abandon()
    {
        try
        {
            if (Directory.Exists(Staging)) Directory.Delete(Staging, recursive: true);
        }
        catch (IOException)
        {
            // Leaving a stray staging folder is harmless; the user's own files were never touched.
        }
    }
}
