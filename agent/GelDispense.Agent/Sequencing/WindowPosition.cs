namespace GelDispense.Agent.Sequencing;

/// <summary>Where a net reading lies against a step's acceptance band.</summary>
public enum WindowPosition
{
    Below,
    Inside,

    /// <summary>Past the band: an over-pour. Nothing can be taken back out, so it is recorded and the rest re-planned.</summary>
    Above,
}
