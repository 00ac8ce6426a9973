return CrossCheck.Cli.App.Run(args, Console.Out, Console.Error);
