using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// Facts about each class of residual current: the least type that detects it, whether a 6 mA DC detection device
/// covers it, and its name in words (what the tables and the JSON show: pinned word for word). Types from REFERENCE.md
/// "Device types" (IEC 60364-5-53:2015 §531.3.3, IEC 61008-1, IEC 62423, std; B+ DIN VDE 0664-400, designation std);
/// DC detection from REFERENCE.md "EV charging point" (IEC 60364-7-722 with IEC 62955, std).
/// </summary>
public class ResidualCurrentClassesTests
{
    [Theory]
    // AC: sinusoidal AC (IEC 61008-1, std).
    [InlineData(ResidualCurrentClass.MainsAc, DeviceType.AC, false, "sinusoidal AC at mains frequency")]
    // A: as AC plus pulsating DC (IEC 61008-1, std).
    [InlineData(ResidualCurrentClass.PulsatingDc, DeviceType.A, false, "pulsating DC")]
    // F: as A plus composite current of a single-phase frequency converter (IEC 62423, std; test current 10 Hz + 50 Hz + 1 kHz).
    [InlineData(ResidualCurrentClass.Composite, DeviceType.F, false, "composite current (motor frequency, 1 kHz)")]
    // B: sinusoidal AC up to 1 kHz (IEC 62423, std).
    [InlineData(ResidualCurrentClass.NonMainsAc, DeviceType.B, false, "AC at other frequencies up to 1 kHz")]
    // B: smooth DC and rectified current from two or more phases (IEC 62423, std); an RDC-DD beside type A covers it.
    [InlineData(ResidualCurrentClass.SmoothDc, DeviceType.B, true, "smooth DC or multi-phase rectified current")]
    // B+: tripping defined up to 20 kHz (DIN VDE 0664-400, designation std).
    [InlineData(ResidualCurrentClass.HighFrequency, DeviceType.BPlus, false, "content 1-20 kHz")]
    // Charging point: type B, or type A with an RDC-DD (IEC 60364-7-722, std).
    [InlineData(ResidualCurrentClass.ChargingPointDcFault, DeviceType.B, true, "charging point DC fault current")]
    // Clipped samples hide content of any kind: only the strongest type is safe (engineering choice, ClassDetector).
    [InlineData(ResidualCurrentClass.Clipping, DeviceType.BPlus, false, "clipped samples")]
    public void Each_class_its_least_type_dc_detection_and_name(ResidualCurrentClass c, DeviceType least, bool dcDetection, string words)
    {
        Assert.Equal(least, c.LeastType());
        Assert.Equal(dcDetection, c.CoveredByDcDetection());
        Assert.Equal(words, c.Describe());
    }

    [Fact]
    public void Every_class_has_a_distinct_name()
    {
        var names = Enum.GetValues<ResidualCurrentClass>().Select(c => c.Describe()).ToList();
        Assert.Equal(names.Count, names.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void A_value_outside_the_enumeration_is_refused_with_its_reason()
    {
        // A programming error, not input (common practice, no source): the message says what is wrong.
        var unknown = (ResidualCurrentClass)99;
        var least = Assert.Throws<ArgumentOutOfRangeException>(() => unknown.LeastType());
        var words = Assert.Throws<ArgumentOutOfRangeException>(() => unknown.Describe());
        foreach (var e in new[] { least, words })
        {
            Assert.Equal("c", e.ParamName);
            Assert.Equal(unknown, e.ActualValue);
            Assert.StartsWith("unknown class", e.Message, StringComparison.Ordinal);
        }

        Assert.False(unknown.CoveredByDcDetection());
    }
}
