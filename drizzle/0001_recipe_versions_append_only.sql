-- A saved version is a permanent record: the database itself refuses to change or remove one.
CREATE OR REPLACE FUNCTION recipe_versions_refuse_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'recipe versions are append-only (% refused)', TG_OP USING ERRCODE = 'restrict_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER recipe_versions_append_only
  BEFORE UPDATE OR DELETE ON recipe_versions
  FOR EACH ROW EXECUTE FUNCTION recipe_versions_refuse_change();
