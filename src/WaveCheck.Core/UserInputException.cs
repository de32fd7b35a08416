namespace WaveCheck.Core;

/// <summary>
/// Base of every error caused by what the user gave (a file, an option value), as opposed to a bug.
/// The CLI prints the message as one line on stderr and exits with code 2.
/// </summary>
public class UserInputException : Exception
{
    /// <summary>Creates the exception with a message that names the input and the place.</summary>
    public UserInputException(string message)
        : base(message)
    {
    }
}

/// <summary>An option's value cannot be used: names the option, the text given and the form expected.</summary>
public sealed class OptionValueException : UserInputException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="option">Option name as typed, e.g. <c>--rated</c>.</param>
    /// <param name="text">The text given.</param>
    /// <param name="expected">The form expected, e.g. <c>a current such as 30mA or 0.3A</c>.</param>
    public OptionValueException(string option, string text, string expected)
        : base($"{option}: cannot use '{text}': expected {expected}")
    {
        Option = option;
        Text = text;
    }

    /// <summary>The option.</summary>
    public string Option { get; }

    /// <summary>The text given.</summary>
    public string Text { get; }
}
