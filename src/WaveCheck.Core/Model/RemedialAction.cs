namespace WaveCheck.Core.Model;

/// <summary>Why a circuit or upstream device is on the remedial schedule, most urgent first.</summary>
/// <remarks>Safety first: a device too weak for the residual current it must detect (or blinded by smooth DC); then
/// a device whose adequacy the survey could not show, which may be too weak (engineering choice: an unknown is
/// treated as the safety question it may hide); then nuisance tripping; then the leakage budget.</remarks>
public enum ActionPriority
{
    /// <summary>The installed device is not adequate, or smooth DC blinds it: it may not trip on a real fault.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("device-too-weak")]
    DeviceTooWeak = 1,

    /// <summary>An event in a capture reached a current and duration at which a compliant device of the installed
    /// rating must trip (the trip replay's alert): if it did not, the device itself is suspect.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("test-device")]
    TestDevice = 2,

    /// <summary>Adequacy could not be shown (no installed device stated, a capture failed, or a class left open).</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("not-shown")]
    NotShown = 3,

    /// <summary>Standing residual current at or above the non-operating limit (0.5 IΔn): trips without a fault likely.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("nuisance-tripping")]
    NuisanceTripping = 4,

    /// <summary>Standing residual current above the leakage budget (0.3 IΔn) but below the non-operating limit.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("leakage-budget")]
    LeakageBudget = 5,
}

/// <summary>One row of the remedial schedule: a circuit (or an upstream device) that needs action, with its most
/// urgent reason first and every other one after it.</summary>
/// <param name="Rank">Place in the schedule, from 1.</param>
/// <param name="Priority">The most urgent reason's class.</param>
/// <param name="Circuit">The circuit's name, or the upstream device's.</param>
/// <param name="Upstream">True for an upstream device shared by several circuits.</param>
/// <param name="InstalledType">Installed protection; null when not stated.</param>
/// <param name="RatedResidualCurrentA">IΔn, amperes.</param>
/// <param name="Required">What is required, in words (<c>type B, or type A with a 6 mA DC detection device</c>,
/// <c>at least type A</c>, <c>no change of type</c>).</param>
/// <param name="Reason">Every reason, most urgent first, with its figures.</param>
public sealed record RemedialAction(int Rank, ActionPriority Priority, string Circuit, bool Upstream, InstalledProtection? InstalledType,
    double RatedResidualCurrentA, string Required, string Reason);
