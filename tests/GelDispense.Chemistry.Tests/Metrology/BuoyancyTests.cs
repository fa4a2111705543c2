using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class BuoyancyTests
{
    [Theory]
    [InlineData(0.9982, 1.001053)] // water; m = W(1 − ρa/8000)/(1 − ρa/ρs), NIST SOP 2 / EURAMET cg-18 form, calculated (C)
    [InlineData(0.7893, 1.001372)] // ethanol (C)
    [InlineData(0.933, 1.001138)]  // TEOS (C)
    [InlineData(1.184, 1.000864)]  // 37 % HCl (C)
    public void Correction_factor_at_1_2_kg_per_m3_matches_calculated_values(double densityGPerMl, double expected)
    {
        Assert.Equal(expected, Buoyancy.CorrectionFactor(densityGPerMl, 1.2), 0.000001);
    }

    [Fact]
    public void A_sample_as_dense_as_the_reference_weights_needs_no_correction()
    {
        // By construction of the formula: ρs = ρref = 8000 kg/m³ gives m = W.
        Assert.Equal(1.0, Buoyancy.CorrectionFactor(8.0, 1.2), 1e-15);
    }

    [Fact]
    public void In_vacuum_the_reading_is_the_true_mass()
    {
        Assert.Equal(25.0, Buoyancy.TrueMassFromReadingG(25.0, 0.7893, 0), 1e-12);
    }

    [Fact]
    public void Ten_grams_of_water_read_about_10_5_mg_light()
    {
        // Factor 1.001053 for water at ρa = 1.2 kg/m³ (C).
        Assert.Equal(10.01053, Buoyancy.TrueMassFromReadingG(10, 0.9982, 1.2), 0.00001);
        Assert.Equal(10 / 1.001053, Buoyancy.ReadingFromTrueMassG(10, 0.9982, 1.2), 0.00001);
    }

    [Property]
    public Property Reading_to_true_mass_and_back_returns_the_reading() =>
        Prop.ForAll(
            MetrologyGen.ArbBetween(-500, 500),
            MetrologyGen.ArbBetween(0.5, 22),
            MetrologyGen.ArbBetween(0, 1.3),
            (readingG, rhoS, rhoA) =>
            {
                var back = Buoyancy.ReadingFromTrueMassG(Buoyancy.TrueMassFromReadingG(readingG, rhoS, rhoA), rhoS, rhoA);
                return Math.Abs(back - readingG) <= 1e-12 * Math.Max(1, Math.Abs(readingG));
            });

    [Property]
    public Property Samples_less_dense_than_steel_weigh_light_and_denser_ones_heavy() =>
        // NIST SOP 2: buoyancy pushes up on the sample more than on the 8 g/cm³ weights when ρs < 8.
        Prop.ForAll(
            MetrologyGen.ArbBetween(0.5, 22),
            MetrologyGen.ArbBetween(0.5, 1.3),
            (rhoS, rhoA) =>
            {
                var factor = Buoyancy.CorrectionFactor(rhoS, rhoA);
                return rhoS < 7.999 ? factor > 1 : rhoS > 8.001 ? factor < 1 : Math.Abs(factor - 1) < 1e-6;
            });

    [Theory]
    [InlineData(998.2, 1.2, "sampleDensityGPerMl")] // kg/m³ passed as g/mL
    [InlineData(0.001, 1.2, "sampleDensityGPerMl")] // lighter than air
    [InlineData(1.0, 1200, "airDensityKgPerM3")]    // g/m³ passed as kg/m³
    [InlineData(1.0, -0.1, "airDensityKgPerM3")]
    public void Impossible_densities_throw_naming_the_parameter(double sampleGPerMl, double airKgPerM3, string parameter)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Buoyancy.CorrectionFactor(sampleGPerMl, airKgPerM3));
        Assert.Equal(parameter, error.ParamName);
    }

    [Fact]
    public void A_non_finite_reading_throws_naming_the_reading()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Buoyancy.TrueMassFromReadingG(double.PositiveInfinity, 1, 1.2));
        Assert.Equal("readingG", error.ParamName);
    }
}
