namespace GelDispense.Agent.Journal;

/// <summary>
/// The journal file's tables. <c>additions.seq</c> is the confirmation order; <c>addition_id</c> is unique, so the
/// same addition can never be journaled twice. <c>batches</c> keeps the last copy of each batch the service sent,
/// so a restarted agent can carry on with a batch while the service is still away.
/// </summary>
internal static class JournalSchema
{
    public const int Version = 1;

    public const string Create = """
        CREATE TABLE IF NOT EXISTS additions (
            seq          INTEGER PRIMARY KEY AUTOINCREMENT,
            addition_id  TEXT    NOT NULL UNIQUE,
            batch_id     TEXT    NOT NULL,
            step_index   INTEGER NOT NULL,
            reading_g    REAL    NOT NULL,
            source       TEXT    NOT NULL,
            lot_id       TEXT    NOT NULL,
            confirmed_at TEXT    NOT NULL,
            state        TEXT    NOT NULL,
            settled_at   TEXT,
            detail       TEXT    NOT NULL DEFAULT ''
        );
        CREATE INDEX IF NOT EXISTS additions_pending ON additions (state, seq);
        CREATE INDEX IF NOT EXISTS additions_batch ON additions (batch_id, seq);
        CREATE TABLE IF NOT EXISTS batches (
            batch_id   TEXT PRIMARY KEY,
            batch_json TEXT NOT NULL,
            saved_at   TEXT NOT NULL
        );
        """;

    public const string Columns = "seq, addition_id, batch_id, step_index, reading_g, source, lot_id, confirmed_at, state, settled_at, detail";
}
