-- Photos of a signed visit report are frozen with it (SQLSTATE PW409, as drizzle/0002 and 0007):
-- a photo of the report itself cannot be added, changed or removed once it is signed. A photo of
-- one of its findings cannot be changed or removed either, but a new one may still be added: the
-- superintendent's evidence of the fix and the inspector's re-inspection come after the signature,
-- like the finding's answer and close. The server's own completion of an upload (storage key,
-- stored time, version, change number) is not a change of what the photo shows.
CREATE OR REPLACE FUNCTION placewright_refuse_signed_visit_photo() RETURNS trigger
LANGUAGE plpgsql AS $$
DECLARE
  r photos;
  vid uuid;
  content_changed boolean := TG_OP = 'UPDATE' AND (
    NEW.record_type IS DISTINCT FROM OLD.record_type
    OR NEW.record_id IS DISTINCT FROM OLD.record_id
    OR NEW.project_id IS DISTINCT FROM OLD.project_id
    OR NEW.sha256 IS DISTINCT FROM OLD.sha256
    OR NEW.size_bytes IS DISTINCT FROM OLD.size_bytes
    OR NEW.content_type IS DISTINCT FROM OLD.content_type
    OR NEW.caption IS DISTINCT FROM OLD.caption
    OR NEW.taken_at IS DISTINCT FROM OLD.taken_at
    OR NEW.deleted_at IS DISTINCT FROM OLD.deleted_at);
BEGIN
  IF TG_OP = 'INSERT' THEN
    r := NEW;
  ELSE
    r := OLD;
  END IF;
  IF r.record_type = 'site-visits' THEN
    vid := r.record_id;
  ELSIF r.record_type = 'findings' THEN
    SELECT site_visit_id INTO vid FROM findings WHERE id = r.record_id;
  END IF;
  IF vid IS NOT NULL AND placewright_visit_is_signed(vid)
    AND (TG_OP = 'DELETE' OR content_changed OR (TG_OP = 'INSERT' AND r.record_type = 'site-visits')) THEN
    RAISE EXCEPTION USING
      ERRCODE = 'PW409',
      MESSAGE = format('photo %s belongs to signed site visit %s and cannot be changed', r.id, vid),
      HINT = 'Add a new photo to the finding, or an amendment.';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER photos_signed_visit_frozen BEFORE INSERT OR UPDATE OR DELETE ON photos
  FOR EACH ROW EXECUTE FUNCTION placewright_refuse_signed_visit_photo();
