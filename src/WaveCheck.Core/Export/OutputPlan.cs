using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// The files a run reads and the files it will write, checked together before anything is written: the one place
/// that decides whether an output path may be used. Every command builds one and calls <see cref="Check"/>.
/// </summary>
/// <remarks>
/// <para>Rules (each broken rule is an <see cref="OutputPathException"/> naming both paths and their options):</para>
/// <list type="bullet">
/// <item>No output may be an input of the same run, by any alias: the same text, a relative or <c>..</c> spelling,
/// a symbolic link on either side, a hard link, or another case where the file system folds case. Paths are compared
/// by <see cref="FileIdentity"/> (device and inode on Unix), not by text.</item>
/// <item>No two outputs may be the same file, and no output file may be a folder another output needs. Outputs that
/// do not exist yet are compared by the identity of their nearest existing folder and the rest of the path (case-folded
/// where that folder folds case), so <c>out/a.json</c> and <c>link-to-out/a.json</c> collide before either exists.</item>
/// <item>An output that exists read-only is refused, not replaced; a path through a file (<c>afile/x.json</c>) is
/// refused as such.</item>
/// <item>A folder replaced as a whole (a survey's output folder) may hold only the names its writer owns, and no
/// input of the run may lie inside it.</item>
/// </list>
/// <para>Outputs are resolved as <see cref="AtomicFile"/> writes them (the full path, then the file system's lookup);
/// inputs as the readers open them (the path as given). Not thread-safe.</para>
/// </remarks>
public sealed class OutputPlan
{
    private readonly List<Input> _inputs = [];
    private readonly List<Output> _outputs = [];
    private readonly List<ReplacedFolder> _replaced = [];
    private readonly HashSet<string> _written = new(StringComparer.Ordinal);

