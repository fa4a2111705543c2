-- API keys. Only the SHA-256 hash of a key is kept; the prefix (the first characters of the key) finds the row
-- without scanning every hash. Keys are never deleted: revoking stamps revoked_at, so the actor ids that batch
-- events record always resolve to a key.
CREATE TABLE api_keys (
    id           TEXT PRIMARY KEY,
    prefix       TEXT NOT NULL UNIQUE,
    key_hash     TEXT NOT NULL,
    role         TEXT NOT NULL,
    station_id   TEXT NOT NULL,
    label        TEXT NOT NULL,
    created_at   TEXT NOT NULL,
    expires_at   TEXT NULL,
    revoked_at   TEXT NULL
);
