using GelDispense.Service.Extensions;

WebApplication.CreateBuilder(args).BuildGelDispense().Run();
