namespace GelDispense.Agent.Links;

/// <summary>A device path that may be a balance's serial port, with what a symlink points at.</summary>
public sealed record SerialPortCandidate(string Path, string Kind, string? Target);
