using WaveCheck.Core;

namespace WaveCheck.Cli;

/// <summary>Runs a command body and turns user-input errors into one stderr line and exit code 2, with no stack trace.</summary>
internal static class CliRun
{
    /// <summary>Exit code: analysed, nothing to fail on.</summary>
    public const int Ok = 0;

    /// <summary>Exit code: analysed, with a finding the user asked to fail on.</summary>
    public const int Finding = 1;

    /// <summary>Exit code: bad input or usage.</summary>
    public const int BadInput = 2;

    public static int Guard(Func<int> body)
    {
        try
        {
            return body();
        }
        catch (UserInputException ex)
        {
            Console.Error.WriteLine($"wavecheck: {ex.Message}");
            return BadInput;
        }
        catch (IOException ex)
        {
            Console.Error.WriteLine($"wavecheck: {ex.Message}");
            return BadInput;
        }
        catch (UnauthorizedAccessException ex)
        {
            Console.Error.WriteLine($"wavecheck: {ex.Message}");
            return BadInput;
        }
    }
}
