using Parquet;
using Parquet.Schema;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// The survey as Apache Parquet tables, for analysis in other tools: one row per capture (<see cref="WriteCaptures"/>)
/// and one row per window of every capture (<see cref="OpenWindows"/>). Column names are the JSON property names with
/// their SI unit; numbers are nullable doubles, null where the figure does not exist or is not finite.
/// </summary>
/// <remarks>Parquet.Net's API is asynchronous; these calls block on it from a thread-pool task, so they are safe to
/// call from any thread, including one with a synchronisation context.</remarks>
public static class ParquetTables
{
    /// <summary>Rows per row group of the window table, and the most it buffers: 50 000 windows of 0.2 s is about
    /// 2.8 hours of capture (engineering choice: a few megabytes in memory, large enough groups for fast reading).</summary>
    public const int DefaultRowGroupSize = 50_000;

    /// <summary>Writes the per-capture table whole or not at all.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="rows">One per capture, in order.</param>
    public static void WriteCaptures(string path, IReadOnlyList<SurveyRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        var columns = SurveyColumns.All;
        AtomicFile.Write(path, stream => Block(async () =>
        {
            await using var writer = await ParquetWriter.CreateAsync(Schema(columns), stream).ConfigureAwait(false);
            await WriteGroupAsync(writer, columns, rows).ConfigureAwait(false);
        }));
    }

    /// <summary>Starts the per-window table: a temporary file (named as <see cref="AtomicFile"/> names them) beside <paramref name="path"/> that
    /// <see cref="ParquetWindowTable.Complete"/> renames over it.</summary>
    /// <param name="path">Target file; its folder is created if missing.</param>
    /// <param name="rowGroupSize">Windows per row group (the most held in memory).</param>
    public static ParquetWindowTable OpenWindows(string path, int rowGroupSize = DefaultRowGroupSize) => new(path, rowGroupSize);

    internal static ParquetSchema Schema<TRow>(IReadOnlyList<TableColumn<TRow>> columns) =>
        new([.. columns.Select(c => (Field)c.Field)]);

    internal static async Task WriteGroupAsync<TRow>(ParquetWriter writer, IReadOnlyList<TableColumn<TRow>> columns,
        IReadOnlyList<TRow> rows)
    {
        using var group = writer.CreateRowGroup();
        foreach (var column in columns)
        {
            await column.WriteAsync(group, rows).ConfigureAwait(false);
        }

        group.CompleteValidate();
    }

    /// <summary>Runs asynchronous work to the end on the thread pool and rethrows its exception as is.</summary>
    internal static void Block(Func<Task> work) => Task.Run(work).GetAwaiter().GetResult();
}

/// <summary>A window of one capture, as a row of the window table.</summary>
/// <param name="File">The capture.</param>
/// <param name="Window">Its figures.</param>
internal readonly record struct WindowRow(string File, WindowResult Window);

/// <summary>
/// The per-window table, written as windows arrive: they are buffered up to one row group, which is then written and
/// released, so memory does not grow with the length or number of captures. Nothing appears at the target path until
/// <see cref="Complete"/>; disposing without it deletes the temporary file.
/// </summary>
/// <remarks>Thread-safe: jobs of a parallel survey may add windows at the same time (rows of different captures then
/// interleave; the <c>file</c> column tells them apart).</remarks>
public sealed class ParquetWindowTable : IDisposable
{
    private static readonly IReadOnlyList<TableColumn<WindowRow>> Columns =
    [
        new TextColumn<WindowRow>("file", r => r.File, nullable: false),
        .. WindowTable.Columns<WindowRow>(r => r.Window),
    ];

    private readonly object _gate = new();
    private readonly string _given;
    private readonly string _path;
    private readonly string _temp;
    private readonly int _rowGroupSize;
    private readonly List<WindowRow> _buffer;
    private FileStream? _stream;
    private ParquetWriter? _writer;
    private bool _completed;

    internal ParquetWindowTable(string path, int rowGroupSize)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentOutOfRangeException.ThrowIfLessThan(rowGroupSize, 1);
        _given = path;
        _path = Path.GetFullPath(path);
        var folder = Path.GetDirectoryName(_path)!;
        AtomicFile.CheckTarget(path, _path);
        AtomicFile.CreateFolder(path, folder);
        _rowGroupSize = rowGroupSize;
        _buffer = new List<WindowRow>(Math.Min(rowGroupSize, 4096));
        (_temp, _stream) = AtomicFile.CreateTemp(path, folder);
        try
        {
            var stream = _stream;
            ParquetWriter? writer = null;
            NamingTarget(() => ParquetTables.Block(async () =>
                writer = await ParquetWriter.CreateAsync(ParquetTables.Schema(Columns), stream).ConfigureAwait(false)));
            _writer = writer;
        }
        catch
        {
            Dispose();
            throw;
        }
    }

    /// <summary>Windows added so far.</summary>
    public long RowCount { get; private set; }

    /// <summary>Row groups written so far.</summary>
    public int RowGroupCount { get; private set; }

    /// <summary>Adds one window of a capture; writes a row group when the buffer is full.</summary>
    /// <param name="file">The capture, as in its survey row.</param>
    /// <param name="window">The window's figures.</param>
    public void Add(string file, WindowResult window)
    {
        ArgumentNullException.ThrowIfNull(file);
        ArgumentNullException.ThrowIfNull(window);
        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_writer is null, this);
            _buffer.Add(new WindowRow(file, window));
            RowCount++;
            if (_buffer.Count >= _rowGroupSize)
            {
                Flush();
            }
        }
    }

    /// <summary>Writes what is buffered and the file's footer, then moves the file to its target path.</summary>
    public void Complete()
    {
        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_writer is null, this);
            if (_buffer.Count > 0 || RowGroupCount == 0)
            {
                Flush();
            }

            var writer = _writer;
            NamingTarget(() =>
            {
                ParquetTables.Block(async () => await writer.DisposeAsync().ConfigureAwait(false));
                _writer = null;
                if (_stream!.CanWrite)
                {
                    _stream.Flush(flushToDisk: true);
                }

                _stream.Dispose();
                _stream = null;
                File.Move(_temp, _path, overwrite: true);
            });
            _completed = true;
        }
    }

    /// <summary>Releases the file; without <see cref="Complete"/> the temporary file is deleted and the target untouched.</summary>
    public void Dispose()
    {
        lock (_gate)
        {
            if (_writer is not null)
            {
                var writer = _writer;
                _writer = null;
                try
                {
                    ParquetTables.Block(async () => await writer.DisposeAsync().ConfigureAwait(false));
                }
                catch (IOException)
                {
                    // The file is being abandoned; a failure to finish it does not matter.
                }
            }

            if (_stream is not null && !_completed)
            {
                AtomicFile.Abandon(_stream, _temp);
            }

            _stream?.Dispose();
            _stream = null;
        }
    }

    private void Flush()
    {
        var writer = _writer!;
        var rows = _buffer.ToArray();
        NamingTarget(() => ParquetTables.Block(() => ParquetTables.WriteGroupAsync(writer, Columns, rows)));
        _buffer.Clear();
        RowGroupCount++;
    }

    /// <summary>Runs a step on the temporary file; a failure is reported against the target, not the temporary name.</summary>
    private void NamingTarget(Action step)
    {
        try
        {
            step();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException && e is not OutputWriteException)
        {
            throw new OutputWriteException(_given, AtomicFile.Reason(e, _temp, _path), e);
        }
    }
}
