using CsCheck;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Tests.Capture;

namespace WaveCheck.Core.Tests.Results;

/// <summary>
/// Property: for generated sets of inputs and outputs, each spelt by one of many aliases of a few files, the guard
/// refuses exactly when an output resolves to an input or to another output; and when it lets a run go ahead, writing
/// every output (through <see cref="AtomicFile"/>, on real files) leaves every input as it was.
/// </summary>
/// <remarks>The truth each case is judged against is built independently of the guard: every alias is made from a
/// known file by one rule of POSIX path resolution (IEEE Std 1003.1, "Pathname Resolution": relative paths,
/// <c>.</c> and <c>..</c>, symbolic links to the file or to its folder, hard links), and case variants count as the
/// same file only where <see cref="File.Exists"/> says the file system finds them so.</remarks>
[System.Runtime.Versioning.UnsupportedOSPlatform("windows")] // symbolic and hard links as on POSIX
public class OutputPlanPropertyTests
{
    /// <summary>Files of the world: 0 to 3 exist (with content), 4 and 5 do not yet, 6 lies in a folder that does not exist.</summary>
    private static readonly string[] Targets = ["f0", "f1", "f2", "f3", "n4", "n5", "new/n6"];

    private const int Existing = 4;

    /// <summary>Ways to spell a target, each a function of the world and the target's index.</summary>
    private static readonly Func<World, int, string?>[] Aliases =
    [
        (w, t) => w.Real(t),
        (w, t) => Path.GetRelativePath(Environment.CurrentDirectory, w.Real(t)),
        (w, t) => Path.Combine(w.Root, "real", ".", "..", "real", Targets[t]),
        (w, t) => Path.Combine(w.Root, "real-link", Targets[t]),                  // a symbolic link to the folder
        (w, t) => t == 1 ? Path.Combine(w.Root, "f1-link") : null,                // a symbolic link to the file
        (w, t) => t == 2 ? Path.Combine(w.Root, "f2-hard") : null,                // a hard link
        (w, t) => t == 3 ? Path.Combine(w.Root, "real", "F3") : null,             // a case variant
    ];

    [Fact]
    public void The_guard_refuses_exactly_the_runs_where_an_output_meets_an_input_or_another_output()
    {
        var spelling = Gen.Select(Gen.Int[0, Targets.Length - 1], Gen.Int[0, Aliases.Length - 1]);
        var inputSpelling = Gen.Select(Gen.Int[0, Existing - 1], Gen.Int[0, Aliases.Length - 1]);
        var runs = Gen.Select(inputSpelling.Array[1, 3], spelling.Array[1, 4]);
        runs.Sample((inputs, outputs) =>
        {
            using var temp = new TempFolder();
            var world = new World(temp.Path);
            // An input exists: a case variant that does not reach its file is spelt plainly instead.
            var inputPaths = Spell(world, inputs)
                .Select(p => world.TrueFile(p.Target, p.Path) == Targets[p.Target] ? p : (Path: world.Real(p.Target), p.Target)).ToList();
            var outputPaths = Spell(world, outputs);
            var inputFiles = inputPaths.Select(p => world.TrueFile(p.Target, p.Path)).ToHashSet();
            var outputFiles = outputPaths.Select(p => world.TrueFile(p.Target, p.Path)).ToList();
            var shouldRefuse = outputFiles.Any(inputFiles.Contains) || outputFiles.Distinct().Count() < outputFiles.Count;

            var plan = new OutputPlan();
            foreach (var (path, _) in inputPaths)
            {
                plan.AddInput(path, "the capture");
            }

            for (var i = 0; i < outputPaths.Count; i++)
            {
                plan.AddOutputFile(outputPaths[i].Path, $"--out{i}");
            }

            var before = world.Contents();
            OutputPathException? refusal = null;
            try
            {
                plan.Check();
            }
            catch (OutputPathException e)
            {
                refusal = e;
            }

            Assert.True(shouldRefuse == refusal is not null,
                $"expected {(shouldRefuse ? "a refusal" : "no refusal")}, got {refusal?.Message ?? "none"}");
            if (refusal is not null)
            {
                Assert.Equal(before, world.Contents());
                return;
            }

            for (var i = 0; i < outputPaths.Count; i++)
            {
                AtomicFile.WriteText(outputPaths[i].Path, $"output {i}");
            }

            for (var i = 0; i < outputPaths.Count; i++)
            {
                Assert.Equal($"output {i}", File.ReadAllText(outputPaths[i].Path));
            }

            foreach (var (path, target) in inputPaths)
            {
                Assert.Equal(World.ContentOf(target), File.ReadAllText(path));
            }
        }, iter: 300, threads: 1, print: t => $"inputs {Show(t.Item1)}, outputs {Show(t.Item2)}");
    }

    private static List<(string Path, int Target)> Spell(World world, (int Target, int Alias)[] picks) =>
        [.. picks.Select(p => (Path: Aliases[p.Alias](world, p.Target) ?? world.Real(p.Target), p.Target))];

    private static string Show((int Target, int Alias)[] picks) =>
        string.Join(" ", picks.Select(p => $"{Targets[p.Target]}#{p.Alias}"));

    /// <summary>A folder <c>real/</c> with the files, a symbolic link <c>real-link</c> to it, <c>f1-link</c> to f1 and
    /// <c>f2-hard</c>, a hard link of f2.</summary>
    private sealed class World
    {
        private readonly bool _foldsCase;

        public World(string root)
        {
            Root = root;
            Directory.CreateDirectory(Path.Combine(root, "real"));
            for (var t = 0; t < Existing; t++)
            {
                File.WriteAllText(Real(t), ContentOf(t));
            }

            Directory.CreateSymbolicLink(Path.Combine(root, "real-link"), Path.Combine(root, "real"));
            File.CreateSymbolicLink(Path.Combine(root, "f1-link"), Real(1));
            HardLink.Create(Real(2), Path.Combine(root, "f2-hard"));
            _foldsCase = File.Exists(Path.Combine(root, "real", "F3"));
        }

        public string Root { get; }

        public static string ContentOf(int target) => $"input {Targets[target]}";

        public string Real(int target) => Path.Combine(Root, "real", Targets[target]);

        /// <summary>Which file a spelling reaches: the target, except a case variant where case is not folded, which is
        /// a file of its own.</summary>
        public string TrueFile(int target, string path) =>
            !_foldsCase && path.EndsWith("F3", StringComparison.Ordinal) ? "F3" : Targets[target];

        /// <summary>Every file in the world with its content (links followed).</summary>
        public Dictionary<string, string> Contents() =>
            Directory.EnumerateFiles(Root, "*", SearchOption.AllDirectories)
                .ToDictionary(f => Path.GetRelativePath(Root, f), File.ReadAllText);
    }
}
