-- Owners receive the digest through their membership. Their recipient row used to be written while
-- someone merely looked at the list (a GET that inserted rows); now it is written when the
-- membership is (any path: administration, invitation, seed), and existing owners are filled in once.
-- An address the office added earlier is linked to the owner's account; an unsubscribe stays.
CREATE OR REPLACE FUNCTION placewright_owner_digest_recipient() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF NEW.role = 'owner' THEN
    INSERT INTO digest_recipients (project_id, email, user_id, source)
    SELECT NEW.project_id, lower(u.email), u.id, 'member' FROM users u WHERE u.id = NEW.user_id
    ON CONFLICT (project_id, email) DO UPDATE SET user_id = excluded.user_id
      WHERE digest_recipients.user_id IS NULL;
  END IF;
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER memberships_owner_digest_recipient AFTER INSERT OR UPDATE OF role ON memberships
  FOR EACH ROW EXECUTE FUNCTION placewright_owner_digest_recipient();
--> statement-breakpoint
INSERT INTO digest_recipients (project_id, email, user_id, source)
SELECT m.project_id, lower(u.email), u.id, 'member'
FROM memberships m JOIN users u ON u.id = m.user_id
WHERE m.role = 'owner'
ON CONFLICT (project_id, email) DO UPDATE SET user_id = excluded.user_id
  WHERE digest_recipients.user_id IS NULL;
