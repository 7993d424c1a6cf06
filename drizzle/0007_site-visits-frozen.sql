-- A signed visit report is frozen like a signed placement (drizzle/0002, SQLSTATE PW409): the
-- database refuses to change or delete the report row, and refuses new findings under it. Its
-- findings keep their observation (what, where, severity, requirement, action, due date, the
-- placement held up) unchanged; only the follow-up columns may still change (the superintendent's
-- answer, the inspector's close or reopen, with who and when), because a finding is closed after
-- re-inspection, often days after the report was signed. The one allowed change to the report is
-- the update that signs it (its old state is not yet 'signed').

CREATE OR REPLACE FUNCTION placewright_visit_is_signed(vid uuid) RETURNS boolean
LANGUAGE plpgsql AS $$
DECLARE
  current_state site_visit_state;
BEGIN
  IF vid IS NULL THEN
    RETURN false;
  END IF;
  -- FOR SHARE waits for a sign-off in progress on the same report.
  SELECT state INTO current_state FROM site_visits WHERE id = vid FOR SHARE;
  RETURN coalesce(current_state = 'signed', false);
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION placewright_refuse_signed_visit() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.state = 'signed' THEN
    RAISE EXCEPTION USING
      ERRCODE = 'PW409',
      MESSAGE = format('site visit %s is signed and cannot be changed', OLD.id),
      HINT = 'Add an amendment instead.';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION placewright_refuse_signed_finding() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') AND placewright_visit_is_signed(OLD.site_visit_id) THEN
    IF TG_OP = 'DELETE'
      OR NEW.site_visit_id IS DISTINCT FROM OLD.site_visit_id
      OR NEW.project_id IS DISTINCT FROM OLD.project_id
      OR NEW.placement_id IS DISTINCT FROM OLD.placement_id
      OR NEW.description IS DISTINCT FROM OLD.description
      OR NEW.location IS DISTINCT FROM OLD.location
      OR NEW.severity IS DISTINCT FROM OLD.severity
      OR NEW.requirement IS DISTINCT FROM OLD.requirement
      OR NEW.action_required IS DISTINCT FROM OLD.action_required
      OR NEW.due_date IS DISTINCT FROM OLD.due_date
      OR NEW.created_at IS DISTINCT FROM OLD.created_at
      OR NEW.deleted_at IS DISTINCT FROM OLD.deleted_at THEN
      RAISE EXCEPTION USING
        ERRCODE = 'PW409',
        MESSAGE = format('finding %s belongs to signed site visit %s; its observation cannot be changed', OLD.id, OLD.site_visit_id),
        HINT = 'Add an amendment instead.';
    END IF;
  END IF;
  IF TG_OP IN ('INSERT', 'UPDATE') AND placewright_visit_is_signed(NEW.site_visit_id)
    AND (TG_OP = 'INSERT' OR NEW.site_visit_id IS DISTINCT FROM OLD.site_visit_id) THEN
    RAISE EXCEPTION USING
      ERRCODE = 'PW409',
      MESSAGE = format('site visit %s is signed; no finding can be added to it', NEW.site_visit_id),
      HINT = 'Record it on a new visit.';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER site_visits_signed_frozen BEFORE UPDATE OR DELETE ON site_visits
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_visit();
--> statement-breakpoint
CREATE TRIGGER findings_signed_frozen BEFORE INSERT OR UPDATE OR DELETE ON findings
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_finding();
