namespace GelDispense.Chemistry.Metrology;

/// <summary>Which formula turns temperature, pressure and humidity into an air density.</summary>
public enum AirDensityModel
{
    /// <summary>OIML R 111-1:2004 Annex E, eq. E.3-1: a one-line approximation, about 2×10⁻⁴ relative.</summary>
    OimlR111Approximation,

    /// <summary>The full CIPM-2007 equation (Picard et al., Metrologia 45 (2008) 149).</summary>
    Cipm2007,
}
