CREATE TABLE "request_counts" (
	"bucket" text NOT NULL,
	"address" text NOT NULL,
	"window_start" timestamp with time zone NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "request_counts_bucket_address_window_start_pk" PRIMARY KEY("bucket","address","window_start")
);
--> statement-breakpoint
ALTER TABLE "sites" ADD COLUMN "installation" jsonb;--> statement-breakpoint
CREATE INDEX "request_counts_window_idx" ON "request_counts" USING btree ("window_start");