-- The audit trail: who wrote each event (key id, or the token subject), at which station, the addition it records,
-- and a per-batch hash chain (hash = SHA-256 of the previous event's hash and this event's canonical content).
-- occurred_at already holds the UTC time from the service clock. Events written before this migration have no hash
-- and verify as broken, which is the truth: nothing vouches for them.
ALTER TABLE batch_events ADD COLUMN actor_key_id TEXT NOT NULL DEFAULT '';
ALTER TABLE batch_events ADD COLUMN station_id TEXT NOT NULL DEFAULT '';
ALTER TABLE batch_events ADD COLUMN addition_id TEXT NOT NULL DEFAULT '';
ALTER TABLE batch_events ADD COLUMN prev_hash TEXT NOT NULL DEFAULT '';
ALTER TABLE batch_events ADD COLUMN hash TEXT NOT NULL DEFAULT '';
