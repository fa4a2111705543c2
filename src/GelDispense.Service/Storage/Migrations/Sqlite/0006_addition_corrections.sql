-- Corrections of recorded additions. Append-only like the additions: a correction never changes the addition it
-- corrects nor an earlier correction; the latest one (by its event's sequence) gives the addition's current reading.
-- Each has exactly one ADDITION_CORRECTED event in batch_events (joined by correction_id), which chains the row
-- into the batch's audit trail; corrects_seq is the sequence of the event it supersedes.
CREATE TABLE addition_corrections (
    batch_id            TEXT NOT NULL REFERENCES batches (id),
    correction_id       TEXT NOT NULL,
    addition_id         TEXT NOT NULL,
    corrects_seq        INTEGER NOT NULL,
    previous_reading_g  REAL NOT NULL,
    reading_g           REAL NOT NULL,
    true_mass_g         REAL NOT NULL,
    within_window       INTEGER NOT NULL,
    reason              TEXT NOT NULL,
    actor_key_id        TEXT NOT NULL,
    station_id          TEXT NOT NULL,
    recorded_at         TEXT NOT NULL,
    content_hash        TEXT NOT NULL,
    response            TEXT NOT NULL,
    PRIMARY KEY (batch_id, correction_id),
    FOREIGN KEY (batch_id, addition_id) REFERENCES additions (batch_id, addition_id)
);

-- The correction an ADDITION_CORRECTED event records; empty for other events.
ALTER TABLE batch_events ADD COLUMN correction_id TEXT NOT NULL DEFAULT '';
