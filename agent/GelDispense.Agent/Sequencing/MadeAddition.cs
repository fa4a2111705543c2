namespace GelDispense.Agent.Sequencing;

/// <summary>
/// An addition as the station knows it: the net reading confirmed, its true (buoyancy-corrected) mass, whether it
/// fell in its window, and whether the service has acknowledged it or it is still only in the journal.
/// </summary>
public sealed record MadeAddition(string AdditionId, int StepIndex, double ReadingG, double TrueMassG, bool WithinWindow, bool Acknowledged);
