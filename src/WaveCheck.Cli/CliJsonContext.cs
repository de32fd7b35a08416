using System.Text.Json.Serialization;
using WaveCheck.Cli.Commands;

namespace WaveCheck.Cli;

/// <summary>Source-generated JSON metadata of the command line's own JSON forms (the rest is in
/// <see cref="WaveCheck.Core.Export.ResultJsonContext"/>): no reflection, so the ahead-of-time build writes them too.</summary>
[JsonSerializable(typeof(InfoCommand.InfoReport))]
internal sealed partial class CliJsonContext : JsonSerializerContext;
