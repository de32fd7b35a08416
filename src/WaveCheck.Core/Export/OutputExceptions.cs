using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// An output path that cannot be used: it would replace an input of the run, two outputs share it, it is read-only,
/// or a part of it that must be a folder is a file. Thrown before anything is written; the message names the
/// path (and the option, where known) and what to do.
/// </summary>
public sealed class OutputPathException : UserInputException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">One line naming the path(s) and the option(s).</param>
    public OutputPathException(string message)
        : base(message)
    {
    }
}

/// <summary>
/// Writing an output failed part-way (disk full, permission denied, an I/O error). The message names the target the
/// user asked for, never the temporary file; nothing was left at the target or beside it.
/// </summary>
public sealed class OutputWriteException : IOException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="targetPath">The output path as the user gave it.</param>
    /// <param name="reason">What went wrong, without the temporary file's name.</param>
    /// <param name="inner">The exception from the file system.</param>
    public OutputWriteException(string targetPath, string reason, Exception? inner = null)
        : base($"cannot write {targetPath}: {reason}", inner)
    {
        TargetPath = targetPath;
        Reason = reason;
    }

    /// <summary>The output path as the user gave it.</summary>
    public string TargetPath { get; }

    /// <summary>What went wrong.</summary>
    public string Reason { get; }
}
