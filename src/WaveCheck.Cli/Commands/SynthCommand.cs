using System.CommandLine;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Synthesis;
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
                          "sine:rms=30mA,freq=50Hz | halfwave:peak=30mA,angle=90[,polarity=neg] | dc:level=8mA | " +
                          "sixpulse:mean=20mA | switching:rms=5mA,freq=16kHz,motor=35Hz | composite:rms=20mA,motor=10Hz,switch=1kHz | " +
                          "noise:rms=0.1mA,seed=1",
            Arity = ArgumentArity.OneOrMore,
        };
        var output = new Option<string>("--output", "-o") { Description = "File to write: .wav or .csv.", HelpName = "FILE", Required = true };
        var rate = ValueOptions.Frequency("--rate", $"Sample rate, e.g. 50kHz (default {Quantity.FrequencyAsTyped(DefaultRateHz)}).");
        var duration = ValueOptions.Duration("--duration", $"Length, e.g. 2s or 10min (default {DefaultDurationS.ToString(CultureInfo.InvariantCulture)}s).");
        var mains = ValueOptions.Frequency("--mains", $"Mains frequency for parts that do not state one, e.g. 50Hz or 60Hz (default {Quantity.FrequencyAsTyped(DefaultMainsHz)}).");
        var fullScale = ValueOptions.Current("--full-scale",
            "WAV full scale, e.g. 100mA; samples beyond it clip as on a recorder. Default: the next 1-2-5 step above 1.25 × the peak.",
            positive: true);
        var format = ValueOptions.Choice("--format", $"WAV encoding: pcm16, pcm24, pcm32, float32 or float64 (default {DefaultFormat.ToString().ToLowerInvariant()}).",
            ("pcm16", WavSampleFormat.Pcm16), ("pcm24", WavSampleFormat.Pcm24), ("pcm32", WavSampleFormat.Pcm32),
            ("float32", WavSampleFormat.Float32), ("float64", WavSampleFormat.Float64));
        var sensor = ValueOptions.Choice("--sensor", $"Sensor coupling stored in the WAV: dc, ac or unknown (default {DefaultSensor.ToString().ToLowerInvariant()}).",
            ValueOptions.SensorWords);
        var supply = new Option<string?>("--supply")
        {
            HelpName = "VOLTAGE[,phases=3][,hN=P%]",
            Description = "Also write the circuit voltage to earth, e.g. 230V or 230V,phases=3,h5=4%; leak:r=500k,c=47nF[,phase=2] parts then draw leakage from it.",
        };
        var voltageFullScale = new Option<string?>("--voltage-full-scale")
        {
            HelpName = "VOLTAGE",
            Description = "WAV full scale of the voltage channels, e.g. 500V (default: the next 1-2-5 step above 1.25 × the peak).",
        };

        var command = new Command("synth",
            "Write a test waveform (standard test currents, drive and charger leakage) to WAV or CSV. Examples:\n" +
            "  wavecheck synth halfwave:peak=30mA,angle=90 dc:level=8mA -o typeF-test.wav\n" +
            "  wavecheck synth composite:rms=20mA,motor=10Hz,switch=1kHz --mains 60Hz --rate 50kHz -o drive.csv")
        {
            parts, output, rate, duration, mains, fullScale, format, sensor, supply, voltageFullScale,
        };
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var rateHz = parse.GetValue(rate) ?? DefaultRateHz;
            var durationS = parse.GetValue(duration) ?? DefaultDurationS;
            var mainsHz = parse.GetValue(mains) ?? DefaultMainsHz;
            if (rateHz < 100 || rateHz > 10_000_000 || rateHz != Math.Round(rateHz))
            {
                throw new OptionValueException("--rate", ImportOptionSet.Typed(parse, rate), "a whole number of hertz from 100 Hz to 10 MHz");
            }

            if (durationS <= 0 || durationS * rateHz > 4e9)
            {
                throw new OptionValueException("--duration", ImportOptionSet.Typed(parse, duration), "a positive duration of at most 4e9 samples");
            }

            var sensorCoupling = parse.GetValue(sensor) ?? DefaultSensor;
            var supplyText = parse.GetValue(supply);
            var supplyVoltage = supplyText is null ? null : SupplySpec.ParseSupply(supplyText, mainsHz);
            var components = parse.GetValue(parts)!.SelectMany(p => p.TrimStart().StartsWith("leak", StringComparison.OrdinalIgnoreCase)
                ? [SupplySpec.ParseLeak(p, supplyVoltage)]
                : SynthesisSpec.Parse(p, mainsHz)).ToList();
            var path = parse.GetValue(output)!;
            var plan = new OutputPlan();
            plan.AddOutputFile(path, "--output");
            plan.Check();
            run.Plan = plan;
            var extension = Path.GetExtension(path).ToLowerInvariant();
            SynthCaptureSource Source() => new(components, rateHz, durationS, sensorCoupling, description: path, supply: supplyVoltage);

            long written;
            string scaleNote = string.Empty;
            if (extension == ".csv")
            {
                using var source = Source();
                written = supplyVoltage is null
                    ? CaptureWriter.WriteCsv(path, source, run.Token)
                    : CaptureWriter.WriteCsvWithVoltage(path, source, run.Token);
            }
            else if (extension == ".wav")
            {
                var encoding = parse.GetValue(format) ?? DefaultFormat;
                var wavChannels = 1 + (supplyVoltage?.Phases ?? 0);
                if (durationS * rateHz > CaptureWriter.MaxWavFrames(encoding, wavChannels))
                {
                    throw new OptionValueException("--duration", ImportOptionSet.Typed(parse, duration), string.Create(CultureInfo.InvariantCulture,
                        $"at most {CaptureWriter.MaxWavFrames(encoding, wavChannels):N0} samples in a {encoding} WAV (4 GiB of sample data): a shorter duration, or a .csv output"));
                }

                double fullScaleA;
                if (parse.GetValue(fullScale) is { } given)
                {
                    fullScaleA = given;
                }
                else
                {
                    using var scan = Source();
                    fullScaleA = NiceFullScale(PeakA(scan, run.Token));
                }

                using var source = Source();
                if (supplyVoltage is null)
                {
                    written = CaptureWriter.WriteWav(path, source, fullScaleA, encoding, run.Token);
                    scaleNote = $", full scale {CurrentText.WithUnit(fullScaleA)}";
                }
                else
                {
                    var fullScaleVText = parse.GetValue(voltageFullScale);
                    var peakV = supplyVoltage.Sines(0).Sum(s => s.PeakV);
                    var fullScaleV = fullScaleVText is null ? NiceFullScale(peakV / 1000) * 1000 : Quantity.ParseVoltageV("--voltage-full-scale", fullScaleVText);
                    if (!(fullScaleV > 0 && fullScaleV <= ImportOptions.MaxVoltageScale))
                    {
                        throw new OptionValueException("--voltage-full-scale", fullScaleVText ?? string.Empty, "a positive voltage up to 1 MV");
                    }

                    written = CaptureWriter.WriteWavWithVoltage(path, source, fullScaleA, fullScaleV, encoding, run.Token);
                    var names = string.Join(",", Enumerable.Range(2, supplyVoltage.Phases).Select(c => $"ch{c}"));
                    scaleNote = string.Create(CultureInfo.InvariantCulture,
                        $", full scale {CurrentText.WithUnit(fullScaleA)} on ch1, voltage on {names} at {fullScaleV:G6} V full scale (read with --voltage {names} --voltage-scale {fullScaleV:G6}V)");
                }
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

    /// <summary>Sample rate when <c>--rate</c> is not given: the rate the cautions recommend.</summary>
    private const double DefaultRateHz = Limits.RecommendedSampleRateHz;

    /// <summary>Length when <c>--duration</c> is not given, seconds.</summary>
    private const double DefaultDurationS = 2;

    /// <summary>Mains frequency of parts that do not state one when <c>--mains</c> is not given.</summary>
    private const double DefaultMainsHz = 50;

    /// <summary>WAV encoding when <c>--format</c> is not given.</summary>
    private const WavSampleFormat DefaultFormat = WavSampleFormat.Float32;

    /// <summary>Sensor coupling stored when <c>--sensor</c> is not given: a synthesized current has its DC.</summary>
    private const SensorCoupling DefaultSensor = SensorCoupling.Dc;
}
