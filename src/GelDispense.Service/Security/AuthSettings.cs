using GelDispense.Service.Extensions;
using Microsoft.Data.Sqlite;

namespace GelDispense.Service.Security;

/// <summary>The <c>Auth</c> configuration section.</summary>
public sealed class AuthSettings
{
    public const string Section = "Auth";

    /// <summary>Where the first admin key is written on an empty database; default admin.key beside the SQLite file.</summary>
    public string? BootstrapKeyFile { get; set; }

    /// <summary>Requests per second one key (or one anonymous peer) may make; 0 turns the limiter off.</summary>
    public int PermitsPerSecondPerKey { get; set; } = 200;

    /// <summary>Bursts a key may make above its steady rate.</summary>
    public int BurstPerKey { get; set; } = 400;

    /// <summary>
    /// How long a replica reuses an API key it read from the database (0 or less: read it on every call). A key revoked
    /// through another replica is still admitted here for at most this long; through this replica, never again.
    /// </summary>
    public double KeyCacheSeconds { get; set; } = 2;

    public TimeSpan KeyCachePeriod => KeyCacheSeconds > 0 && double.IsFinite(KeyCacheSeconds) ? TimeSpan.FromSeconds(Math.Min(KeyCacheSeconds, 3600)) : TimeSpan.Zero;

    /// <summary>
    /// PEM or DER file of the site CA that client certificates must chain to, for endpoints with a
    /// ClientCertificateMode; unset, Kestrel judges them against the machine trust store.
    /// </summary>
    public string? ClientCertificateCaFile { get; set; }

    /// <summary>Set <c>Auth:Jwt:Authority</c> (an OpenID Connect issuer) to accept its tokens beside API keys.</summary>
    public JwtSettings Jwt { get; set; } = new();

    public static AuthSettings From(IConfiguration configuration) =>
        configuration.GetSection(Section).Get<AuthSettings>() ?? new AuthSettings();

    /// <summary>The bootstrap file's full path: as configured, else beside the SQLite database, else in the content root.</summary>
    public string BootstrapKeyPath(IConfiguration configuration, string contentRoot)
    {
        if (!string.IsNullOrWhiteSpace(BootstrapKeyFile))
        {
            return Path.GetFullPath(BootstrapKeyFile, contentRoot);
        }

        var provider = configuration["Storage:Provider"] ?? "Sqlite";
        if (provider.Equals("Sqlite", StringComparison.OrdinalIgnoreCase))
        {
            var dataSource = new SqliteConnectionStringBuilder(
                configuration.GetConnectionString(StorageExtensions.ConnectionName) ?? StorageExtensions.DefaultSqlite).DataSource;
            // SqliteDatabase resolves a relative data source against the working directory; so does this.
            var directory = Path.GetDirectoryName(Path.GetFullPath(dataSource));
            if (!string.IsNullOrEmpty(directory))
            {
                return Path.Combine(directory, "admin.key");
            }
        }

        return Path.Combine(contentRoot, "admin.key");
    }
}
