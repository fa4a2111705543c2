using GelDispense.Agent.Commands;

return await AgentCommandLine.Build().Parse(args).InvokeAsync();
