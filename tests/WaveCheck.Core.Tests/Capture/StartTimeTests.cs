using System.Text;
using NAudio.Wave;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>When a recording started, as each format states it: the CSV preamble's <c>start:</c> line
/// (docs/formats.md), a WAV's Broadcast Wave <c>bext</c> chunk or <c>LIST</c>/<c>INFO</c> <c>ICRD</c> entry.</summary>
public sealed class StartTimeTests : IDisposable
{
    private static readonly DateTimeOffset Start = new(2026, 11, 20, 9, 14, 0, TimeSpan.Zero);

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData("# start: 2026-11-20T09:14:00Z\n")]
    [InlineData("# logger: CP-7 yard, bay 3\n# start: 2026-11-20T09:14:00Z\n")]
    [InlineData("% Start Time = 2026-11-20T10:14:00+01:00\n")]
    [InlineData("start: 2026-11-20 09:14:00\n")]
    public void Csv_preamble_start_line_gives_the_start_time(string preamble)
    {
        // docs/formats.md's own example preamble; a stamp without an offset is UTC, as time-stamp cells are read.
        var path = _folder.Write("log.csv", preamble + "Zeit [ms];L1 [A]\n0,00;0,012\n0,10;0,013\n0,20;0,011\n");

        using var source = CaptureOpener.Open(path, new ImportOptions());

        Assert.Equal(Start, source.Info.StartTime);
    }

    [Fact]
    public void Csv_time_stamp_column_wins_over_the_preamble()
    {
        // The first row's stamp is the recording's own clock, to the sample; the preamble line is a note beside it.
        var path = _folder.Write("log.csv", "# start: 2020-01-01T00:00:00Z\ntime,I [mA]\n2026-11-20T09:14:00Z,1\n2026-11-20T09:14:00.001Z,2\n2026-11-20T09:14:00.002Z,3\n");

        using var source = CaptureOpener.Open(path, new ImportOptions());

        Assert.Equal(Start, source.Info.StartTime);
    }

    [Theory]
    [InlineData("# start: soon\n")]
    [InlineData("# started by: operator 3\n")]
    [InlineData("")]
    public void Csv_without_a_readable_start_line_states_none(string preamble)
    {
        // A logger's note that is no time is not an error: the file simply does not say when it started.
        var path = _folder.Write("log.csv", preamble + "t [s],I [mA]\n0,1\n0.001,2\n0.002,3\n");

        using var source = CaptureOpener.Open(path, new ImportOptions());

        Assert.Null(source.Info.StartTime);
    }

    [Fact]
    public void Wav_bext_origination_date_and_time_give_the_start_time()
    {
        // EBU Tech 3285 (Broadcast Wave), bext layout from memory: Description 256 bytes, Originator 32,
        // OriginatorReference 32, OriginationDate 10 ("yyyy-mm-dd"), OriginationTime 8 ("hh:mm:ss"), TimeReference 8, ...
        var bext = new byte[602];
        Encoding.ASCII.GetBytes("invented car-park recording").CopyTo(bext, 0);
        Encoding.ASCII.GetBytes("2026-11-20").CopyTo(bext, 320);
        Encoding.ASCII.GetBytes("09:14:00").CopyTo(bext, 330);
        var path = WriteWav("bext.wav", ("bext", bext));

        using var source = CaptureOpener.Open(path, new ImportOptions());

        Assert.Equal(Start, source.Info.StartTime);
    }

    [Fact]
    public void Wav_list_info_creation_date_gives_the_start_time()
    {
        // RIFF INFO list (Microsoft/IBM Multimedia Programming Interface 1.0): "INFO", then entries id, size, text;
        // ICRD is the creation date, written here as ISO 8601.
        var path = WriteWav("list.wav", ("LIST", InfoList(("INAM", "fan test"), ("ICRD", "2026-11-20T09:14:00Z"))));

        using var source = CaptureOpener.Open(path, new ImportOptions());

        Assert.Equal(Start, source.Info.StartTime);
    }

    [Fact]
    public void Wav_bext_wins_over_list_info()
    {
        var bext = new byte[602];
        Encoding.ASCII.GetBytes("2026-11-20").CopyTo(bext, 320);
        Encoding.ASCII.GetBytes("09:14:00").CopyTo(bext, 330);
        var path = WriteWav("both.wav", ("LIST", InfoList(("ICRD", "1999-01-01"))), ("bext", bext));

        using var source = CaptureOpener.Open(path, new ImportOptions());

        Assert.Equal(Start, source.Info.StartTime);
    }

    [Fact]
    public void Wav_with_an_empty_bext_date_or_no_chunk_states_none()
    {
        var path = WriteWav("blank.wav", ("bext", new byte[602]));
        var plain = WriteWav("plain.wav");

        using var blank = CaptureOpener.Open(path, new ImportOptions());
        using var none = CaptureOpener.Open(plain, new ImportOptions());

        Assert.Null(blank.Info.StartTime);
        Assert.Null(none.Info.StartTime);
    }

    private string WriteWav(string name, params (string Id, byte[] Payload)[] chunks)
    {
        var path = _folder.File(name);
        using var writer = new WaveFileWriter(path, new WaveFormat(8000, 16, 1));
        writer.AddChunk("wvck", "fullScaleA=0.1"u8.ToArray(), ChunkPosition.BeforeData);
        foreach (var (id, payload) in chunks)
        {
            writer.AddChunk(id, payload, ChunkPosition.BeforeData);
        }

        var samples = new byte[1600];
        writer.Write(samples, 0, samples.Length);
        return path;
    }

    private static byte[] InfoList(params (string Id, string Text)[] entries)
    {
        using var bytes = new MemoryStream();
        bytes.Write("INFO"u8);
        foreach (var (id, text) in entries)
        {
            var value = Encoding.ASCII.GetBytes(text + "\0");
            bytes.Write(Encoding.ASCII.GetBytes(id));
            bytes.Write(BitConverter.GetBytes(value.Length));
            bytes.Write(value);
            if (value.Length % 2 == 1)
            {
                bytes.WriteByte(0);
            }
        }

        return bytes.ToArray();
    }
}
