-- Signed is signed (SYNC.md promise 5): the database itself refuses to change a signed placement
-- or anything recorded under it, so even a bug in application code cannot. The one allowed change
-- is the update that makes a placement signed (its old state is not yet 'signed').
-- SQLSTATE PW409 is ours; lib/records maps it to a 409 "add an amendment instead".
-- Breaks are not frozen: the lab breaks cylinders weeks after the placement was signed.

CREATE OR REPLACE FUNCTION placewright_placement_is_signed(pid uuid) RETURNS boolean
LANGUAGE plpgsql AS $$
DECLARE
  current_state placement_state;
BEGIN
  IF pid IS NULL THEN
    RETURN false;
  END IF;
  -- FOR SHARE waits for a sign-off in progress on the same placement, so a child written
  -- concurrently with the sign-off cannot slip in after it.
  SELECT state INTO current_state FROM placements WHERE id = pid FOR SHARE;
  RETURN coalesce(current_state = 'signed', false);
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION placewright_record_placement(kind text, rid uuid) RETURNS uuid
LANGUAGE plpgsql AS $$
DECLARE
  pid uuid;
BEGIN
  CASE kind
    WHEN 'placements' THEN pid := rid;
    WHEN 'deliveries' THEN SELECT placement_id INTO pid FROM deliveries WHERE id = rid;
    WHEN 'field-tests' THEN SELECT placement_id INTO pid FROM field_tests WHERE id = rid;
    WHEN 'specimen-sets' THEN SELECT placement_id INTO pid FROM specimen_sets WHERE id = rid;
    WHEN 'weather-observations' THEN SELECT placement_id INTO pid FROM weather_observations WHERE id = rid;
    WHEN 'checklists' THEN SELECT placement_id INTO pid FROM checklists WHERE id = rid;
    WHEN 'checklist-items' THEN
      SELECT c.placement_id INTO pid FROM checklist_items i JOIN checklists c ON c.id = i.checklist_id WHERE i.id = rid;
    WHEN 'curing-readings' THEN SELECT placement_id INTO pid FROM curing_readings WHERE id = rid;
    ELSE pid := NULL;
  END CASE;
  RETURN pid;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION placewright_refuse_signed_placement() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.state = 'signed' THEN
    RAISE EXCEPTION USING
      ERRCODE = 'PW409',
      MESSAGE = format('placement %s is signed and cannot be changed', OLD.id),
      HINT = 'Add an amendment instead.';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
-- TG_ARGV[0] says how a row finds its placement: its placement_id column, its checklist, or the
-- record it describes (photos: record_type + record_id).
CREATE OR REPLACE FUNCTION placewright_refuse_signed_child() RETURNS trigger
LANGUAGE plpgsql AS $$
DECLARE
  candidates jsonb[] := ARRAY[]::jsonb[];
  r jsonb;
  pid uuid;
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    candidates := candidates || to_jsonb(OLD);
  END IF;
  IF TG_OP IN ('INSERT', 'UPDATE') THEN
    candidates := candidates || to_jsonb(NEW);
  END IF;
  FOREACH r IN ARRAY candidates LOOP
    pid := CASE TG_ARGV[0]
      WHEN 'placement_id' THEN (r ->> 'placement_id')::uuid
      WHEN 'checklist_id' THEN (SELECT placement_id FROM checklists WHERE id = (r ->> 'checklist_id')::uuid)
      WHEN 'record' THEN placewright_record_placement(r ->> 'record_type', (r ->> 'record_id')::uuid)
    END;
    IF placewright_placement_is_signed(pid) THEN
      RAISE EXCEPTION USING
        ERRCODE = 'PW409',
        MESSAGE = format('%s %s belongs to signed placement %s and cannot be changed', TG_TABLE_NAME, r ->> 'id', pid),
        HINT = 'Add an amendment instead.';
    END IF;
  END LOOP;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER placements_signed_frozen BEFORE UPDATE OR DELETE ON placements
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_placement();
--> statement-breakpoint
CREATE TRIGGER deliveries_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON deliveries
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('placement_id');
--> statement-breakpoint
CREATE TRIGGER field_tests_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON field_tests
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('placement_id');
--> statement-breakpoint
CREATE TRIGGER specimen_sets_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON specimen_sets
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('placement_id');
--> statement-breakpoint
CREATE TRIGGER weather_observations_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON weather_observations
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('placement_id');
--> statement-breakpoint
CREATE TRIGGER checklists_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON checklists
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('placement_id');
--> statement-breakpoint
CREATE TRIGGER checklist_items_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON checklist_items
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('checklist_id');
--> statement-breakpoint
CREATE TRIGGER curing_readings_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON curing_readings
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('placement_id');
--> statement-breakpoint
CREATE TRIGGER photos_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON photos
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_child('record');
