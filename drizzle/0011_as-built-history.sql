-- As-built records join the project's history (docs/decisions/0020-history.md): each record of measured damper units
-- is one entry, with the person who recorded it. Who and when are the entry's own, so they are not repeated in it.
CREATE TRIGGER as_built_records_history AFTER INSERT OR UPDATE OR DELETE ON as_built_records
  FOR EACH ROW EXECUTE FUNCTION record_history('as-built-record', 'project_id', 'recorded_by,recorded_at');
