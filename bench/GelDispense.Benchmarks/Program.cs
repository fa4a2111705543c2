using BenchmarkDotNet.Running;

// Every benchmark class in this assembly; pick with --filter, e.g. --filter '*Chemistry*' --job short.
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
