using System.Globalization;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>From a stored value to the SI value delivered: unit prefix and the primary/secondary ratio.</summary>
internal readonly record struct ComtradeChannelConversion(double Scale, double Offset, ChannelQuantity Quantity,
    double UnitFactor, double RatioFactor, string Side, string? Note)
{
    public static ComtradeChannelConversion For(ComtradeAnalogChannel ch, bool wantPrimary)
    {
        var (quantity, unitFactor) = ch.Unit.Trim() switch
        {
            "A" or "a" => (ChannelQuantity.Current, 1.0),
            "kA" or "KA" => (ChannelQuantity.Current, 1e3),
            "mA" => (ChannelQuantity.Current, 1e-3),
            "uA" or "µA" or "μA" => (ChannelQuantity.Current, 1e-6),
            "V" or "v" => (ChannelQuantity.Voltage, 1.0),
            "kV" or "KV" => (ChannelQuantity.Voltage, 1e3),
            "mV" => (ChannelQuantity.Voltage, 1e-3),
            _ => (ChannelQuantity.Unscaled, 1.0),
        };

        // 1999 clause 6.4.3 / 2013 clause 7.4.3: a·x+b gives the side named by PS; primary/secondary is the
        // transformer ratio. Converting P→S divides by primary/secondary, S→P multiplies.
        var wanted = wantPrimary ? 'P' : 'S';
        var ratio = 1.0;
        string? note = null;
        var side = ch.PrimaryOrSecondary is { } ps ? (ps == 'P' ? "primary" : "secondary") : "as recorded";
        if (ch.PrimaryOrSecondary is null)
        {
            note = wantPrimary ? "the cfg (1991) does not say whether values are primary or secondary; they are delivered as recorded" : null;
        }
        else if (ch.PrimaryOrSecondary != wanted)
        {
            if (ch.Primary > 0 && ch.Secondary > 0)
            {
                ratio = wantPrimary ? ch.Primary / ch.Secondary : ch.Secondary / ch.Primary;
                side = wantPrimary ? "secondary → primary" : "primary → secondary";
            }
            else
            {
                note = $"the cfg gives no usable transformer ratio (primary {ch.Primary.ToString(CultureInfo.InvariantCulture)}, secondary {ch.Secondary.ToString(CultureInfo.InvariantCulture)}); values stay {side}";
            }
        }

        var factor = unitFactor * ratio;
        return new ComtradeChannelConversion(ch.A * factor, ch.B * factor, quantity, unitFactor, ratio, side, note);
    }

    public ChannelInfo Info(int index, ComtradeAnalogChannel ch)
    {
        var fullScale = Math.Max(Math.Abs((ch.Min * Scale) + Offset), Math.Abs((ch.Max * Scale) + Offset));
        return new ChannelInfo(index, ch.Id, ch.Unit, Quantity, Scale, fullScale > 0 ? fullScale : null);
    }

    public string Describe(ComtradeAnalogChannel ch) =>
        $"a={ch.A.ToString(CultureInfo.InvariantCulture)}, b={ch.B.ToString(CultureInfo.InvariantCulture)} {ch.Unit}, {Side}"
        + (RatioFactor != 1.0 ? $" × {RatioFactor.ToString("G6", CultureInfo.InvariantCulture)}" : string.Empty);
}
