using System.Reflection;
using BenchmarkDotNet.Running;

// Every benchmark class in this assembly; pick with --filter, e.g. --filter '*Chemistry*' --job short.
// By assembly rather than typeof(Program): the service, referenced through the agent, has a public Program too.
BenchmarkSwitcher.FromAssembly(Assembly.GetExecutingAssembly()).Run(args);
