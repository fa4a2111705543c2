namespace GelDispense.Service.Extensions;

/// <summary>The whole host in one call, so Program.cs and an in-process host (the load harness) build the same service.</summary>
public static class GelDispenseApp
{
    public static WebApplication BuildGelDispense(this WebApplicationBuilder builder)
    {
        builder.AddGelDispenseLogging();
        builder.AddGelDispenseEndpoints();
        builder.Services.AddGelDispenseServices(builder.Configuration);

        var app = builder.Build();
        app.UseGelDispensePipeline();
        app.MapGelDispenseEndpoints();
        return app;
    }
}
