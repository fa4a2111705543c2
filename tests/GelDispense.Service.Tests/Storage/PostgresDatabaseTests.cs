using GelDispense.Service.Storage;
using Npgsql;

namespace GelDispense.Service.Tests.Storage;

public sealed class PostgresDatabaseTests
{
    [Fact]
    public void Pooled_connections_keep_their_session_and_prepare_repeated_statements_unless_the_connection_string_says_otherwise()
    {
        var defaults = new NpgsqlConnectionStringBuilder(PostgresDatabase.WithPoolDefaults("Host=127.0.0.1;Username=gd;Database=gd"));
        var chosen = new NpgsqlConnectionStringBuilder(PostgresDatabase.WithPoolDefaults("Host=127.0.0.1;No Reset On Close=false;Max Auto Prepare=0"));

        Assert.True(defaults.NoResetOnClose);
        Assert.Equal(32, defaults.MaxAutoPrepare);
        Assert.Equal("gd", defaults.Database);
        Assert.False(chosen.NoResetOnClose);
        Assert.Equal(0, chosen.MaxAutoPrepare);
    }
}
