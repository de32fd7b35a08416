using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Survey;

/// <summary>The settings of a capture as a site file states them, in <c>defaults</c> or in a capture entry: each
/// key read into a <see cref="CaptureSettingsPatch"/>, null meaning "not stated".</summary>
internal static class SiteSettingsReader
{
    /// <summary>Keys of the settings, in <c>defaults</c> and in a capture entry.</summary>
    public static readonly string[] Keys =
        ["rated", "device", "sensor", "regime", "ev", "chargerDcDetection", "scale", "sensitivity", "range", "rate", "channel", "sum", "voltage", "voltageScale"];

    /// <summary>The settings <paramref name="item"/> states.</summary>
    /// <param name="values">Reads the values and names their mistakes.</param>
    /// <param name="item">An object: <c>defaults</c> or a capture entry.</param>
    /// <param name="allowed">Every key the object may hold (settings, and for an entry its own keys, read elsewhere).</param>
    /// <param name="where">The object as a message names it (<c>defaults</c>, <c>a capture entry</c>).</param>
    public static CaptureSettingsPatch Read(SiteValues values, SiteJsonNode item, string[] allowed, string where)
    {
        var patch = new CaptureSettingsPatch();
        foreach (var (key, keyNode, value) in item.Members!)
        {
            if (Array.IndexOf(allowed, key) < 0)
            {
                throw values.UnknownKey(keyNode, allowed, where);
            }

            patch = key switch
            {
                "file" => patch,
                "reportNumber" or "date" or "productTest" => patch,
                "circuit" => patch with { Circuit = values.OptionalString(value, key) },
                "state" => patch with { State = values.OptionalString(value, key) },
                "rated" => patch with { RatedResidualCurrentA = values.RatedOf(value) },
                "device" => patch with { InstalledProtection = values.DeviceOf(value) },
                "sensor" => patch with { Sensor = values.SensorOf(value) },
                "regime" => patch with { Regime = values.RegimeOf(value) },
                "ev" => patch with { Ev = values.BoolOf(value, key) },
                "chargerDcDetection" => patch with { ChargerDcDetection = values.BoolOf(value, key) },
                "scale" => patch with { ScaleA = values.Bounded(value, key, values.CurrentOf(value, key)) },
                "sensitivity" => patch with { SensitivityVPerA = values.Bounded(value, key, values.QuantityOf(value, key, "V/A", Quantity.SensitivityForm, static (k, t) => Quantity.ParseSensitivityVPerA(k, t))) },
                "range" => patch with { RangeV = values.Bounded(value, key, values.QuantityOf(value, key, "V", Quantity.VoltageForm, static (k, t) => Quantity.ParseVoltageV(k, t))) },
                "rate" => patch with { RateHz = values.Bounded(value, key, values.QuantityOf(value, key, "Hz", Quantity.FrequencyForm, static (k, t) => Quantity.ParseFrequencyHz(k, t))) },
                "channel" => patch with { Channel = values.ChannelOf(value) },
                "sum" => patch with { Sum = values.SumOf(value, key) },
                "voltage" => patch with { Voltage = values.VoltageOf(value, key) },
                "voltageScale" => patch with { VoltageScale = values.VoltageScaleOf(value, key) },
                _ => throw values.UnknownKey(keyNode, allowed, where),
            };
        }

        if (patch.Channel is not null && patch.Sum is not null)
        {
            throw values.Error(item.Member("sum")!, "both \"channel\" and \"sum\" given: expected one of them (or null)");
        }

        return patch;
    }
}
