namespace GelDispense.Chemistry.Planning;

/// <summary>How an addition is made: weighed on the balance, or delivered by volume and checked by the balance.</summary>
public enum DispensingMethod
{
    Balance,
    Pipette,
}
