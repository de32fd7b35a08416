namespace WaveCheck.Core.Model;

/// <summary>Where a measured figure stands against a limit once the measurement's uncertainty is counted.</summary>
public enum LimitState
{
    /// <summary>Below the limit by more than the uncertainty.</summary>
    Below,

    /// <summary>Within the uncertainty of the limit: could be either side. Every rule resolves it to the safe side and
    /// says so.</summary>
    AtLimit,

    /// <summary>At or above the limit by more than the uncertainty.</summary>
    Above,
}
