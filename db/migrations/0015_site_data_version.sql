ALTER TABLE "sites" ADD COLUMN "data_version" bigint DEFAULT 0 NOT NULL;--> statement-breakpoint
-- sites.data_version changes with anything a site's figures are made of, in the writing
-- transaction, whoever writes (the app, a script, a hand-made UPDATE): results kept in memory by
-- an app instance are keyed by it and so can never outlive their data. Statement-level triggers
-- with transition tables bump each site once per statement, not once per row of an import.
CREATE SEQUENCE "site_data_version_seq";
--> statement-breakpoint
CREATE OR REPLACE FUNCTION synledger_touch_sites(ids uuid[]) RETURNS void
LANGUAGE sql AS $$
  UPDATE sites SET data_version = nextval('site_data_version_seq') WHERE id = ANY (ids)
$$;
--> statement-breakpoint
-- A site's own settings: any change to the row but the version itself gives a new version.
CREATE OR REPLACE FUNCTION synledger_site_version() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF NEW.data_version IS NOT DISTINCT FROM OLD.data_version AND NEW IS DISTINCT FROM OLD THEN
    NEW.data_version := nextval('site_data_version_seq');
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER sites_data_version BEFORE UPDATE ON sites FOR EACH ROW EXECUTE FUNCTION synledger_site_version();
--> statement-breakpoint
-- Rows that name their site (streams, months).
CREATE OR REPLACE FUNCTION synledger_touch_sites_by_site_id() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM synledger_touch_sites(ARRAY(SELECT DISTINCT site_id FROM new_rows));
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM synledger_touch_sites(ARRAY(SELECT DISTINCT site_id FROM old_rows));
  ELSE
    PERFORM synledger_touch_sites(ARRAY(SELECT site_id FROM new_rows UNION SELECT site_id FROM old_rows));
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
-- Rows that name their month (readings, gas analyses, snapshots).
CREATE OR REPLACE FUNCTION synledger_touch_sites_by_month_id() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM synledger_touch_sites(ARRAY(SELECT DISTINCT m.site_id FROM new_rows r JOIN months m ON m.id = r.month_id));
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM synledger_touch_sites(ARRAY(SELECT DISTINCT m.site_id FROM old_rows r JOIN months m ON m.id = r.month_id));
  ELSE
    PERFORM synledger_touch_sites(ARRAY(
      SELECT m.site_id FROM new_rows r JOIN months m ON m.id = r.month_id
      UNION SELECT m.site_id FROM old_rows r JOIN months m ON m.id = r.month_id));
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER streams_version_ins AFTER INSERT ON streams REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_site_id();
--> statement-breakpoint
CREATE TRIGGER streams_version_upd AFTER UPDATE ON streams REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_site_id();
--> statement-breakpoint
CREATE TRIGGER streams_version_del AFTER DELETE ON streams REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_site_id();
--> statement-breakpoint
CREATE TRIGGER months_version_ins AFTER INSERT ON months REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_site_id();
--> statement-breakpoint
CREATE TRIGGER months_version_upd AFTER UPDATE ON months REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_site_id();
--> statement-breakpoint
CREATE TRIGGER months_version_del AFTER DELETE ON months REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_site_id();
--> statement-breakpoint
CREATE TRIGGER readings_version_ins AFTER INSERT ON readings REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
--> statement-breakpoint
CREATE TRIGGER readings_version_upd AFTER UPDATE ON readings REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
--> statement-breakpoint
CREATE TRIGGER readings_version_del AFTER DELETE ON readings REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
--> statement-breakpoint
CREATE TRIGGER gas_analyses_version_ins AFTER INSERT ON gas_analyses REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
--> statement-breakpoint
CREATE TRIGGER gas_analyses_version_upd AFTER UPDATE ON gas_analyses REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
--> statement-breakpoint
CREATE TRIGGER gas_analyses_version_del AFTER DELETE ON gas_analyses REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
--> statement-breakpoint
CREATE TRIGGER month_snapshots_version_ins AFTER INSERT ON month_snapshots REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION synledger_touch_sites_by_month_id();
