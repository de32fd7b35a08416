using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Tests.Capture;

namespace WaveCheck.Core.Tests.Results;

/// <summary>Whole-or-nothing writes: temporary names, refusals, error messages, cancellation.</summary>
[System.Runtime.Versioning.UnsupportedOSPlatform("windows")] // chmod, symbolic and hard links as on POSIX
public class AtomicFileTests
{
    [Fact]
    public void A_240_character_name_is_written_and_no_temporary_file_is_left()
    {
        // Common practice, no source: NAME_MAX is 255 bytes on Linux and macOS file systems; the old temporary name
        // (".name.pid.guid.tmp") pushed a legal 240-character name over it.
        using var folder = new TempFolder();
        var name = new string('n', 235) + ".json";
        Assert.Equal(240, name.Length);
        AtomicFile.WriteText(folder.File(name), "{}");
        Assert.Equal("{}", File.ReadAllText(folder.File(name)));
        Assert.Equal([name], Directory.GetFiles(folder.Path).Select(Path.GetFileName));
    }

    [Fact]
    public void Temporary_names_are_short_and_recognised()
    {
        var name = AtomicFile.TempName();
        Assert.Matches("^\\.wc-[a-z0-9]{8}\\.tmp$", name);
        Assert.True(AtomicFile.IsTempName(name));
        Assert.False(AtomicFile.IsTempName("survey.csv"));
        Assert.NotEqual(name, AtomicFile.TempName());
    }

    [Fact]
    public void A_read_only_target_is_refused_and_left_as_it_was()
    {
        // The rename that makes a write atomic ignores the target's mode; a chmod 444 file must not be replaced.
        using var folder = new TempFolder();
        var target = folder.Write("kept.json", "old");
        File.SetUnixFileMode(target, UnixFileMode.UserRead | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
        var e = Assert.Throws<OutputPathException>(() => AtomicFile.WriteText(target, "new"));
        Assert.Contains("read-only", e.Message, StringComparison.Ordinal);
        Assert.Contains(target, e.Message, StringComparison.Ordinal);
        Assert.Equal("old", File.ReadAllText(target));
        Assert.Single(Directory.GetFiles(folder.Path));
    }

    [Fact]
    public void A_path_through_a_file_says_that_part_is_not_a_folder()
    {
        using var folder = new TempFolder();
        var file = folder.Write("afile", "x");
        var e = Assert.Throws<OutputPathException>(() => AtomicFile.WriteText(Path.Combine(file, "x.json"), "{}"));
        Assert.Equal($"{Path.Combine(file, "x.json")}: {file} is a file, not a folder", e.Message);
        Assert.DoesNotContain("exists", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_folder_as_target_is_refused()
    {
        using var folder = new TempFolder();
        var e = Assert.Throws<OutputPathException>(() => AtomicFile.WriteText(folder.Path, "{}"));
        Assert.Contains("is a folder", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_write_failure_names_the_target_and_never_the_temporary_file()
    {
        // A seek before the start of a file fails in the file system layer (an IOException on the temporary file),
        // standing in for a full disk: the message must name the target the user asked for.
        using var folder = new TempFolder();
        var target = folder.File("out.json");
        var e = Assert.Throws<OutputWriteException>(() => AtomicFile.Write(target, s =>
        {
            s.WriteByte(1);
            s.Seek(-10, SeekOrigin.Begin);
        }));
        Assert.StartsWith($"cannot write {target}: ", e.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(".wc-", e.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(".tmp", e.Message, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(folder.Path));
    }

    [Fact]
    public void A_full_disk_message_loses_the_temporary_name()
    {
        // The form of .NET's IOException for errno ENOSPC on Unix, "<strerror> : '<path>'", as seen writing to a full
        // 64 KiB tmpfs on Linux with .NET 10.
        var temp = "/d/.wc-abcdefgh.tmp";
        var reason = AtomicFile.Reason(new IOException($"No space left on device : '{temp}'"), temp, "/d/report.html");
        Assert.Equal("No space left on device", reason);
    }

    [Fact]
    public void An_error_inside_the_writer_leaves_the_old_file_and_no_temporary_one()
    {
        using var folder = new TempFolder();
        var target = folder.Write("r.json", "old");
        Assert.Throws<InvalidOperationException>(() => AtomicFile.Write(target, s =>
        {
            s.Write(new byte[100_000]);
            throw new InvalidOperationException("stop");
        }));
        Assert.Equal("old", File.ReadAllText(target));
        Assert.Single(Directory.GetFiles(folder.Path));
    }

    [Fact]
    public void Cancellation_part_way_leaves_the_old_file_and_no_temporary_one()
    {
        using var folder = new TempFolder();
        var target = folder.Write("r.json", "old");
        using var cancel = new CancellationTokenSource();
        Assert.ThrowsAny<OperationCanceledException>(() => AtomicFile.Write(target, s =>
        {
            s.Write(new byte[100_000]);
            Assert.Equal(2, Directory.GetFiles(folder.Path).Length);   // the temporary file exists while writing
            cancel.Cancel();
        }, cancel.Token));
        Assert.Equal("old", File.ReadAllText(target));
        Assert.Single(Directory.GetFiles(folder.Path));
    }
}