    /// <summary>A file the run reads.</summary>
    /// <param name="path">As given to the reader.</param>
    /// <param name="role">What it is, for messages: <c>the capture</c>, <c>the site file</c>.</param>
    public void AddInput(string path, string role)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentException.ThrowIfNullOrEmpty(role);
        _inputs.Add(new Input(path, role));
    }

    /// <summary>A capture the run reads, with the files that come with it: a COMTRADE .cfg's .dat (and .hdr, .inf)
    /// beside it, in any case.</summary>
    /// <param name="path">The capture as given.</param>
    public void AddCapture(string path)
    {
        AddInput(path, "the capture");
        foreach (var companion in CaptureCompanions(path))
        {
            AddInput(companion, $"the data of the capture {path}");
        }
    }

    /// <summary>A file the run will write.</summary>
    /// <param name="path">As given by the user.</param>
    /// <param name="option">The option that names it, e.g. <c>--json</c>.</param>
    public void AddOutputFile(string path, string option)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentException.ThrowIfNullOrEmpty(option);
        _outputs.Add(new Output(path, option, path));
    }

    /// <summary>A folder the run writes named files into, leaving any other file in it alone (e.g. <c>--plots</c>).</summary>
    /// <param name="folder">As given by the user.</param>
    /// <param name="option">The option that names it.</param>
    /// <param name="fileNames">Every file name the run may write there.</param>
    public void AddOutputFolder(string folder, string option, IEnumerable<string> fileNames)
    {
        ArgumentException.ThrowIfNullOrEmpty(folder);
        ArgumentException.ThrowIfNullOrEmpty(option);
        ArgumentNullException.ThrowIfNull(fileNames);
        _outputs.Add(new Output(folder, option, folder, IsFolder: true));
        foreach (var name in fileNames)
        {
            _outputs.Add(new Output(Path.Combine(folder, name), option, folder));
        }
    }

    /// <summary>A folder the run replaces as a whole (see <see cref="OutputFolderSwitch"/>).</summary>
    /// <param name="folder">As given by the user.</param>
    /// <param name="option">The option that names it.</param>
    /// <param name="ownedNames">The entries its writer puts there; anything else in it is refused rather than lost.</param>
    public void AddReplacedFolder(string folder, string option, IReadOnlyCollection<string> ownedNames)
    {
        ArgumentException.ThrowIfNullOrEmpty(folder);
        ArgumentException.ThrowIfNullOrEmpty(option);
        ArgumentNullException.ThrowIfNull(ownedNames);
        _replaced.Add(new ReplacedFolder(folder, option, ownedNames));
    }

    /// <summary>Checks every rule; throws on the first broken one.</summary>
    /// <exception cref="OutputPathException">An output would replace an input, two outputs share a path, an output
    /// is read-only, or a folder in an output's path is a file.</exception>
    public void Check()
    {
        var inputs = _inputs.Select(i => (Input: i, Key: PathKey.Of(i.Path, asOutput: false))).ToList();
        var outputs = new List<(Output Output, PathKey Key)>();
        var folders = new List<(Output Output, PathKey Key)>();
        foreach (var output in _outputs)
        {
            var full = Path.GetFullPath(output.Path);
            if (AtomicFile.FileInFolderPath(full) is { } file)
            {
                throw new OutputPathException($"{output.Option} {output.Path}: {AtomicFile.AsGiven(output.Path, file)} is a file, not a folder");
            }

            var key = PathKey.Of(output.Path, asOutput: true);
            if (output.IsFolder)
            {
                if (File.Exists(full))
                {
                    throw new OutputPathException($"{output.Option} {output.Path} is a file, not a folder");
                }

                CheckNotOtherOutput(output, key, outputs, asFolder: true);
                folders.Add((output, key));
                foreach (var ancestor in key.Ancestors())
                {
                    folders.Add((output, ancestor));
                }

                continue;
            }

            foreach (var (input, inputKey) in inputs)
            {
                if (key == inputKey)
                {
                    throw new OutputPathException(
                        $"{Name(output)} would replace {input.Role} {input.Path} (the same file): an output may never replace an input; choose another path");
                }
            }

            if (Directory.Exists(full))
            {
                throw new OutputPathException($"{Name(output)} is a folder: a file name is needed");
            }

            if (File.Exists(full) && AtomicFile.IsReadOnly(full))
            {
                throw new OutputPathException(
                    $"{Name(output)} exists and is read-only: it is not replaced (make it writable, or choose another path)");
            }

            CheckNotOtherOutput(output, key, outputs);
            foreach (var (folder, folderKey) in folders)
            {
                if (key == folderKey)
                {
                    throw new OutputPathException(
                        $"{Name(folder)} and {Name(output)}: the same path would have to be a file and a folder; give each output its own path");
                }
            }

            outputs.Add((output, key));
            foreach (var ancestor in key.Ancestors())
            {
                CheckNotOtherOutput(output, ancestor, outputs, asFolder: true);
                folders.Add((output, ancestor));
            }
        }

        foreach (var folder in _replaced)
        {
            CheckReplaced(folder, inputs);
        }
    }

    /// <summary>Records that the outputs of <paramref name="option"/> are written (for <see cref="Outcome"/>).</summary>
    public void MarkWritten(string option) => _written.Add(option);

    /// <summary>One phrase saying which outputs were written and which were not, e.g.
    /// <c>wrote --json a.json; not written: --report r.html</c>.</summary>
    public string Outcome()
    {
        var named = _outputs.Select(o => (o.Option, o.Group)).Distinct()
            .Concat(_replaced.Select(r => (r.Option, Group: r.Path)))
            .Select(o => (o.Option, Text: $"{o.Option} {o.Group}")).ToList();
        if (named.Count == 0)
        {
            return "no output files were asked for";
        }

        var written = named.Where(o => _written.Contains(o.Option)).Select(o => o.Text).ToList();
        var missing = named.Where(o => !_written.Contains(o.Option)).Select(o => o.Text).ToList();
        return (written.Count, missing.Count) switch
        {
            (0, _) => $"nothing written ({string.Join(", ", missing)} not written)",
            (_, 0) => $"every output written ({string.Join(", ", written)})",
            _ => $"wrote {string.Join(", ", written)}; not written: {string.Join(", ", missing)}",
        };
    }

    /// <summary>The files that come with a capture: for a COMTRADE .cfg, the .dat, .hdr and .inf of the same stem
    /// in its folder, in any case (the reader accepts any case of the .dat).</summary>
    internal static IEnumerable<string> CaptureCompanions(string path)
    {
        if (!path.EndsWith(".cfg", StringComparison.OrdinalIgnoreCase))
        {
            return [];
        }

        var folder = Path.GetDirectoryName(Path.GetFullPath(path))!;
        var stem = Path.GetFileNameWithoutExtension(path);
        try
        {
            return [.. Directory.EnumerateFiles(folder)
                .Where(f => Path.GetFileNameWithoutExtension(f).Equals(stem, StringComparison.OrdinalIgnoreCase) &&
                            Path.GetExtension(f).ToLowerInvariant() is ".dat" or ".hdr" or ".inf")];
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return [];
        }
    }

    private static string Name(Output output) =>
        output.Group == output.Path ? $"{output.Option} {output.Path}" : $"{output.Option} {output.Group} ({Path.GetFileName(output.Path)})";

    private static void CheckNotOtherOutput(Output output, PathKey key, List<(Output Output, PathKey Key)> earlier, bool asFolder = false)
    {
        foreach (var (other, otherKey) in earlier)
        {
            if (key == otherKey)
            {
                throw new OutputPathException(asFolder
                    ? $"{Name(other)} and {Name(output)}: the same path would have to be a file and a folder; give each output its own path"
                    : $"{Name(other)} and {Name(output)} are the same file: give each output its own path");
            }
        }
    }

    private static void CheckReplaced(ReplacedFolder folder, List<(Input Input, PathKey Key)> inputs)
    {
        var full = Path.GetFullPath(folder.Path);
        if (File.Exists(full))
        {
            throw new OutputPathException($"{folder.Option} {folder.Path} is a file, not a folder");
        }

        if (AtomicFile.FileInFolderPath(full) is { } file)
        {
            throw new OutputPathException($"{folder.Option} {folder.Path}: {AtomicFile.AsGiven(folder.Path, file)} is a file, not a folder");
        }

        if (!Directory.Exists(full))
        {
            return;
        }

        // Inputs first (the usual mistake: "survey D -o D"), among the top-level entries, then what else is there,
        // then inside the entries the folder owns (its reports/ folder).
        var entries = Directory.EnumerateFileSystemEntries(full).Order(StringComparer.Ordinal).ToList();
        var existingInputs = inputs.Where(i => i.Key.Rest.Length == 0).ToList();
        CheckNoInput(folder, full, entries.Where(e => !Directory.Exists(e) || IsLink(e)), existingInputs);
        var owned = new HashSet<string>(folder.OwnedNames, StringComparer.Ordinal);
        foreach (var entry in entries)
        {
            var name = Path.GetFileName(entry);
            if (!owned.Contains(name) && !AtomicFile.IsTempName(name))
            {
                throw new OutputPathException(
                    $"{folder.Option} {folder.Path} holds {name}, which is not one of its outputs: a survey replaces its output folder as a whole and never deletes other files; choose a new or empty folder");
            }
        }

        var files = entries.SelectMany(e => Directory.Exists(e) && !IsLink(e)
            ? Directory.EnumerateFiles(e, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0 })
            : [e]).ToList();
        CheckNoInput(folder, full, files, existingInputs);
        foreach (var entry in files)
        {
            if (File.Exists(entry) && !AtomicFile.IsTempName(Path.GetFileName(entry)) && AtomicFile.IsReadOnly(entry))
            {
                throw new OutputPathException(
                    $"{folder.Option} {folder.Path} holds {Path.GetRelativePath(full, entry)}, which is read-only: it is not replaced (make it writable, or choose another folder)");
            }
        }
    }

    private static void CheckNoInput(ReplacedFolder folder, string full, IEnumerable<string> files, List<(Input Input, PathKey Key)> inputs)
    {
        foreach (var entry in files)
        {
            var identity = FileIdentity.Of(entry);
            foreach (var (input, key) in inputs)
            {
                if (identity is { } id && id == key.Anchor)
                {
                    throw new OutputPathException(
                        $"{folder.Option} {folder.Path} holds {input.Role} {input.Path}, which this run reads: the folder is replaced as a whole, so it may hold only what a survey writes; choose a new or empty folder");
                }
            }
        }
    }

    private static bool IsLink(string path) => new FileInfo(path).LinkTarget is not null;

    private sealed record Input(string Path, string Role);

    /// <summary>An output file, or (<paramref name="IsFolder"/>) a folder of named outputs; <paramref name="Group"/> is
    /// the path the user typed for the option.</summary>
    private sealed record Output(string Path, string Option, string Group, bool IsFolder = false);

    private sealed record ReplacedFolder(string Path, string Option, IReadOnlyCollection<string> OwnedNames);

    /// <summary>
    /// Where a path leads: the identity of the file, or for a path that does not exist yet the identity of its nearest
    /// existing ancestor and the rest of the path below it (case-folded where that ancestor folds case).
    /// </summary>
    private readonly record struct PathKey(FileIdentity Anchor, string Rest)
    {
        public static PathKey Of(string path, bool asOutput)
        {
            // Outputs are written at their full path (AtomicFile resolves ".." in the text first); inputs are opened
            // as given, so ".." after a symbolic link is resolved by the file system.
            if (!asOutput && FileIdentity.Of(path) is { } input)
            {
                return new PathKey(input, "");
            }

            var full = Path.GetFullPath(path);
            var rest = new List<string>();
            var at = full;
            while (true)
            {
                if (FileIdentity.Of(at) is { } anchor)
                {
                    rest.Reverse();
                    var joined = string.Join('/', rest);
                    if (joined.Length > 0 && Directory.Exists(at) && FileIdentity.FoldsCase(at))
                    {
                        joined = joined.ToUpperInvariant();
                    }

                    return new PathKey(anchor, joined);
                }

                var parent = Path.GetDirectoryName(at);
                if (parent is null)
                {
                    // Not even the root exists (an unmounted drive): compare the text.
                    return new PathKey(new FileIdentity(0, 0, full), "");
                }

                rest.Add(Path.GetFileName(at));
                at = parent;
            }
        }

        /// <summary>The keys of the folders between the anchor and this path (which do not exist yet).</summary>
        public IEnumerable<PathKey> Ancestors()
        {
            var anchor = Anchor;
            var parts = Rest.Split('/', StringSplitOptions.RemoveEmptyEntries);
            for (var n = 1; n < parts.Length; n++)
            {
                yield return new PathKey(anchor, string.Join('/', parts[..n]));
            }
        }
    }
}
