using GelDispense.Chemistry.Formulas;

namespace GelDispense.Chemistry.Tests.Formulas;

public class AtomicWeightsTests
{
    [Theory]
    [InlineData("H", 1.008)]    // CIAAW 2021 conventional value, interval [1.00784, 1.00811] (published-values §8, V)
    [InlineData("C", 12.011)]   // CIAAW conventional value (§8 V)
    [InlineData("N", 14.007)]   // CIAAW conventional value (§8 V)
    [InlineData("O", 15.999)]   // CIAAW conventional value (§8 V)
    [InlineData("F", 18.998)]   // CIAAW 18.998403162(5), abridged (§8 V)
    [InlineData("Al", 26.982)]  // CIAAW 26.9815384(3), abridged (§8 V)
    [InlineData("Si", 28.085)]  // CIAAW conventional value (§8 V)
    [InlineData("Cl", 35.45)]   // CIAAW conventional value (§8 V)
    [InlineData("Ti", 47.867)]  // CIAAW 47.867(1) (§8 V)
    [InlineData("Zr", 91.222)]  // CIAAW 2024 revision, 91.224 → 91.222(3) (§8 V, C&EN report)
    public void Standard_atomic_weights_are_the_CIAAW_conventional_values(string symbol, double expected)
    {
        Assert.True(AtomicWeights.TryGet(symbol, out var weight));
        Assert.Equal(expected, weight, 1e-9);
    }

    [Theory]
    [InlineData("CO")]  // carbon monoxide is two symbols, not one
    [InlineData("si")]  // symbols are case-sensitive
    [InlineData("Xx")]
    [InlineData("")]
    public void Strings_that_are_not_element_symbols_are_not_found(string text)
    {
        Assert.False(AtomicWeights.TryGet(text, out _));
    }
}
