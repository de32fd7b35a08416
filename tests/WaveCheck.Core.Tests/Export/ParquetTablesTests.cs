using Parquet;
using Parquet.Schema;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Results;

/// <summary>Our Parquet output read back with Parquet.Net's own reader (the reference for the format).</summary>
public sealed class ParquetTablesTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("wavecheck-parquet-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public async Task Capture_table_reads_back_with_values_and_nulls()
    {
        var rows = new[]
        {
            new ResultBuilder { RmsA = 0.0042, WorstWindowRmsA = 0.0051, Blinded = true }.Row("c1.wav", "C1 saw"),
            SurveyRows.Failed("c2.wav", new CaptureSettings { RatedResidualCurrentA = 0.1 }, "c2.wav: not a WAV file"),
            new ResultBuilder { RmsA = double.NaN }.Row("c3.wav"),
        };
        var path = Path.Combine(_folder, "captures.parquet");
        ParquetTables.WriteCaptures(path, rows);

        await using var reader = await ParquetReader.CreateAsync(File.OpenRead(path));
        Assert.Equal(1, reader.RowGroupCount);
        using var group = reader.OpenRowGroupReader(0);
        Assert.Equal(3, group.RowCount);
        Assert.Equal(SurveyCsvWriter.Header, reader.Schema.GetDataFields().Select(f => f.Name));

        Assert.Equal(new string?[] { "c1.wav", "c2.wav", "c3.wav" }, (IEnumerable<string?>)await Strings(reader, group, "file", 3));
        Assert.Equal(new string?[] { "C1 saw", null, null }, (IEnumerable<string?>)await Strings(reader, group, "circuit", 3));
        Assert.Equal(new string?[] { "ok", "error", "ok" }, (IEnumerable<string?>)await Strings(reader, group, "verdict", 3));
        Assert.Equal(new string?[] { null, "c2.wav: not a WAV file", null }, (IEnumerable<string?>)await Strings(reader, group, "error", 3));
        // NaN is stored as null, as in the JSON form.
        Assert.Equal([0.0042, null, null], await Numbers(reader, group, "rmsA", 3));
        Assert.Equal([0.03, 0.1, 0.03], await Numbers(reader, group, "ratedResidualCurrentA", 3));
        var blinded = new bool?[3];
        await group.ReadAsync(Field(reader, "blinded"), blinded.AsMemory());
        Assert.Equal([true, null, false], blinded);
    }

    [Fact]
    public async Task Window_table_is_written_in_row_groups_as_windows_arrive()
    {
        var path = Path.Combine(_folder, "windows.parquet");
        using (var table = ParquetTables.OpenWindows(path, rowGroupSize: 3))
        {
            for (var i = 0; i < 7; i++)
            {
                table.Add(i < 4 ? "a.wav" : "b.wav", Window(i));
                // Nothing at the target path until Complete; at most one row group buffered.
                Assert.False(File.Exists(path));
            }

            Assert.Equal(2, table.RowGroupCount);   // 7 windows in groups of 3: two full groups written, one window buffered
            table.Complete();
            Assert.Equal(3, table.RowGroupCount);
            Assert.Equal(7, table.RowCount);
        }

        Assert.Single(Directory.GetFiles(_folder));
        await using var reader = await ParquetReader.CreateAsync(File.OpenRead(path));
        Assert.Equal(3, reader.RowGroupCount);
        var files = new List<string?>();
        var starts = new List<double?>();
        var rms = new List<double?>();
        var pulsating = new List<bool?>();
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var group = reader.OpenRowGroupReader(g);
            var n = (int)group.RowCount;
            Assert.Equal(g < 2 ? 3 : 1, n);
            files.AddRange(await Strings(reader, group, "file", n));
            starts.AddRange(await Numbers(reader, group, "startS", n));
            rms.AddRange(await Numbers(reader, group, "rmsA", n));
            var flags = new bool?[n];
            await group.ReadAsync(Field(reader, "pulsatingDc"), flags.AsMemory());
            pulsating.AddRange(flags);
        }

        Assert.Equal(["a.wav", "a.wav", "a.wav", "a.wav", "b.wav", "b.wav", "b.wav"], files);
        Assert.Equal(Enumerable.Range(0, 7).Select(i => (double?)(0.2 * i)), starts);
        Assert.Equal(Enumerable.Range(0, 7).Select(i => (double?)(0.001 * (i + 1))), rms);
        Assert.Equal(Enumerable.Range(0, 7).Select(i => (bool?)(i % 2 == 0)), pulsating);
        Assert.Equal(
            // The same columns as the per-window CSV (one list, WindowTable), after the file they belong to.
            ["file", "startS", "durationS", "frequencyHz", "rmsA", "dcA", "acRmsA", "peakPositiveA", "peakNegativeA",
             "crestFactor", "smoothDcA", "pulsatingDc", "currentDelayAngleDeg", "mainsRmsA", "belowMainsRmsA",
             "harmonicsRmsA", "above1kHzRmsA", "above9kHzRmsA", "thdPercent", "clipped"],
            reader.Schema.GetDataFields().Select(f => f.Name));
    }

    [Fact]
    public void Window_table_abandoned_without_complete_leaves_nothing()
    {
        var path = Path.Combine(_folder, "windows.parquet");
        using (var table = ParquetTables.OpenWindows(path, rowGroupSize: 2))
        {
            for (var i = 0; i < 5; i++)
            {
                table.Add("a.wav", Window(i));
            }
        }

        Assert.Empty(Directory.GetFiles(_folder));
    }

    [Fact]
    public async Task Window_table_takes_windows_from_several_threads()
    {
        var path = Path.Combine(_folder, "windows.parquet");
        using (var table = ParquetTables.OpenWindows(path, rowGroupSize: 100))
        {
            Parallel.For(0, 4, f =>
            {
                for (var i = 0; i < 250; i++)
                {
                    table.Add($"c{f}.wav", Window(i));
                }
            });
            table.Complete();
        }

        await using var reader = await ParquetReader.CreateAsync(File.OpenRead(path));
        long total = 0;
        var perFile = new Dictionary<string, int>();
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var group = reader.OpenRowGroupReader(g);
            total += group.RowCount;
            foreach (var file in await Strings(reader, group, "file", (int)group.RowCount))
            {
                perFile[file!] = perFile.GetValueOrDefault(file!) + 1;
            }
        }

        Assert.Equal(1000, total);   // 4 threads × 250 windows, none lost
        Assert.All(perFile.Values, count => Assert.Equal(250, count));
        Assert.Equal(10, reader.RowGroupCount);   // 1000 / 100
    }

    private static WindowResult Window(int i) => new()
    {
        StartS = 0.2 * i,
        DurationS = 0.2,
        FrequencyHz = 50,
        RmsA = 0.001 * (i + 1),
        DcA = 0,
        AcRmsA = 0.001 * (i + 1),
        PeakPositiveA = 0.002,
        PeakNegativeA = -0.002,
        CrestFactor = 1.41,
        SmoothDcA = 0,
        PulsatingDc = i % 2 == 0,
        MainsRmsA = 0.001,
        BelowMainsRmsA = 0,
        HarmonicsRmsA = 0,
        Above1kHzRmsA = 0,
        Above9kHzRmsA = 0,
    };

    private static DataField Field(ParquetReader reader, string name) =>
        reader.Schema.GetDataFields().Single(f => f.Name == name);

    private static async Task<string?[]> Strings(ParquetReader reader, ParquetRowGroupReader group, string name, int n)
    {
        var values = new string?[n];
        await group.ReadAsync(Field(reader, name), values.AsMemory());
        return values;
    }

    private static async Task<double?[]> Numbers(ParquetReader reader, ParquetRowGroupReader group, string name, int n)
    {
        var values = new double?[n];
        await group.ReadAsync(Field(reader, name), values.AsMemory());
        return values;
    }
}
