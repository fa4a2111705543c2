namespace GelDispense.Service.Storage;

/// <summary>Who caused a batch event (API key id or token subject) and the station it happened at.</summary>
public sealed record EventAudit(string ActorKeyId, string StationId);
