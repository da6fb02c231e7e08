using PairFit.Cli;

return PairFitCli.Run(args, Console.Out, Console.Error);
