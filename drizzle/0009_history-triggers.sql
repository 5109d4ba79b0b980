-- The project's history (docs/decisions/0020-history.md): an AFTER row trigger on every table of a project's things
-- writes one history_events row per change, in the transaction of the change, with the person named by the
-- transaction-local setting stillspan.actor (server/db/actor.ts; none when unset).
--
-- record_history(entity, project [, left_out [, hidden [, state_column]]]):
--   entity        what the API calls the thing ('load-case', …); its label is the row's name, label or file_name
--   project       the column holding the project's id ('project_id'), or 'column:table' when the project is that of
--                 the row of `table` whose id the column holds ('structure_id:structures')
--   left_out      comma-separated columns never recorded and whose change alone records nothing (caches, derived
--                 values); id, version, created_by, created_at, updated_at and a 'project_id' project column always are
--   hidden        comma-separated large columns recorded as { "changed": true } instead of their values
--   state_column  a column whose new value names the action on insert and whenever it changes (a sign-off's status)
-- A row whose project (or parent) is already gone is being deleted with it and records nothing.
-- Attaching it to a new table of a project is one statement, e.g.
--   CREATE TRIGGER as_built_records_history AFTER INSERT OR UPDATE OR DELETE ON as_built_records
--     FOR EACH ROW EXECUTE FUNCTION record_history('as-built-record', 'project_id');
CREATE FUNCTION history_actor() RETURNS uuid LANGUAGE sql STABLE AS $$
  SELECT CASE WHEN s ~* '^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$' THEN s::uuid END
  FROM (SELECT current_setting('stillspan.actor', true) AS s) setting;
$$;
--> statement-breakpoint
CREATE FUNCTION history_project_of(row_values jsonb, project_path text) RETURNS uuid LANGUAGE plpgsql AS $$
DECLARE
  path text[] := string_to_array(project_path, ':');
  found_id uuid;
BEGIN
  IF row_values ->> path[1] IS NULL THEN
    RETURN NULL;
  ELSIF array_length(path, 1) = 1 THEN
    SELECT p.id INTO found_id FROM projects p WHERE p.id = (row_values ->> path[1])::uuid;
  ELSE
    EXECUTE format('SELECT t.project_id FROM %I t JOIN projects p ON p.id = t.project_id WHERE t.id = $1', path[2])
      INTO found_id USING (row_values ->> path[1])::uuid;
  END IF;
  RETURN found_id;
END;
$$;
--> statement-breakpoint
CREATE FUNCTION history_insert(project uuid, entity text, entity_id uuid, label text, action text, changes jsonb) RETURNS void LANGUAGE plpgsql AS $$
DECLARE
  actor uuid := history_actor();
  actor_name text;
  actor_email text;
BEGIN
  IF actor IS NOT NULL THEN
    SELECT u.name, u.email INTO actor_name, actor_email FROM users u WHERE u.id = actor;
    IF NOT FOUND THEN actor := NULL; END IF;
  END IF;
  INSERT INTO history_events (project_id, actor_id, actor_name, actor_email, entity, entity_id, label, action, changes)
  VALUES (project, actor, actor_name, actor_email, entity, entity_id, label, action, changes);
END;
$$;
--> statement-breakpoint
CREATE FUNCTION record_history() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  old_row jsonb := CASE WHEN TG_OP <> 'INSERT' THEN to_jsonb(OLD) END;
  new_row jsonb := CASE WHEN TG_OP <> 'DELETE' THEN to_jsonb(NEW) END;
  row_now jsonb := coalesce(new_row, old_row);
  project_path text := TG_ARGV[1];
  left_out text[] := ARRAY['id', 'version', 'created_by', 'created_at', 'updated_at']
    || CASE WHEN project_path = 'project_id' THEN ARRAY['project_id'] ELSE ARRAY[]::text[] END
    || string_to_array(coalesce(TG_ARGV[2], ''), ',');
  hidden text[] := string_to_array(coalesce(TG_ARGV[3], ''), ',');
  state_column text := nullif(coalesce(TG_ARGV[4], ''), '');
  project uuid := history_project_of(row_now, project_path);
  changes jsonb := '{}';
  col text;
  before_value jsonb;
  after_value jsonb;
  action text;
BEGIN
  IF project IS NULL THEN
    RETURN NULL;
  END IF;
  FOR col IN SELECT jsonb_object_keys(row_now) LOOP
    CONTINUE WHEN col = ANY (left_out);
    before_value := old_row -> col;
    after_value := new_row -> col;
    IF TG_OP = 'UPDATE' THEN
      CONTINUE WHEN before_value IS NOT DISTINCT FROM after_value;
    ELSE
      CONTINUE WHEN coalesce(before_value, after_value) = 'null'::jsonb;
    END IF;
    IF col = ANY (hidden) THEN
      changes := changes || jsonb_build_object(col, jsonb_build_object('changed', true));
    ELSIF TG_OP = 'INSERT' THEN
      changes := changes || jsonb_build_object(col, jsonb_build_object('after', after_value));
    ELSIF TG_OP = 'DELETE' THEN
      changes := changes || jsonb_build_object(col, jsonb_build_object('before', before_value));
    ELSE
      changes := changes || jsonb_build_object(col, jsonb_build_object('before', before_value, 'after', after_value));
    END IF;
  END LOOP;
  IF TG_OP = 'UPDATE' AND changes = '{}' THEN
    RETURN NULL;
  END IF;
  action := CASE TG_OP WHEN 'INSERT' THEN 'create' WHEN 'UPDATE' THEN 'update' ELSE 'delete' END;
  IF state_column IS NOT NULL AND (TG_OP = 'INSERT' OR (TG_OP = 'UPDATE' AND changes ? state_column)) THEN
    action := new_row ->> state_column;
  END IF;
  PERFORM history_insert(project, TG_ARGV[0], (row_now ->> 'id')::uuid,
    coalesce(row_now ->> 'name', row_now ->> 'label', row_now ->> 'file_name', row_now -> 'snapshot' -> 'variant' ->> 'name'), action, changes);
  RETURN NULL;
END;
$$;
--> statement-breakpoint
-- A variant's load-case list is part of the variant: its change is the `load_case_ids` change of the variant's entry
-- of the same transaction (made here when the variant's own row did not change). BEFORE the first link row of the
-- transaction is written, the list as it was is kept as `before`; AFTER each statement the list as it is becomes
-- `after`; a list that ends as it began records nothing.
CREATE FUNCTION history_variant_entry(variant uuid) RETURNS history_events LANGUAGE sql AS $$
  SELECT * FROM history_events
  WHERE transaction_id = txid_current() AND entity_id = variant AND entity = 'tuning-variant' AND action <> 'delete'
  ORDER BY seq DESC LIMIT 1;
$$;
--> statement-breakpoint
CREATE FUNCTION history_load_case_list(variant uuid) RETURNS jsonb LANGUAGE sql AS $$
  SELECT coalesce(jsonb_agg(l.load_case_id ORDER BY l.position), '[]'::jsonb) FROM tuning_variant_load_cases l WHERE l.variant_id = variant;
$$;
--> statement-breakpoint
CREATE FUNCTION record_variant_load_cases_before() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  variant uuid := CASE WHEN TG_OP = 'DELETE' THEN OLD.variant_id ELSE NEW.variant_id END;
  project uuid;
  variant_name text;
  entry history_events;
BEGIN
  SELECT v.project_id, v.name INTO project, variant_name FROM tuning_variants v JOIN projects p ON p.id = v.project_id WHERE v.id = variant;
  IF project IS NOT NULL THEN
    entry := history_variant_entry(variant);
    IF entry.id IS NULL THEN
      PERFORM history_insert(project, 'tuning-variant', variant, variant_name, 'update',
        jsonb_build_object('load_case_ids', jsonb_build_object('before', history_load_case_list(variant))));
    ELSIF NOT entry.changes ? 'load_case_ids' THEN
      UPDATE history_events SET changes = changes || jsonb_build_object('load_case_ids', jsonb_build_object('before', history_load_case_list(variant)))
      WHERE id = entry.id;
    END IF;
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE FUNCTION record_variant_load_cases_after() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  variant uuid := CASE WHEN TG_OP = 'DELETE' THEN OLD.variant_id ELSE NEW.variant_id END;
  entry history_events := history_variant_entry(variant);
  list_now jsonb;
  list_before jsonb;
BEGIN
  IF entry.id IS NULL OR NOT entry.changes ? 'load_case_ids' THEN
    RETURN NULL;
  END IF;
  list_now := history_load_case_list(variant);
  list_before := entry.changes -> 'load_case_ids' -> 'before';
  IF entry.action = 'create' THEN
    UPDATE history_events SET changes = changes || jsonb_build_object('load_case_ids', jsonb_build_object('after', list_now)) WHERE id = entry.id;
  ELSIF list_before = list_now THEN
    IF entry.changes - 'load_case_ids' = '{}'::jsonb THEN
      DELETE FROM history_events WHERE id = entry.id;
    ELSE
      UPDATE history_events SET changes = changes - 'load_case_ids' WHERE id = entry.id;
    END IF;
  ELSE
    UPDATE history_events SET changes = changes || jsonb_build_object('load_case_ids', jsonb_build_object('before', list_before, 'after', list_now))
    WHERE id = entry.id;
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER structures_history AFTER INSERT OR UPDATE OR DELETE ON structures
  FOR EACH ROW EXECUTE FUNCTION record_history('structure', 'project_id');
--> statement-breakpoint
CREATE TRIGGER structure_modes_history AFTER INSERT OR UPDATE OR DELETE ON structure_modes
  FOR EACH ROW EXECUTE FUNCTION record_history('mode', 'structure_id:structures', 'lumped_model_id');
--> statement-breakpoint
CREATE TRIGGER lumped_models_history AFTER INSERT OR UPDATE OR DELETE ON lumped_models
  FOR EACH ROW EXECUTE FUNCTION record_history('lumped-model', 'structure_id:structures');
--> statement-breakpoint
CREATE TRIGGER load_cases_history AFTER INSERT OR UPDATE OR DELETE ON load_cases
  FOR EACH ROW EXECUTE FUNCTION record_history('load-case', 'project_id');
--> statement-breakpoint
CREATE TRIGGER comfort_criteria_history AFTER INSERT OR UPDATE OR DELETE ON comfort_criteria
  FOR EACH ROW EXECUTE FUNCTION record_history('comfort-criteria', 'project_id');
--> statement-breakpoint
CREATE TRIGGER tuning_variants_history AFTER INSERT OR UPDATE OR DELETE ON tuning_variants
  FOR EACH ROW EXECUTE FUNCTION record_history('tuning-variant', 'project_id', 'result,result_error,inputs_hash,engine_version,computed_at');
--> statement-breakpoint
CREATE TRIGGER tuning_variant_load_cases_history_before BEFORE INSERT OR UPDATE OR DELETE ON tuning_variant_load_cases
  FOR EACH ROW EXECUTE FUNCTION record_variant_load_cases_before();
--> statement-breakpoint
CREATE TRIGGER tuning_variant_load_cases_history_after AFTER INSERT OR UPDATE OR DELETE ON tuning_variant_load_cases
  FOR EACH ROW EXECUTE FUNCTION record_variant_load_cases_after();
--> statement-breakpoint
CREATE TRIGGER sign_offs_history AFTER INSERT OR UPDATE OR DELETE ON sign_offs
  FOR EACH ROW EXECUTE FUNCTION record_history('sign-off', 'project_id', 'submitted_by,submitted_at,decided_by,decided_at', 'snapshot', 'status');
--> statement-breakpoint
CREATE TRIGGER site_records_history AFTER INSERT OR UPDATE OR DELETE ON site_records
  FOR EACH ROW EXECUTE FUNCTION record_history('site-record', 'project_id', '', 'file_bytes,analysis');
