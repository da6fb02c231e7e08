namespace PairFit.Tests.Data;

/// <summary>A folder of small CSV files written by a test and deleted afterwards.</summary>
internal sealed class TempCsv : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "pairfit-data-tests-" + Guid.NewGuid().ToString("N"));

    public TempCsv() => Directory.CreateDirectory(_folder);

    /// <summary>Writes <paramref name="text"/> exactly as given (no newline translation) and returns the path.</summary>
    public string Write(string name, string text, bool byteOrderMark = false)
    {
        string path = Path.Combine(_folder, name);
        File.WriteAllText(path, text, new System.Text.UTF8Encoding(byteOrderMark));
        return path;
    }

    public string PathOf(string name) => Path.Combine(_folder, name);

    public void Dispose()
    {
        try { Directory.Delete(_folder, recursive: true); } catch (IOException) { }
    }
}

/// <summary>Base of test classes that write CSV files: one temporary folder per test, removed afterwards.</summary>
public abstract class CsvFileTests : IDisposable
{
    internal TempCsv Files { get; } = new();
    public void Dispose()
    {
        Files.Dispose();
        GC.SuppressFinalize(this);
    }
}
