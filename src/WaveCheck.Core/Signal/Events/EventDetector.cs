using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The events of a capture, found window by window in time order: alarms (consecutive windows whose RMS exceeds the
/// alarm current, one event per stretch with its highest RMS), transients (a window whose largest absolute sample
/// exceeds <see cref="AnalysisOptions.TransientFactor"/> times its RMS and <see cref="AnalysisOptions.TransientFloorA"/>,
/// one event at that sample) and clipped stretches (consecutive windows at full scale, one warning each). Bounded:
/// at most <see cref="MaxTransients"/> transients and <see cref="MaxClippingWarnings"/> stretches are listed, a warning
/// counts the rest. Not thread-safe; one instance per capture.
/// </summary>
internal sealed class EventDetector
{
    /// <summary>Most transient events listed (a warning counts the rest).</summary>
    public const int MaxTransients = 1000;

    /// <summary>Most clipped stretches listed as warnings (a warning counts the rest; engineering choice: enough to
    /// show where a capture clips, few enough to read).</summary>
    public const int MaxClippingWarnings = 20;

    private readonly double _fs;
    private readonly double? _alarmA;
    private readonly double _transientFactor;
    private readonly double _transientFloorA;
    private readonly double? _fullScaleA;
    private readonly List<EventRecord> _events = [];
    private readonly List<CaptureWarning> _warnings = [];
    private (double StartS, double EndS, double MaxA)? _alarm;
    private int _transients;
    private (double StartS, double EndS)? _clipStretch;
    private int _clipStretches;

    /// <summary>Sets up the detection for one capture.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="options">Alarm current and transient thresholds.</param>
    /// <param name="fullScaleA">The capture's full scale, amperes, named in clipping warnings; null when unknown.</param>
    public EventDetector(double sampleRateHz, AnalysisOptions options, double? fullScaleA)
    {
        _fs = sampleRateHz;
        _alarmA = options.AlarmA;
        _transientFactor = options.TransientFactor;
        _transientFloorA = options.TransientFloorA;
        _fullScaleA = fullScaleA;
    }

    /// <summary>The events found so far; in time order after <see cref="Close"/>.</summary>
    public IReadOnlyList<EventRecord> Events => _events;

    /// <summary>The clipped stretches closed so far, as warnings, in time order.</summary>
    public IReadOnlyList<CaptureWarning> Warnings => _warnings;

    /// <summary>Takes the next window.</summary>
    /// <param name="windowA">The window's samples, amperes (searched for the transient's sample).</param>
    /// <param name="window">The window's figures.</param>
    /// <param name="peakA">The window's largest absolute sample, amperes.</param>
    public void Add(ReadOnlySpan<double> windowA, WindowResult window, double peakA)
    {
        var endS = window.StartS + window.DurationS;
        if (_alarmA is { } alarm && window.RmsA > alarm)
        {
            _alarm = _alarm is { } open
                ? (open.StartS, endS, Math.Max(open.MaxA, window.RmsA))
                : (window.StartS, endS, window.RmsA);
        }
        else
        {
            CloseAlarm();
        }

        if (window.Clipped)
        {
            _clipStretch = _clipStretch is { } open ? (open.StartS, endS) : (window.StartS, endS);
        }
        else
        {
            CloseClipStretch();
        }

        if (peakA > _transientFactor * window.RmsA && peakA > _transientFloorA)
        {
            _transients++;
            if (_transients <= MaxTransients)
            {
                var at = 0;
                for (var i = 1; i < windowA.Length; i++)
                {
                    if (Math.Abs(windowA[i]) > Math.Abs(windowA[at]))
                    {
                        at = i;
                    }
                }

                var value = windowA[at];
                _events.Add(new EventRecord("transient", window.StartS + (at / _fs), 1 / _fs, value,
                    string.Create(CultureInfo.InvariantCulture,
                        $"peak {CurrentText.WithUnit(value)}, {peakA / window.RmsA:0.0} times the window RMS of {CurrentText.WithUnit(window.RmsA)}")));
            }
        }
    }

    /// <summary>Ends the stretches still open at the end of the capture and puts the events in time order.</summary>
    public void Close()
    {
        CloseAlarm();
        CloseClipStretch();
        _events.Sort((a, b) => a.StartS.CompareTo(b.StartS));
    }

    /// <summary>Adds the warnings that count what was found but not listed.</summary>
    public void AddCountWarnings(List<CaptureWarning> warnings)
    {
        if (_clipStretches > MaxClippingWarnings)
        {
            warnings.Add(new CaptureWarning("clipping", $"{_clipStretches - MaxClippingWarnings} more clipped stretches not listed"));
        }

        if (_transients > MaxTransients)
        {
            warnings.Add(new CaptureWarning("transients-truncated",
                $"{_transients} transients found; the first {MaxTransients} are listed"));
        }
    }

    private void CloseAlarm()
    {
        if (_alarm is not { } open)
        {
            return;
        }

        _alarm = null;
        _events.Add(new EventRecord("alarm", open.StartS, open.EndS - open.StartS, open.MaxA,
            string.Create(CultureInfo.InvariantCulture,
                $"window RMS above {CurrentText.WithUnit(_alarmA!.Value)} for {open.EndS - open.StartS:0.###} s, highest {CurrentText.WithUnit(open.MaxA)}")));
    }

    private void CloseClipStretch()
    {
        if (_clipStretch is not { } open)
        {
            return;
        }

        _clipStretch = null;
        _clipStretches++;
        if (_clipStretches <= MaxClippingWarnings)
        {
            _warnings.Add(new CaptureWarning("clipping", string.Create(CultureInfo.InvariantCulture,
                $"samples at full scale (±{CurrentText.WithUnit(_fullScaleA ?? 0)}) from {open.StartS:0.###} s to {open.EndS:0.###} s: peaks and RMS there are lower bounds"),
                open.StartS));
        }
    }
}
