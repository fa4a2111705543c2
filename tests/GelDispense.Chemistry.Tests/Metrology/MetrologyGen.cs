using FsCheck;
using FsCheck.Fluent;

namespace GelDispense.Chemistry.Tests.Metrology;

/// <summary>Generators of physical quantities in realistic ranges for the property tests.</summary>
internal static class MetrologyGen
{
    private const int Steps = 1_000_000;

    public static Gen<double> Between(double min, double max) =>
        Gen.Choose(0, Steps).Select(i => min + ((max - min) * i / Steps));

    public static Arbitrary<double> ArbBetween(double min, double max) => Between(min, max).ToArbitrary();
}
