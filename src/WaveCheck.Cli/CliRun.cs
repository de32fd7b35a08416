using System.CommandLine;
using System.Runtime.InteropServices;
using WaveCheck.Core;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;

namespace WaveCheck.Cli;

/// <summary>
/// Runs a command body and turns user-input errors into one stderr line and exit code 2, with no stack trace; turns
/// Ctrl-C (SIGINT) and SIGTERM into a cancellation the body sees through <see cref="RunContext.Token"/>, then one line
/// saying what was and was not written, and exit code 130 or 143.
/// </summary>
internal static class CliRun
{
    /// <summary>Exit code: analysed, nothing to fail on.</summary>
    public const int Ok = 0;

    /// <summary>Exit code: analysed, with a finding the user asked to fail on.</summary>
    public const int Finding = 1;

    /// <summary>Exit code: bad input or usage.</summary>
    public const int BadInput = 2;

    /// <summary>Exit code: stopped by SIGINT (Ctrl-C), 128 + 2 as shells report it.</summary>
    public const int Interrupted = 130;

    /// <summary>Exit code: stopped by SIGTERM, 128 + 15 as shells report it.</summary>
    public const int Terminated = 143;

    /// <summary>Runs <paramref name="body"/> on the terminal the command line was invoked with
    /// (<see cref="TerminalInvocation"/>).</summary>
    public static int Guard(ParseResult parse, Func<RunContext, int> body)
    {
        ArgumentNullException.ThrowIfNull(parse);
        var terminal = (parse.InvocationConfiguration as TerminalInvocation)?.Terminal
            ?? throw new InvalidOperationException("commands are invoked through WaveCheckCommand.Run, which gives them their terminal");
        return Guard(terminal, body);
    }

    public static int Guard(Terminal terminal, Func<RunContext, int> body)
    {
        using var interruption = Interruption.Listen();
        var context = new RunContext(interruption.Token, terminal);
        try
        {
            var exit = body(context);
            if (interruption.Signal is not null)
            {
                // The signal came after the last check: everything was done, but the user asked to stop.
                return Stopped(interruption, context);
            }

            return exit;
        }
        catch (OperationCanceledException) when (interruption.Signal is not null)
        {
            return Stopped(interruption, context);
        }
        catch (UserInputException ex)
        {
            PrintError(terminal, ex.MessageWith(SettingFlags.Of));
            return BadInput;
        }
        catch (IOException ex)
        {
            PrintError(terminal, ex.Message);
            return BadInput;
        }
        catch (UnauthorizedAccessException ex)
        {
            PrintError(terminal, ex.Message);
            return BadInput;
        }
    }

    /// <summary>Prints one line on the terminal's stderr, prefixed <c>wavecheck: </c>, control characters made visible.</summary>
    public static void PrintError(Terminal terminal, string message) =>
        terminal.Error.WriteLine("wavecheck: " + TerminalText.Clean(message));

    private static int Stopped(Interruption interruption, RunContext context)
    {
        var terminated = interruption.Signal == PosixSignal.SIGTERM;
        PrintError(context.Terminal, $"interrupted by {(terminated ? "SIGTERM" : "SIGINT")}: {context.Outcome()}");
        return terminated ? Terminated : Interrupted;
    }

    /// <summary>
    /// SIGINT and SIGTERM, caught for the length of one run: the first cancels <see cref="Token"/> and keeps the
    /// process alive so it can delete its temporary files; a second one is left to end the process at once.
    /// </summary>
    private sealed class Interruption : IDisposable
    {
        private readonly CancellationTokenSource _source = new();
        private readonly List<PosixSignalRegistration> _registrations = [];
        private int _caught;

        public CancellationToken Token => _source.Token;

        public PosixSignal? Signal { get; private set; }

        public static Interruption Listen()
        {
            var interruption = new Interruption();
            foreach (var signal in (PosixSignal[])[PosixSignal.SIGINT, PosixSignal.SIGTERM])
            {
                try
                {
                    interruption._registrations.Add(PosixSignalRegistration.Create(signal, interruption.Handle));
                }
                catch (PlatformNotSupportedException)
                {
                    // Not on this platform: that signal keeps its default action.
                }
            }

            return interruption;
        }

        public void Dispose()
        {
            foreach (var registration in _registrations)
            {
                registration.Dispose();
            }

            _source.Dispose();
        }

        private void Handle(PosixSignalContext context)
        {
            if (Interlocked.Exchange(ref _caught, 1) == 1)
            {
                return; // the second signal: default action, the process ends now
            }

            Signal = context.Signal;
            context.Cancel = true;
            _source.Cancel();
        }
    }
}

/// <summary>What a command body gets from <see cref="CliRun.Guard"/>: the cancellation token, and a place to say what
/// it has written so far, for the line printed when it is interrupted.</summary>
internal sealed class RunContext(CancellationToken token, Terminal terminal)
{
    /// <summary>Cancelled by SIGINT or SIGTERM.</summary>
    public CancellationToken Token { get; } = token;

    /// <summary>Where the run prints.</summary>
    public Terminal Terminal { get; } = terminal;

    /// <summary>Describes what was and was not written; by default the plan's account, or "nothing written".</summary>
    public Func<string>? Describe { get; set; }

    /// <summary>The outputs of the run, checked and tracked.</summary>
    public OutputPlan? Plan { get; set; }

    public string Outcome() => Describe?.Invoke() ?? Plan?.Outcome() ?? "nothing written";
}

/// <summary>The invocation settings of one run, carrying its <see cref="Cli.Terminal"/> to the command actions; help and
/// parse errors go to the same writers.</summary>
internal sealed class TerminalInvocation : InvocationConfiguration
{
    public TerminalInvocation(Terminal terminal)
    {
        Terminal = terminal;
        Output = terminal.Out;
        Error = terminal.Error;

        // Signals are handled by CliRun.Guard (exit 130/143 after cleaning up), not by System.CommandLine.
        EnableDefaultExceptionHandler = false;
        ProcessTerminationTimeout = null;
    }

    public Terminal Terminal { get; }
}
