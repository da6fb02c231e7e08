using PairFit.Core.Common;

namespace PairFit.Cli.Demo;

/// <summary>The demo CSV files embedded in the program, so `pairfit demo` works from any folder.</summary>
public static class DemoData
{
    public static string ReadText(string fileName)
    {
        using var stream = typeof(DemoData).Assembly.GetManifestResourceStream("demo/" + fileName)
            ?? throw new PairFitAnalysisException($"demo file '{fileName}' is not embedded in this build of pairfit.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
