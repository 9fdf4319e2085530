CREATE TYPE "public"."mail_status" AS ENUM('pending', 'sent', 'failed');--> statement-breakpoint
CREATE TYPE "public"."statement_kind" AS ENUM('monthly', 'annual');--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" bigint PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "mail_outbox_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"to" text NOT NULL,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"html" text NOT NULL,
	"status" "mail_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "signing_certificates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"label" text NOT NULL,
	"p12" "bytea" NOT NULL,
	"passphrase_sealed" text NOT NULL,
	"subject" text NOT NULL,
	"fingerprint_sha256" text NOT NULL,
	"valid_from" timestamp with time zone NOT NULL,
	"valid_to" timestamp with time zone NOT NULL,
	"uploaded_by" uuid,
	"active" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "signing_certificates_fingerprint_hex" CHECK ("signing_certificates"."fingerprint_sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
CREATE TABLE "statements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"kind" "statement_kind" NOT NULL,
	"period" text NOT NULL,
	"month_id" uuid,
	"revision" integer NOT NULL,
	"pdf" "bytea" NOT NULL,
	"sha256" text NOT NULL,
	"signer_user_id" uuid NOT NULL,
	"signer_name" text NOT NULL,
	"signer_role" text NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	"certificate_fingerprint" text NOT NULL,
	"summary" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "statements_sha256_hex" CHECK ("statements"."sha256" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "statements_revision_positive" CHECK ("statements"."revision" >= 1),
	CONSTRAINT "statements_period_format" CHECK (("statements"."kind" = 'monthly' AND "statements"."period" ~ '^[0-9]{4}-(0[1-9]|1[0-2])$') OR ("statements"."kind" = 'annual' AND "statements"."period" ~ '^[0-9]{4}$'))
);
--> statement-breakpoint
-- Before the foreign keys: statements.certificate_fingerprint references this unique column.
CREATE UNIQUE INDEX "signing_certificates_fingerprint_key" ON "signing_certificates" USING btree ("fingerprint_sha256");--> statement-breakpoint
ALTER TABLE "signing_certificates" ADD CONSTRAINT "signing_certificates_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signing_certificates" ADD CONSTRAINT "signing_certificates_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "statements" ADD CONSTRAINT "statements_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "statements" ADD CONSTRAINT "statements_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "statements" ADD CONSTRAINT "statements_month_id_months_id_fk" FOREIGN KEY ("month_id") REFERENCES "public"."months"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "statements" ADD CONSTRAINT "statements_signer_user_id_users_id_fk" FOREIGN KEY ("signer_user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "statements" ADD CONSTRAINT "statements_certificate_fingerprint_signing_certificates_fingerprint_sha256_fk" FOREIGN KEY ("certificate_fingerprint") REFERENCES "public"."signing_certificates"("fingerprint_sha256") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "mail_outbox_due_idx" ON "mail_outbox" USING btree ("next_attempt_at") WHERE "mail_outbox"."status" = 'pending';--> statement-breakpoint
CREATE UNIQUE INDEX "signing_certificates_one_active" ON "signing_certificates" USING btree ("organisation_id") WHERE "signing_certificates"."active";--> statement-breakpoint
CREATE UNIQUE INDEX "statements_sha256_key" ON "statements" USING btree ("sha256");--> statement-breakpoint
CREATE UNIQUE INDEX "statements_site_kind_period_revision_key" ON "statements" USING btree ("site_id","kind","period","revision");--> statement-breakpoint
CREATE INDEX "statements_org_idx" ON "statements" USING btree ("organisation_id","signed_at");