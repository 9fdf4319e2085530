-- A signed statement is evidence: once stored, its row and PDF bytes never change. A correction
-- is revision n+1 in a new row. Refused for every role that connects, the app's own included.
CREATE TRIGGER statements_immutable
  BEFORE UPDATE OR DELETE ON statements
  FOR EACH ROW EXECUTE FUNCTION synledger_refuse_change();
--> statement-breakpoint
CREATE TRIGGER statements_no_truncate
  BEFORE TRUNCATE ON statements
  FOR EACH STATEMENT EXECUTE FUNCTION synledger_refuse_change();
