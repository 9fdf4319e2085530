CREATE TABLE "month_snapshots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"month_id" uuid NOT NULL,
	"period" text NOT NULL,
	"revision" integer NOT NULL,
	"seq" integer NOT NULL,
	"engine_version" text NOT NULL,
	"closure_tolerance_pct" numeric NOT NULL,
	"document_text" text NOT NULL,
	"document_sha256" text NOT NULL,
	"result_text" text NOT NULL,
	"result_sha256" text NOT NULL,
	"calculation_text" text NOT NULL,
	"context" jsonb NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "month_snapshots_sha256_hex" CHECK ("month_snapshots"."document_sha256" ~ '^[0-9a-f]{64}$' AND "month_snapshots"."result_sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
-- Each month owns its method from now on: months that still followed the site take its values.
UPDATE "months" AS m SET
  "emissions_method" = COALESCE(m."emissions_method", s."emissions_method"),
  "factor_set" = COALESCE(m."factor_set", s."factor_set"),
  "gwp" = COALESCE(m."gwp", s."gwp")
FROM "sites" AS s
WHERE s."id" = m."site_id" AND (m."emissions_method" IS NULL OR m."factor_set" IS NULL OR m."gwp" IS NULL);--> statement-breakpoint
ALTER TABLE "months" ALTER COLUMN "emissions_method" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "months" ALTER COLUMN "factor_set" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "months" ALTER COLUMN "gwp" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "months" ADD COLUMN "covered_through" date;--> statement-breakpoint
ALTER TABLE "statements" ADD COLUMN "snapshot_id" uuid;--> statement-breakpoint
ALTER TABLE "month_snapshots" ADD CONSTRAINT "month_snapshots_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "month_snapshots" ADD CONSTRAINT "month_snapshots_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "month_snapshots" ADD CONSTRAINT "month_snapshots_month_id_months_id_fk" FOREIGN KEY ("month_id") REFERENCES "public"."months"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "month_snapshots" ADD CONSTRAINT "month_snapshots_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "month_snapshots_month_revision_seq_key" ON "month_snapshots" USING btree ("month_id","revision","seq");--> statement-breakpoint
CREATE INDEX "month_snapshots_site_period_idx" ON "month_snapshots" USING btree ("site_id","period");--> statement-breakpoint
ALTER TABLE "statements" ADD CONSTRAINT "statements_snapshot_id_month_snapshots_id_fk" FOREIGN KEY ("snapshot_id") REFERENCES "public"."month_snapshots"("id") ON DELETE restrict ON UPDATE no action;