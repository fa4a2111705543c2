-- Times are UTC text in one fixed-width ISO 8601 form, so text order is time order on both engines.
CREATE TABLE reagents (
    id          TEXT PRIMARY KEY,
    body        TEXT NOT NULL,
    created_at  TEXT NOT NULL
);

CREATE TABLE reagent_lots (
    reagent_id  TEXT NOT NULL,
    lot_id      TEXT NOT NULL,
    expires_on  TEXT NOT NULL,
    body        TEXT NOT NULL,
    created_at  TEXT NOT NULL,
    PRIMARY KEY (reagent_id, lot_id)
);

-- A recipe revision never changes once written; a changed recipe under the same name is a new revision.
CREATE TABLE recipe_revisions (
    id            BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    name          TEXT NOT NULL,
    revision      INTEGER NOT NULL,
    content_hash  TEXT NOT NULL,
    body          TEXT NOT NULL,
    created_at    TEXT NOT NULL,
    UNIQUE (name, revision)
);

CREATE TABLE batches (
    id                  TEXT PRIMARY KEY,
    station_id          TEXT NOT NULL,
    status              TEXT NOT NULL,
    recipe_revision_id  BIGINT NOT NULL REFERENCES recipe_revisions (id),
    setup               TEXT NOT NULL,
    plan                TEXT NOT NULL,
    abort_reason        TEXT NOT NULL DEFAULT '',
    created_at          TEXT NOT NULL,
    updated_at          TEXT NOT NULL,
    version             BIGINT NOT NULL,
    last_event_seq      BIGINT NOT NULL
);
CREATE INDEX batches_by_last_event ON batches (last_event_seq);

-- Append-only. (batch_id, ordinal) is unique, so two writers can never both append "the next" addition.
CREATE TABLE additions (
    batch_id       TEXT NOT NULL REFERENCES batches (id),
    addition_id    TEXT NOT NULL,
    ordinal        INTEGER NOT NULL,
    step_index     INTEGER NOT NULL,
    reading_g      DOUBLE PRECISION NOT NULL,
    stable         BOOLEAN NOT NULL,
    source         TEXT NOT NULL,
    lot_id         TEXT NOT NULL,
    true_mass_g    DOUBLE PRECISION NOT NULL,
    within_window  BOOLEAN NOT NULL,
    recorded_at    TEXT NOT NULL,
    content_hash   TEXT NOT NULL,
    response       TEXT NOT NULL,
    PRIMARY KEY (batch_id, addition_id),
    UNIQUE (batch_id, ordinal)
);

CREATE TABLE batch_events (
    seq          BIGINT PRIMARY KEY,
    batch_id     TEXT NOT NULL REFERENCES batches (id),
    type         TEXT NOT NULL,
    body         TEXT NOT NULL,
    occurred_at  TEXT NOT NULL
);
CREATE INDEX batch_events_by_batch ON batch_events (batch_id, seq);

-- One row; bumping it inside each writing transaction hands out sequence numbers in commit order.
CREATE TABLE event_sequence (
    id        INTEGER PRIMARY KEY CHECK (id = 1),
    last_seq  BIGINT NOT NULL
);
INSERT INTO event_sequence (id, last_seq) VALUES (1, 0);
