namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>The API test classes share one <see cref="ApiHosts"/>.</summary>
[CollectionDefinition(Name)]
public sealed class ApiCollection : ICollectionFixture<ApiHosts>
{
    public const string Name = "api";
}
