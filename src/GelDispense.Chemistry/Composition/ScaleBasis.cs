namespace GelDispense.Chemistry.Composition;

/// <summary>What fixes the batch size.</summary>
public enum ScaleBasis
{
    GelVolumeMl,
    PrecursorMol,
    OxideMassG,
}
