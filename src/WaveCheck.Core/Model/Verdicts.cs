using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace WaveCheck.Core.Model;

/// <summary>A risk found by a margin check (nuisance tripping, an upstream device's leakage budget).</summary>
public enum RiskLevel
{
    /// <summary>Below the "possible" boundary.</summary>
    Low,

    /// <summary>At or above the "possible" boundary (0.3 IΔn by default).</summary>
    Possible,

    /// <summary>At or above the "likely" boundary (0.5 IΔn by default).</summary>
    Likely,

    /// <summary>Not every circuit behind an upstream device could be counted.</summary>
    Incomplete,
}

/// <summary>A survey row's verdict on the installed device.</summary>
public enum SurveyVerdict
{
    /// <summary>The installed device is adequate.</summary>
    Ok,

    /// <summary>The installed device is not adequate.</summary>
    Upgrade,

    /// <summary>Adequacy cannot be decided (no installed type given, or the capture cannot show enough).</summary>
    [JsonStringEnumMemberName("cannot-tell")]
    CannotTell,

    /// <summary>The capture could not be analysed.</summary>
    Error,
}

/// <summary>An upstream device's DC check over its circuits.</summary>
public enum DcCheck
{
    /// <summary>The summed smooth DC is within the device's tolerance.</summary>
    None,

    /// <summary>The summed smooth DC exceeds the device's tolerance.</summary>
    Blinded,

    /// <summary>A circuit's DC could not be determined, or a circuit failed.</summary>
    [JsonStringEnumMemberName("cannot-tell")]
    CannotTell,
}

/// <summary>An upstream device's type check over its circuits.</summary>
public enum TypeCheck
{
    /// <summary>Every circuit's required type is covered by the upstream device.</summary>
    Ok,

    /// <summary>A circuit requires a more capable type than the upstream device.</summary>
    Mismatch,

    /// <summary>A circuit's required type is undetermined, or a circuit failed.</summary>
    [JsonStringEnumMemberName("cannot-tell")]
    CannotTell,
}

/// <summary>The text of a verdict enum, as in the JSON, CSV and Parquet forms (<c>possible</c>, <c>cannot-tell</c>).</summary>
public static class VerdictText
{
    /// <summary>The enum value's text: its <see cref="JsonStringEnumMemberNameAttribute"/> name, else its camelCase name.</summary>
    public static string Of<T>(T value)
        where T : struct, Enum
    {
        var name = value.ToString();
        var member = typeof(T).GetField(name, BindingFlags.Public | BindingFlags.Static);
        return member?.GetCustomAttribute<JsonStringEnumMemberNameAttribute>()?.Name ?? JsonNamingPolicy.CamelCase.ConvertName(name);
    }
}
