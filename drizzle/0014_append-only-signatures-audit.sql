-- Signatures, amendments and the audit trail are append-only in the database itself, whatever the
-- path (a bug, a hand-run statement, a compromised app connection): rows may be inserted, never
-- changed or removed (SQLSTATE PW409, like the freeze triggers of 0002 and 0007, which already keep
-- a project with signed records from being deleted).
CREATE OR REPLACE FUNCTION placewright_refuse_append_only() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION USING
    ERRCODE = 'PW409',
    MESSAGE = format('%s is append-only: rows cannot be %s', TG_TABLE_NAME, lower(TG_OP) || 'd'),
    HINT = 'Add a new entry (an amendment, a new sign-off) instead.';
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION placewright_refuse_truncate() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION USING ERRCODE = 'PW409', MESSAGE = format('%s is append-only: it cannot be truncated', TG_TABLE_NAME);
END $$;
--> statement-breakpoint
CREATE TRIGGER sign_offs_append_only BEFORE UPDATE OR DELETE ON "sign_offs" FOR EACH ROW EXECUTE FUNCTION placewright_refuse_append_only();
--> statement-breakpoint
CREATE TRIGGER amendments_append_only BEFORE UPDATE OR DELETE ON "amendments" FOR EACH ROW EXECUTE FUNCTION placewright_refuse_append_only();
--> statement-breakpoint
CREATE TRIGGER audit_entries_append_only BEFORE UPDATE OR DELETE ON "audit_entries" FOR EACH ROW EXECUTE FUNCTION placewright_refuse_append_only();
--> statement-breakpoint
CREATE TRIGGER sign_offs_no_truncate BEFORE TRUNCATE ON "sign_offs" FOR EACH STATEMENT EXECUTE FUNCTION placewright_refuse_truncate();
--> statement-breakpoint
CREATE TRIGGER amendments_no_truncate BEFORE TRUNCATE ON "amendments" FOR EACH STATEMENT EXECUTE FUNCTION placewright_refuse_truncate();
--> statement-breakpoint
CREATE TRIGGER audit_entries_no_truncate BEFORE TRUNCATE ON "audit_entries" FOR EACH STATEMENT EXECUTE FUNCTION placewright_refuse_truncate();
