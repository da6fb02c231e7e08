using System.CommandLine;
using PairFit.Cli.Demo;

namespace PairFit.Cli.Commands;

/// <summary>`pairfit generate-demo-data --out &lt;folder&gt;`: regenerates the synthetic demo files (hidden; for maintainers).</summary>
public static class GenerateDemoDataCommand
{
    public static Command Build()
    {
        var output = new Option<string>("--out") { Description = "Folder to write the demo CSV files into.", DefaultValueFactory = _ => "data-demo" };
        var command = new Command("generate-demo-data", "Regenerate the synthetic demo data from its fixed seed.") { output };
        command.Hidden = true;
        command.SetAction(parse => PairFitCli.Guard(parse, (o, e) =>
        {
            foreach (var f in DemoDataGenerator.Write(parse.GetValue(output)!))
                o.WriteLine(f);
            return PairFitCli.ExitOk;
        }));
        return command;
    }
}
