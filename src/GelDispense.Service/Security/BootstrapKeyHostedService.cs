namespace GelDispense.Service.Security;

/// <summary>
/// On the first start on an empty database, issues an admin key and writes it to the bootstrap file, readable and
/// writable by the owner only. The log names the file, never the key. Later starts find keys and do nothing.
/// </summary>
public sealed class BootstrapKeyHostedService(
    ApiKeyIssuer issuer, IConfiguration configuration, IHostEnvironment environment, ILogger<BootstrapKeyHostedService> logger) : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        var issued = await issuer.IssueBootstrapAsync(cancellationToken);
        if (issued is not { } first)
        {
            return;
        }

        var path = AuthSettings.From(configuration).BootstrapKeyPath(configuration, environment.ContentRootPath);
        await WriteOwnerOnlyAsync(path, first.Key + "\n", cancellationToken);
        logger.LogWarning(
            "Empty key store: issued admin key {KeyId} and wrote it to {BootstrapKeyFile} (owner-only). Move it somewhere safe and delete the file.",
            first.Row.Id, path);
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    /// <summary>Creates the file with mode 0600 from the start, so it is never readable by others even for a moment.</summary>
    public static async Task WriteOwnerOnlyAsync(string path, string text, CancellationToken cancellationToken)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        var options = new FileStreamOptions { Mode = FileMode.Create, Access = FileAccess.Write, Share = FileShare.None };
        if (!OperatingSystem.IsWindows())
        {
            options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
        }

        await using (var stream = new FileStream(path, options))
        await using (var writer = new StreamWriter(stream))
        {
            await writer.WriteAsync(text.AsMemory(), cancellationToken);
        }

        if (!OperatingSystem.IsWindows())
        {
            // UnixCreateMode does not apply to a file that existed before; an old file may have had wider rights.
            File.SetUnixFileMode(path, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        }
    }
}
