-- Schema 2: device sign-ins expire (a lost phone's token stops working on its own) and remember where they were
-- last seen from. Existing sign-ins get a year from now.
ALTER TABLE devices ADD COLUMN expires_at_ms bigint;
UPDATE devices SET expires_at_ms = (extract(epoch FROM now()) * 1000)::bigint + 365::bigint * 86400000;
ALTER TABLE devices ALTER COLUMN expires_at_ms SET NOT NULL;
ALTER TABLE devices ADD COLUMN last_seen_address text;
