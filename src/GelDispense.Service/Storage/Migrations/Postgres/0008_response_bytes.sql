-- An addition's stored answer as bytes. It is deflated protobuf; held as base64 text it was a third larger, and for
-- an answer of about 1.6 KB that third carried the row past PostgreSQL's 2 KB TOAST threshold, so every addition also
-- wrote a TOAST row and its index entry (about 5 % of the database's CPU under ingest load). EXTERNAL: the bytes are
-- compressed already, so a larger answer may go out of line but is never put through pglz again.
-- New rows leave response empty; rows written before keep their text there and response_bytes NULL.
ALTER TABLE additions ADD COLUMN response_bytes BYTEA;
ALTER TABLE additions ALTER COLUMN response_bytes SET STORAGE EXTERNAL;
