CREATE TABLE "flag_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"month_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"code" text NOT NULL,
	"stream" text DEFAULT '' NOT NULL,
	"text" text NOT NULL,
	"written_by" uuid,
	"written_by_name" text NOT NULL,
	"written_role" text NOT NULL,
	"written_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "flag_notes" ADD CONSTRAINT "flag_notes_month_id_months_id_fk" FOREIGN KEY ("month_id") REFERENCES "public"."months"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "flag_notes" ADD CONSTRAINT "flag_notes_written_by_users_id_fk" FOREIGN KEY ("written_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "flag_notes_month_revision_code_stream_key" ON "flag_notes" USING btree ("month_id","revision","code","stream");--> statement-breakpoint
-- Explanations are part of the revision: frozen with its figures from In review on.
CREATE TRIGGER flag_notes_frozen
  BEFORE INSERT OR UPDATE OR DELETE ON flag_notes
  FOR EACH ROW EXECUTE FUNCTION synledger_guard_month_figures();
