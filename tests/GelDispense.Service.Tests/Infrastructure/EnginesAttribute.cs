using System.Reflection;
using Xunit.Sdk;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>Runs a theory once per storage engine: SQLite always, PostgreSQL when a server can be had (else skipped with the reason).</summary>
public sealed class SqliteEngineAttribute : DataAttribute
{
    public override IEnumerable<object[]> GetData(MethodInfo testMethod) => [["Sqlite"]];
}

/// <inheritdoc cref="SqliteEngineAttribute"/>
public sealed class PostgresEngineAttribute : DataAttribute
{
    public PostgresEngineAttribute() => Skip = PostgresServer.UnavailableReason;

    public override IEnumerable<object[]> GetData(MethodInfo testMethod) => [["Postgres"]];
}
