using Serilog;
using Serilog.Formatting.Compact;

namespace GelDispense.Service.Extensions;

/// <summary>Serilog on the console: readable text while developing, one JSON object per event in production.</summary>
public static class LoggingExtensions
{
    private const string TextTemplate =
        "[{Timestamp:HH:mm:ss} {Level:u3}] {Message:lj} {Properties:j}{NewLine}{Exception}";

    public static WebApplicationBuilder AddGelDispenseLogging(this WebApplicationBuilder builder)
    {
        var production = builder.Environment.IsProduction();
        builder.Services.AddSerilog((services, logger) =>
        {
            logger.ReadFrom.Configuration(builder.Configuration)
                .ReadFrom.Services(services)
                .Enrich.FromLogContext();
            if (production)
            {
                logger.WriteTo.Console(new RenderedCompactJsonFormatter());
            }
            else
            {
                logger.WriteTo.Console(outputTemplate: TextTemplate, formatProvider: System.Globalization.CultureInfo.InvariantCulture);
            }
        },
        // Each host logs through its own logger, never the static Log.Logger: otherwise a second host in the same
        // process (the agent's demo, parallel tests) would take over the first one's log lines.
        preserveStaticLogger: true);
        return builder;
    }

    /// <summary>
    /// One log line per request. The gRPC handlers add BatchId and StationId to the diagnostic context
    /// (<see cref="Api.RequestLog"/>), so REST and gRPC calls about one batch can be followed together.
    /// </summary>
    public static IApplicationBuilder UseGelDispenseRequestLogging(this IApplicationBuilder app) =>
        app.UseSerilogRequestLogging(options =>
        {
            // This host's logger: the middleware would otherwise write to the static Log.Logger, which it never sets.
            options.Logger = app.ApplicationServices.GetRequiredService<Serilog.ILogger>();
            options.MessageTemplate = "{Protocol} {RequestMethod} {RequestPath} -> {StatusCode} in {Elapsed:0.0} ms";
            options.EnrichDiagnosticContext = (diagnostics, http) =>
                diagnostics.Set("Protocol", Errors.RestProblemMiddleware.IsGrpc(http.Request) ? "gRPC" : "REST");
        });
}
