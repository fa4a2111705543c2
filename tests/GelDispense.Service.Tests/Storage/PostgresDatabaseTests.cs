using GelDispense.Service.Storage;
using Npgsql;

namespace GelDispense.Service.Tests.Storage;

public sealed class PostgresDatabaseTests
{
    [Fact]
    public void Pooled_connections_keep_their_session_prepare_repeated_statements_and_stay_few_unless_the_connection_string_says_otherwise()
    {
        var defaults = new NpgsqlConnectionStringBuilder(PostgresDatabase.WithPoolDefaults("Host=127.0.0.1;Username=gd;Database=gd"));
        var chosen = new NpgsqlConnectionStringBuilder(
            PostgresDatabase.WithPoolDefaults("Host=127.0.0.1;No Reset On Close=false;Max Auto Prepare=0;Maximum Pool Size=20"));

        Assert.True(defaults.NoResetOnClose);
        Assert.Equal(32, defaults.MaxAutoPrepare);
        Assert.Equal(PostgresDatabase.DefaultMaxPoolSize, defaults.MaxPoolSize);
        Assert.Equal("gd", defaults.Database);
        Assert.False(chosen.NoResetOnClose);
        Assert.Equal(0, chosen.MaxAutoPrepare);
        Assert.Equal(20, chosen.MaxPoolSize);
    }

    [Theory]
    [InlineData("MAXIMUM POOL SIZE=12")]
    [InlineData("MaxPoolSize=12")]
    [InlineData("maximum pool size=12")]
    [InlineData("NoResetOnClose=false;MaxAutoPrepare=5;Maximum Pool Size=12")]
    public void A_setting_in_any_of_its_spellings_is_kept(string settings)
    {
        var chosen = new NpgsqlConnectionStringBuilder(PostgresDatabase.WithPoolDefaults($"Host=127.0.0.1;{settings}"));

        Assert.Equal(12, chosen.MaxPoolSize);
        Assert.Equal(!settings.Contains("NoResetOnClose=false", StringComparison.Ordinal), chosen.NoResetOnClose);
        Assert.Equal(settings.Contains("MaxAutoPrepare=5", StringComparison.Ordinal) ? 5 : 32, chosen.MaxAutoPrepare);
    }
}
