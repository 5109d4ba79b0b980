-- The history's trigger function no longer turns a large binary column into text (docs/decisions/0020-history.md):
-- a hidden column of type bytea (a site record's stored file, up to 20 MB) is left out of the row's jsonb, and
-- whether it changed is asked of the values themselves. Everything else is as migration 0009 made it.
CREATE OR REPLACE FUNCTION record_history() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  project_path text := TG_ARGV[1];
  left_out text[] := ARRAY['id', 'version', 'created_by', 'created_at', 'updated_at']
    || CASE WHEN project_path = 'project_id' THEN ARRAY['project_id'] ELSE ARRAY[]::text[] END
    || string_to_array(coalesce(TG_ARGV[2], ''), ',');
  hidden text[] := string_to_array(coalesce(TG_ARGV[3], ''), ',');
  state_column text := nullif(coalesce(TG_ARGV[4], ''), '');
  binary_columns text[] := ARRAY[]::text[];
  kept_columns text;
  old_row jsonb;
  new_row jsonb;
  row_now jsonb;
  project uuid;
  changes jsonb := '{}';
  col text;
  before_value jsonb;
  after_value jsonb;
  differs boolean;
  action text;
BEGIN
  IF cardinality(hidden) > 0 THEN
    SELECT coalesce(array_agg(a.attname::text), ARRAY[]::text[]) INTO binary_columns
    FROM pg_attribute a
    WHERE a.attrelid = TG_RELID AND a.attnum > 0 AND NOT a.attisdropped AND a.atttypid = 'bytea'::regtype AND a.attname::text = ANY (hidden);
  END IF;
  IF cardinality(binary_columns) = 0 THEN
    old_row := CASE WHEN TG_OP <> 'INSERT' THEN to_jsonb(OLD) END;
    new_row := CASE WHEN TG_OP <> 'DELETE' THEN to_jsonb(NEW) END;
  ELSE
    SELECT string_agg(format('s.%I', a.attname), ', ' ORDER BY a.attnum) INTO kept_columns
    FROM pg_attribute a
    WHERE a.attrelid = TG_RELID AND a.attnum > 0 AND NOT a.attisdropped AND NOT a.attname::text = ANY (binary_columns);
    IF TG_OP <> 'INSERT' THEN
      EXECUTE format('SELECT to_jsonb(r) FROM (SELECT %s FROM (SELECT ($1).*) s) r', kept_columns) INTO old_row USING OLD;
    END IF;
    IF TG_OP <> 'DELETE' THEN
      EXECUTE format('SELECT to_jsonb(r) FROM (SELECT %s FROM (SELECT ($1).*) s) r', kept_columns) INTO new_row USING NEW;
    END IF;
  END IF;
  row_now := coalesce(new_row, old_row);
  project := history_project_of(row_now, project_path);
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
  FOREACH col IN ARRAY binary_columns LOOP
    CONTINUE WHEN col = ANY (left_out);
    IF TG_OP = 'UPDATE' THEN
      EXECUTE format('SELECT ($1).%1$I IS DISTINCT FROM ($2).%1$I', col) INTO differs USING OLD, NEW;
    ELSIF TG_OP = 'INSERT' THEN
      EXECUTE format('SELECT ($1).%I IS NOT NULL', col) INTO differs USING NEW;
    ELSE
      EXECUTE format('SELECT ($1).%I IS NOT NULL', col) INTO differs USING OLD;
    END IF;
    IF differs THEN
      changes := changes || jsonb_build_object(col, jsonb_build_object('changed', true));
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
