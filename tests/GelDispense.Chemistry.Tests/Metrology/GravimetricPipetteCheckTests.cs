using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class GravimetricPipetteCheckTests
{
    // ISO 8655-6 Z at 20 °C, 101.3 kPa: 1.0029 µL/mg (V2), good to ±0.0001.
    private const double Z20 = 1.0029;

    private static readonly PipetteProfile P1000 = new("P1000-west", 1000, 100);

    [Fact]
    public void A_good_pipette_passes_both_limits()
    {
        double[] massesMg = [997.0, 997.5, 996.8, 997.3, 997.2, 996.9, 997.4, 997.1, 997.0, 997.3];

        var result = GravimetricPipetteCheck.Evaluate(P1000, 1000, massesMg, 20, 1013);

        // mean mass 997.15 mg, sample s 0.2273 mg (arithmetic of the data above).
        Assert.Equal(10, result.Count);
        Assert.Equal(997.15 * Z20, result.MeanVolumeUl, 0.1);
        Assert.Equal(result.MeanVolumeUl - 1000, result.SystematicErrorUl, 1e-9);
        Assert.Equal(result.SystematicErrorUl / 10, result.SystematicErrorPct, 1e-9);
        Assert.Equal(0.22730 * Z20, result.RandomErrorUl, 0.0001);
        Assert.Equal(100 * result.RandomErrorUl / result.MeanVolumeUl, result.RandomErrorCvPct, 1e-9);
        // ISO 8655-2 1000 µL row (V): ±8 µL and 3 µL.
        Assert.Equal((8.0, 3.0), (result.SystematicMpeUl, result.RandomMpeUl));
        Assert.True(result.SystematicPass);
        Assert.True(result.RandomPass);
        Assert.True(result.Passed);
    }

    [Fact]
    public void A_pipette_delivering_12_uL_short_fails_the_systematic_limit()
    {
        double[] massesMg = [985.1, 985.4, 984.9, 985.3, 985.0, 985.2, 985.5, 984.8, 985.1, 985.2];

        var result = GravimetricPipetteCheck.Evaluate(P1000, 1000, massesMg, 20, 1013);

        Assert.Equal((985.15 * Z20) - 1000, result.SystematicErrorUl, 0.1); // about −12 µL, beyond ±8 µL
        Assert.False(result.SystematicPass);
        Assert.True(result.RandomPass);
        Assert.False(result.Passed);
    }

    [Fact]
    public void A_scattering_pipette_fails_the_random_limit()
    {
        double[] massesMg = [990, 1004, 992, 1003, 995, 1001, 989, 1005, 997, 999];

        var result = GravimetricPipetteCheck.Evaluate(P1000, 1000, massesMg, 20, 1013);

        Assert.Equal(5.8547 * Z20, result.RandomErrorUl, 0.001); // sample s of the masses 5.8547 mg, beyond 3 µL
        Assert.True(result.SystematicPass);
        Assert.False(result.RandomPass);
        Assert.False(result.Passed);
    }

    [Property]
    public Property Identical_weighings_have_no_random_error_and_mean_m_times_Z() =>
        Prop.ForAll(
            MetrologyGen.ArbBetween(100, 1000),
            MetrologyGen.ArbBetween(15, 30),
            (massMg, temperatureC) =>
            {
                var result = GravimetricPipetteCheck.Evaluate(P1000, 500, [massMg, massMg, massMg], temperatureC, 1013);
                return result.RandomErrorUl < 1e-9
                    && Math.Abs(result.MeanVolumeUl - (massMg * ZFactor.MicrolitresPerMilligram(temperatureC, 1013))) < 1e-9;
            });

    [Fact]
    public void One_weighing_is_not_enough()
    {
        var error = Assert.Throws<InvalidInputException>(() => GravimetricPipetteCheck.Evaluate(P1000, 1000, [997.0], 20, 1013));
        Assert.Equal("massesMg", Assert.Single(error.Errors).Field);
    }

    [Fact]
    public void Every_bad_input_is_named()
    {
        var error = Assert.Throws<InvalidInputException>(
            () => GravimetricPipetteCheck.Evaluate(P1000, 1500, [997.0, 996.0, -1.0, double.NaN], 45, 1013, 120));

        Assert.Equal(
            ["selectedVolumeUl", "massesMg[2]", "massesMg[3]", "temperatureC", "relativeHumidityPct"],
            error.Errors.Select(e => e.Field));
        Assert.Equal("-1", error.Errors[1].Value);
    }

    [Fact]
    public void An_invalid_pipette_is_reported_with_its_fields()
    {
        var error = Assert.Throws<InvalidInputException>(
            () => GravimetricPipetteCheck.Evaluate(P1000 with { MinVolumeUl = 0 }, 1000, [997.0, 997.1], 20, 1013));
        Assert.Equal("pipette.minVolumeUl", Assert.Single(error.Errors).Field);
    }
}
