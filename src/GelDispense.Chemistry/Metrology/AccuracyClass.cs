namespace GelDispense.Chemistry.Metrology;

/// <summary>OIML R 76-1 accuracy classes of non-automatic weighing instruments.</summary>
public enum AccuracyClass
{
    /// <summary>Special accuracy (analytical and micro balances).</summary>
    I,

    /// <summary>High accuracy (precision balances).</summary>
    II,

    /// <summary>Medium accuracy.</summary>
    III,

    /// <summary>Ordinary accuracy.</summary>
    IIII,
}
