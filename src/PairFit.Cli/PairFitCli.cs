using System.CommandLine;
using PairFit.Cli.Commands;
using PairFit.Core;
using PairFit.Core.Common;

namespace PairFit.Cli;

/// <summary>
/// The `pairfit` command: a thin shell that parses options, calls PairFit.Core, prints and
/// writes files. Exit codes: 0 success, 1 failed analysis, 2 bad usage or input.
/// </summary>
public static class PairFitCli
{
    public const int ExitOk = 0;
    public const int ExitAnalysisFailed = 1;
    public const int ExitBadInput = 2;

    public static RootCommand BuildRoot()
    {
        var root = new RootCommand(
            "PairFit: fit the joint law of two measured quantities (marginals + copula), test the fit, "
            + "and project it onto derived quantities such as x + y or y / x.")
        {
            DescribeCommand.Build(),
            AnalyzeCommand.Build(),
            DemoCommand.Build(),
            GenerateDemoDataCommand.Build(),
            SimulateCommand.Build(),
            ProjectCommand.Build(),
            JointCommand.Build(),
        };
        return root;
    }

    /// <summary>Parses and runs; parse errors are printed as one line each and give exit code 2.</summary>
    public static int Run(string[] args, TextWriter output, TextWriter error)
    {
        var root = BuildRoot();
        var parsed = root.Parse(args);
        if (parsed.Errors.Count > 0)
        {
            foreach (var e in parsed.Errors)
                error.WriteLine($"pairfit: error: {e.Message}");
            string cmd = parsed.CommandResult.Command == root ? "pairfit" : "pairfit " + parsed.CommandResult.Command.Name;
            error.WriteLine($"Try '{cmd} --help'.");
            return ExitBadInput;
        }
        return parsed.Invoke(new InvocationConfiguration { Output = output, Error = error, EnableDefaultExceptionHandler = false });
    }

    /// <summary>
    /// Runs a command body and turns PairFit's own exceptions into a one-line message and an exit
    /// code. Anything else is a bug: it is reported as such, still without a stack trace unless
    /// PAIRFIT_DEBUG is set.
    /// </summary>
    public static int Guard(ParseResult parse, Func<TextWriter, TextWriter, int> body)
    {
        var output = parse.InvocationConfiguration.Output;
        var error = parse.InvocationConfiguration.Error;
        try
        {
            return body(output, error);
        }
        catch (PairFitInputException e)
        {
            error.WriteLine($"pairfit: error: {e.Message}");
            return ExitBadInput;
        }
        catch (PairFitAnalysisException e)
        {
            error.WriteLine($"pairfit: analysis failed: {e.Message}");
            return ExitAnalysisFailed;
        }
        catch (IOException e)
        {
            error.WriteLine($"pairfit: error: {e.Message}");
            return ExitBadInput;
        }
        catch (UnauthorizedAccessException e)
        {
            error.WriteLine($"pairfit: error: {e.Message}");
            return ExitBadInput;
        }
        catch (Exception e) when (Environment.GetEnvironmentVariable("PAIRFIT_DEBUG") is null)
        {
            error.WriteLine($"pairfit: internal error ({e.GetType().Name}: {e.Message}). This is a bug in {ToolInfo.NameAndVersion}; rerun with PAIRFIT_DEBUG=1 for details.");
            return ExitAnalysisFailed;
        }
    }
}
