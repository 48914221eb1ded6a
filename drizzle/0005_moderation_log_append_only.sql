-- The moderation log is an audit trail: the database itself refuses to change or remove an entry.
CREATE OR REPLACE FUNCTION moderation_actions_refuse_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'moderation actions are append-only (% refused)', TG_OP USING ERRCODE = 'restrict_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER moderation_actions_append_only
  BEFORE UPDATE OR DELETE ON moderation_actions
  FOR EACH ROW EXECUTE FUNCTION moderation_actions_refuse_change();
