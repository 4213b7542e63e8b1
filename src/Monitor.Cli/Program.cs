// The `monitor` executable. Verbs are added as the libraries behind them land.
return Monitor.Cli.EntryPoint.Run(args);
