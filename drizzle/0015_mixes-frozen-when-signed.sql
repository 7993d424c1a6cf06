-- A mix is frozen once a signed placement uses it (SQLSTATE PW409, like drizzle/0002): the signed
-- placement's acceptance (slump and air tolerances, f'c, site water, low bleed) was judged against
-- this mix, so changing or removing it would change what the signature means. A revised design is a
-- new mix with its own code, chosen for the coming placements. Bookkeeping columns (version, change
-- number, updated time and person) alone are not a change of the design.
CREATE OR REPLACE FUNCTION placewright_refuse_signed_mix() RETURNS trigger
LANGUAGE plpgsql AS $$
DECLARE
  bookkeeping text[] := ARRAY['version', 'change_seq', 'updated_at', 'updated_by'];
  signed_id uuid;
BEGIN
  IF TG_OP = 'UPDATE' AND (to_jsonb(NEW) - bookkeeping) = (to_jsonb(OLD) - bookkeeping) THEN
    RETURN NEW;
  END IF;
  -- Lock every placement on this mix first: a sign-off in flight is waited for, then seen.
  PERFORM 1 FROM placements WHERE mix_id = OLD.id FOR SHARE;
  SELECT id INTO signed_id FROM placements WHERE mix_id = OLD.id AND state = 'signed' LIMIT 1;
  IF signed_id IS NOT NULL THEN
    RAISE EXCEPTION USING
      ERRCODE = 'PW409',
      MESSAGE = format('mix %s (%s) is used by signed placement %s and cannot be changed', OLD.id, OLD.code, signed_id),
      HINT = 'Add the revised design as a new mix and choose it for the coming placements.';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER mix_designs_signed_frozen BEFORE UPDATE OR DELETE ON mix_designs
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_mix();
