using System.Text.RegularExpressions;

namespace WaveCheck.Core;

/// <summary>
/// Base of every error caused by what the user gave (a file, an option value), as opposed to a bug.
/// The CLI prints the message as one line on stderr and exits with code 2.
/// </summary>
/// <remarks>
/// Core knows no command line: where a message names a setting (<c>AnalysisOptions.MainsHz</c>, a site-file key), it
/// marks it with <see cref="Setting.Ref"/>. <see cref="Exception.Message"/> shows the marked settings by their property
/// names; <see cref="MessageWith"/> shows them as the caller's user gave them (the CLI's flags, a site file's keys).
/// </remarks>
public class UserInputException : Exception
{
    /// <summary>Creates the exception with a message that names the input and the place.</summary>
    /// <param name="message">The message; settings in it marked with <see cref="Setting.Ref"/>.</param>
    public UserInputException(string message)
        : base(Setting.Render(message, Setting.PropertyName))
    {
        Template = message;
    }

    /// <summary>The message with its settings still marked.</summary>
    public string Template { get; }

    /// <summary>The settings the message names (property names, in order of first mention).</summary>
    public IReadOnlyList<string> Settings => Setting.In(Template);

    /// <summary>The message with each setting written as <paramref name="name"/> gives it.</summary>
    /// <param name="name">From a property name (<c>MainsHz</c>) to how the user gave it (<c>--mains</c>).</param>
    public string MessageWith(Func<string, string> name)
    {
        ArgumentNullException.ThrowIfNull(name);
        return Setting.Render(Template, name);
    }
}

/// <summary>An option's value cannot be used: names the setting, the text given and the form expected.</summary>
public sealed class OptionValueException : UserInputException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="option">The setting: a property marked with <see cref="Setting.Ref"/> (Core), or an option as typed
    /// (the CLI's own options, e.g. <c>--plot-format</c>).</param>
    /// <param name="text">The text given.</param>
    /// <param name="expected">The form expected, e.g. <c>a current such as 30mA or 0.3A</c>.</param>
    public OptionValueException(string option, string text, string expected)
        : base($"{option}: cannot use '{text}': expected {expected}")
    {
        Option = Setting.Render(option, Setting.PropertyName);
        Text = text;
        Expected = expected;
    }

    /// <summary>The setting's property name (<c>MainsHz</c>), or the option as typed.</summary>
    public string Option { get; }

    /// <summary>The text given.</summary>
    public string Text { get; }

    /// <summary>The form expected.</summary>
    public string Expected { get; }
}

/// <summary>Names of settings inside Core's messages, written by each front end in its own words.</summary>
public static partial class Setting
{
    /// <summary>Marks a setting inside a message: <c>Setting.Ref(nameof(AnalysisOptions.MainsHz))</c>.</summary>
    /// <param name="property">The option property's name.</param>
    public static string Ref(string property) => "⟦" + property + "⟧";

    /// <summary>The naming Core uses on its own: the property's name.</summary>
    public static string PropertyName(string property) => property;

    /// <summary>The message with each marked setting written as <paramref name="name"/> gives it.</summary>
    public static string Render(string message, Func<string, string> name)
    {
        ArgumentNullException.ThrowIfNull(message);
        ArgumentNullException.ThrowIfNull(name);
        return message.Contains('⟦', StringComparison.Ordinal)
            ? Marked().Replace(message, m => name(m.Groups[1].Value))
            : message;
    }

    /// <summary>The settings marked in a message, in order of first mention.</summary>
    public static IReadOnlyList<string> In(string message) =>
        [.. Marked().Matches(message ?? string.Empty).Select(m => m.Groups[1].Value).Distinct(StringComparer.Ordinal)];

    [GeneratedRegex("⟦([A-Za-z][A-Za-z0-9]*)⟧")]
    private static partial Regex Marked();
}
