using WaveCheck.Cli;

return WaveCheckCommand.Run(args, Terminal.FromProcess());
