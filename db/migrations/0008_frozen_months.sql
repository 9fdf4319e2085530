-- Signed means frozen, in the database too, for every role that connects (the app's included).
-- The life-cycle service (lib/lifecycle) marks its transaction with the transaction-local
-- setting synledger.lifecycle = 'on'; only such a transaction may move a month's state, change a
-- frozen month, or write a snapshot. Readings, gas analyses and attachments of a month In review,
-- Signed or Submitted cannot be added, changed or removed at all.
CREATE OR REPLACE FUNCTION synledger_lifecycle_on() RETURNS boolean
LANGUAGE sql STABLE AS $$
  SELECT coalesce(current_setting('synledger.lifecycle', true), '') = 'on'
$$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION synledger_guard_month() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF synledger_lifecycle_on() THEN
    RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
  END IF;
  IF TG_OP = 'INSERT' THEN
    IF NEW.state <> 'open' OR NEW.revision <> 1 THEN
      RAISE EXCEPTION 'month % refused: a month starts Open at revision 1; only the life cycle moves it on', NEW.period
        USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN NEW;
  END IF;
  IF OLD.state IN ('in_review', 'signed', 'submitted') THEN
    RAISE EXCEPTION 'month % is %: it is frozen, and % refused; only the life cycle (return, reopen) changes it', OLD.period, OLD.state, TG_OP
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  IF NEW.state IS DISTINCT FROM OLD.state OR NEW.revision IS DISTINCT FROM OLD.revision THEN
    RAISE EXCEPTION 'month % refused: its state (% to %) and revision change only through the life cycle', OLD.period, OLD.state, NEW.state
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER months_guard
  BEFORE INSERT OR UPDATE OR DELETE ON months
  FOR EACH ROW EXECUTE FUNCTION synledger_guard_month();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION synledger_guard_month_figures() RETURNS trigger
LANGUAGE plpgsql AS $$
DECLARE
  ids uuid[];
  frozen record;
BEGIN
  ids := CASE TG_OP
    WHEN 'INSERT' THEN ARRAY[NEW.month_id]
    WHEN 'DELETE' THEN ARRAY[OLD.month_id]
    ELSE ARRAY[OLD.month_id, NEW.month_id]
  END;
  -- FOR SHARE waits for a transition that holds the month, so the state read is the one that commits.
  SELECT period, state INTO frozen FROM months
    WHERE id = ANY (ids) AND state IN ('in_review', 'signed', 'submitted')
    LIMIT 1 FOR SHARE;
  IF FOUND THEN
    RAISE EXCEPTION '% on % refused: month % is %, and its figures are frozen', TG_OP, TG_TABLE_NAME, frozen.period, frozen.state
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER readings_frozen
  BEFORE INSERT OR UPDATE OR DELETE ON readings
  FOR EACH ROW EXECUTE FUNCTION synledger_guard_month_figures();
--> statement-breakpoint
CREATE TRIGGER gas_analyses_frozen
  BEFORE INSERT OR UPDATE OR DELETE ON gas_analyses
  FOR EACH ROW EXECUTE FUNCTION synledger_guard_month_figures();
--> statement-breakpoint
CREATE TRIGGER attachments_frozen
  BEFORE INSERT OR UPDATE OR DELETE ON attachments
  FOR EACH ROW EXECUTE FUNCTION synledger_guard_month_figures();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION synledger_guard_snapshot_insert() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF NOT synledger_lifecycle_on() THEN
    RAISE EXCEPTION 'a month snapshot is written only by the life cycle (send for review)'
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER month_snapshots_insert
  BEFORE INSERT ON month_snapshots
  FOR EACH ROW EXECUTE FUNCTION synledger_guard_snapshot_insert();
--> statement-breakpoint
CREATE TRIGGER month_snapshots_append_only
  BEFORE UPDATE OR DELETE ON month_snapshots
  FOR EACH ROW EXECUTE FUNCTION synledger_refuse_change();
--> statement-breakpoint
CREATE TRIGGER month_snapshots_no_truncate
  BEFORE TRUNCATE ON month_snapshots
  FOR EACH STATEMENT EXECUTE FUNCTION synledger_refuse_change();
