-- An approved design is frozen in the database as well as in the services (docs/decisions/0019-sign-off-freeze.md):
-- UPDATE or DELETE of a tuning variant, its load-case links, its mode, its load cases or its comfort criteria that an
-- approved sign-off rests on raises SQLSTATE SO409. The one change allowed is the sign-off's own move of a comfort
-- criteria's status (with version and updated_at), made in a transaction that ran SET LOCAL stillspan.sign_off = 'on'.
CREATE FUNCTION sign_off_frozen(what text) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% belongs to an approved design and is frozen; copy the variant and submit again', what
    USING ERRCODE = 'SO409';
END;
$$;
--> statement-breakpoint
CREATE FUNCTION tuning_variants_freeze() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM sign_offs s WHERE s.variant_id = OLD.id AND s.status = 'approved') THEN
    PERFORM sign_off_frozen('The tuning variant ' || OLD.id);
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER tuning_variants_freeze BEFORE UPDATE OR DELETE ON tuning_variants
  FOR EACH ROW EXECUTE FUNCTION tuning_variants_freeze();
--> statement-breakpoint
CREATE FUNCTION tuning_variant_load_cases_freeze() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM sign_offs s WHERE s.variant_id = OLD.variant_id AND s.status = 'approved') THEN
    PERFORM sign_off_frozen('The load cases of the tuning variant ' || OLD.variant_id);
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER tuning_variant_load_cases_freeze BEFORE UPDATE OR DELETE ON tuning_variant_load_cases
  FOR EACH ROW EXECUTE FUNCTION tuning_variant_load_cases_freeze();
--> statement-breakpoint
CREATE FUNCTION structure_modes_freeze() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (
    SELECT 1 FROM sign_offs s JOIN tuning_variants v ON v.id = s.variant_id
    WHERE v.mode_id = OLD.id AND s.status = 'approved'
  ) THEN
    PERFORM sign_off_frozen('The mode ' || OLD.id);
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER structure_modes_freeze BEFORE UPDATE OR DELETE ON structure_modes
  FOR EACH ROW EXECUTE FUNCTION structure_modes_freeze();
--> statement-breakpoint
CREATE FUNCTION load_cases_freeze() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (
    SELECT 1 FROM sign_offs s JOIN tuning_variant_load_cases l ON l.variant_id = s.variant_id
    WHERE l.load_case_id = OLD.id AND s.status = 'approved'
  ) THEN
    PERFORM sign_off_frozen('The load case ' || OLD.id);
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER load_cases_freeze BEFORE UPDATE OR DELETE ON load_cases
  FOR EACH ROW EXECUTE FUNCTION load_cases_freeze();
--> statement-breakpoint
CREATE FUNCTION comfort_criteria_freeze() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'UPDATE'
    AND current_setting('stillspan.sign_off', true) = 'on'
    AND (to_jsonb(NEW) - 'status' - 'version' - 'updated_at') = (to_jsonb(OLD) - 'status' - 'version' - 'updated_at') THEN
    RETURN NEW;
  END IF;
  IF EXISTS (SELECT 1 FROM sign_offs s WHERE s.criteria_id = OLD.id AND s.status = 'approved') THEN
    PERFORM sign_off_frozen('The comfort criteria ' || OLD.id);
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER comfort_criteria_freeze BEFORE UPDATE OR DELETE ON comfort_criteria
  FOR EACH ROW EXECUTE FUNCTION comfort_criteria_freeze();
