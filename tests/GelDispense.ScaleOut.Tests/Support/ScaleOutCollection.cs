namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>
/// The scale-out tests share one PostgreSQL cluster and run one after another: each starts two service processes,
/// and two pairs at once on a two-core machine would measure the machine rather than the service.
/// </summary>
[CollectionDefinition(Name)]
public sealed class ScaleOutCollection : ICollectionFixture<PostgresCluster>
{
    public const string Name = "scale-out";
}
