-- The chain of custody is append-only: no row of history_events may be changed or removed,
-- whatever code or script connects. Refusing in the database means a bug cannot rewrite history.
CREATE FUNCTION history_events_refuse_change() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'history_events is append-only: % refused', TG_OP
    USING ERRCODE = 'insufficient_privilege';
END;
$$;
--> statement-breakpoint
CREATE TRIGGER history_events_append_only
  BEFORE UPDATE OR DELETE ON history_events
  FOR EACH ROW EXECUTE FUNCTION history_events_refuse_change();
--> statement-breakpoint
CREATE TRIGGER history_events_no_truncate
  BEFORE TRUNCATE ON history_events
  FOR EACH STATEMENT EXECUTE FUNCTION history_events_refuse_change();
