using GelDispense.Service.Extensions;

var builder = WebApplication.CreateBuilder(args);
builder.AddGelDispenseLogging();
builder.AddGelDispenseEndpoints();
builder.Services.AddGelDispenseServices(builder.Configuration);

var app = builder.Build();
app.UseGelDispensePipeline();
app.MapGelDispenseEndpoints();
app.Run();
