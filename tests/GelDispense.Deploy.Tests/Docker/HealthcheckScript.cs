using System.Diagnostics;

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>Runs deploy/docker/healthcheck.sh with bash, as the image's HEALTHCHECK does, and returns its exit code.</summary>
internal static class HealthcheckScript
{
    public const string RelativePath = "deploy/docker/healthcheck.sh";
    public const string HealthPath = "/healthz";

    public static async Task<int> RunAsync(string restUrl)
    {
        var start = new ProcessStartInfo("bash", [RepoPaths.Of(RelativePath)])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        start.Environment["Kestrel__Endpoints__Rest__Url"] = restUrl;
        using var process = Process.Start(start) ?? throw new InvalidOperationException("bash did not start");
        // A guard against a hung script, not a timing check: the script itself gives up after 5 s.
        using var guard = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await process.WaitForExitAsync(guard.Token);
        return process.ExitCode;
    }
}
