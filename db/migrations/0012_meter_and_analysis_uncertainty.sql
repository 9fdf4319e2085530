ALTER TABLE "streams" ADD COLUMN "metered" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "streams" ADD COLUMN "systematic_pct" numeric;--> statement-breakpoint
ALTER TABLE "gas_analyses" ADD COLUMN "carbon_uncertainty_pct" numeric;--> statement-breakpoint
ALTER TABLE "gas_analyses" ADD COLUMN "cv_uncertainty_pct" numeric;