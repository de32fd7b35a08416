using System.CommandLine;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Synthesis;
using WaveCheck.Core.Model;
using WaveCheck.Core.Export;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck synth PART... -o FILE</c>: writes a test waveform of the standards as WAV or CSV.</summary>
internal static class SynthCommand
{
    public static Command Create()
    {
        var parts = new Argument<string[]>("part")
        {
            Description = "Parts to add up, each kind[:key=value,...]: " +
                          "sine:rms=30mA,freq=50 | halfwave:peak=30mA,angle=90[,polarity=neg] | dc:level=8mA | " +
                          "sixpulse:mean=20mA | switching:rms=5mA,freq=16kHz,motor=35Hz | composite:rms=20mA,motor=10Hz,switch=1kHz | " +
                          "noise:rms=0.1mA,seed=1",
            Arity = ArgumentArity.OneOrMore,
        };
        var output = new Option<string>("--output", "-o") { Description = "File to write: .wav or .csv.", Required = true };
        var rate = new Option<string>("--rate") { Description = "Sample rate, e.g. 50kHz.", DefaultValueFactory = _ => "50kHz" };
        var duration = new Option<string>("--duration") { Description = "Length, e.g. 2s or 10min.", DefaultValueFactory = _ => "2s" };
        var mains = new Option<string>("--mains") { Description = "Mains frequency for parts that do not state one, e.g. 50 or 60.", DefaultValueFactory = _ => "50" };
        var fullScale = new Option<string?>("--full-scale")
        {
            Description = "WAV full scale, e.g. 100mA; samples beyond it clip as on a recorder. Default: the next 1-2-5 step above 1.25 × the peak.",
        };
        var format = new Option<string>("--format") { Description = "WAV encoding: pcm16, pcm24, pcm32, float32 or float64.", DefaultValueFactory = _ => "float32" };
        var sensor = new Option<string>("--sensor") { Description = "Sensor coupling stored in the WAV: dc, ac or unknown.", DefaultValueFactory = _ => "dc" };

        var command = new Command("synth",
            "Write a test waveform (standard test currents, drive and charger leakage) to WAV or CSV. Examples:\n" +
            "  wavecheck synth halfwave:peak=30mA,angle=90 dc:level=8mA -o typeF-test.wav\n" +
            "  wavecheck synth composite:rms=20mA,motor=10Hz,switch=1kHz --mains 60 --rate 50kHz -o drive.csv")
        {
            parts, output, rate, duration, mains, fullScale, format, sensor,
        };
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var rateHz = Quantity.ParseFrequencyHz("--rate", parse.GetValue(rate)!);
            var durationS = Quantity.ParseDurationS("--duration", parse.GetValue(duration)!);
            var mainsHz = Quantity.ParseFrequencyHz("--mains", parse.GetValue(mains)!);
            if (rateHz < 100 || rateHz > 10_000_000 || rateHz != Math.Round(rateHz))
            {
                throw new OptionValueException("--rate", parse.GetValue(rate)!, "a whole number of hertz from 100 Hz to 10 MHz");
            }

            if (durationS <= 0 || durationS * rateHz > 4e9)
            {
                throw new OptionValueException("--duration", parse.GetValue(duration)!, "a positive duration of at most 4e9 samples");
            }

            var sensorCoupling = SensorCouplingNames.Parse("--sensor", parse.GetValue(sensor)!);
            var components = parse.GetValue(parts)!.SelectMany(p => SynthesisSpec.Parse(p, mainsHz)).ToList();
            var path = parse.GetValue(output)!;
            var plan = new OutputPlan();
            plan.AddOutputFile(path, "--output");
            plan.Check();
            run.Plan = plan;
            var extension = Path.GetExtension(path).ToLowerInvariant();
            SynthCaptureSource Source() => new(components, rateHz, durationS, sensorCoupling, description: path);

            long written;
            string scaleNote = string.Empty;
            if (extension == ".csv")
            {
                using var source = Source();
                written = CaptureWriter.WriteCsv(path, source, run.Token);
            }
            else if (extension == ".wav")
            {
                var encoding = ParseFormat(parse.GetValue(format)!);
                if (durationS * rateHz > CaptureWriter.MaxWavFrames(encoding, 1))
                {
                    throw new OptionValueException("--duration", parse.GetValue(duration)!, string.Create(CultureInfo.InvariantCulture,
                        $"at most {CaptureWriter.MaxWavFrames(encoding, 1):N0} samples in a {encoding} WAV (4 GiB of sample data): a shorter duration, or a .csv output"));
                }

                var fullScaleText = parse.GetValue(fullScale);
                double fullScaleA;
                if (fullScaleText is not null)
                {
                    fullScaleA = Quantity.ParsePositiveCurrentA("--full-scale", fullScaleText);
                }
                else
                {
                    using var scan = Source();
                    fullScaleA = NiceFullScale(PeakA(scan, run.Token));
                }

                using var source = Source();
                written = CaptureWriter.WriteWav(path, source, fullScaleA, encoding, run.Token);
                scaleNote = $", full scale {CurrentText.WithUnit(fullScaleA)}";
            }
            else
            {
                throw new OptionValueException("--output", path, "a file name ending in .wav or .csv");
            }

            plan.MarkWritten("--output");
            new Screen(run.Terminal).Paragraph(string.Create(CultureInfo.InvariantCulture,
                $"wrote {path}: {written:N0} samples at {rateHz:G6} Hz ({durationS:G6} s){scaleNote}; {string.Join(" + ", components.Select(c => c.Describe()))}"), "", "  ");
            return CliRun.Ok;
        }));
        return command;
    }

    private static double PeakA(ICaptureSource source, CancellationToken token)
    {
        var block = source.CreateBlock();
        var peak = 0.0;
        while (source.Read(block))
        {
            token.ThrowIfCancellationRequested();
            foreach (var v in block.ResidualA)
            {
                peak = Math.Max(peak, Math.Abs(v));
            }
        }

        return peak;
    }

    /// <summary>The next 1-2-5 step at or above 1.25 × the peak, as a logger's range would be chosen (at least 1 mA).</summary>
    internal static double NiceFullScale(double peakA)
    {
        var target = Math.Max(peakA * 1.25, 0.001);
        var decade = Math.Pow(10, Math.Floor(Math.Log10(target)));
        foreach (var step in new[] { 1.0, 2.0, 5.0, 10.0 })
        {
            if (step * decade >= target * (1 - 1e-12))
            {
                return step * decade;
            }
        }

        return 10 * decade;
    }

    private static WavSampleFormat ParseFormat(string text) => text.Trim().ToLowerInvariant() switch
    {
        "pcm16" => WavSampleFormat.Pcm16,
        "pcm24" => WavSampleFormat.Pcm24,
        "pcm32" => WavSampleFormat.Pcm32,
        "float32" => WavSampleFormat.Float32,
        "float64" => WavSampleFormat.Float64,
        _ => throw new OptionValueException("--format", text, "pcm16, pcm24, pcm32, float32 or float64"),
    };
}
