using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class ConventionalMassTests
{
    [Theory]
    [InlineData(100, 0.9982)]
    [InlineData(100, 0.7893)]
    [InlineData(2.5, 2.2)]
    [InlineData(1000, 19.3)]
    public void From_true_mass_follows_OIML_D_28(double trueMassG, double densityGPerMl)
    {
        // OIML D 28:2004 (V): m_c = m·(1 − 1.2/ρ)/(1 − 1.2/8000), ρ in kg/m³.
        var rhoKgPerM3 = densityGPerMl * 1000;
        var expected = trueMassG * (1 - (1.2 / rhoKgPerM3)) / (1 - (1.2 / 8000));
        Assert.Equal(expected, ConventionalMass.FromTrueMassG(trueMassG, densityGPerMl), 1e-12);
    }

    [Fact]
    public void A_body_of_8000_kg_per_m3_has_conventional_mass_equal_to_true_mass()
    {
        // OIML D 28: the reference density is 8000 kg/m³.
        Assert.Equal(500.0, ConventionalMass.FromTrueMassG(500, 8.0), 1e-12);
    }

    [Fact]
    public void One_hundred_grams_of_water_has_a_conventional_mass_about_105_mg_lower()
    {
        // Buoyancy factor for water 1.001053 at 1.2 kg/m³ (C): 100 g / 1.001053 = 99.8948 g.
        Assert.Equal(99.8948, ConventionalMass.FromTrueMassG(100, 0.9982), 0.0001);
    }

    [Fact]
    public void To_true_mass_inverts_from_true_mass()
    {
        var conventionalG = ConventionalMass.FromTrueMassG(42.0, 0.933);
        Assert.Equal(42.0, ConventionalMass.ToTrueMassG(conventionalG, 0.933), 1e-12);
    }
}
