ALTER TABLE "workshops" ADD COLUMN "calibration_valid_days" integer DEFAULT 90 NOT NULL;--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "repeat_strikes_before_review" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "blank_thresholds" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "template_versions" ADD COLUMN "decision_rule" text DEFAULT 'simple' NOT NULL;--> statement-breakpoint
ALTER TABLE "strikes" ADD COLUMN "calibration_id" uuid;--> statement-breakpoint
ALTER TABLE "strikes" ADD CONSTRAINT "strikes_calibration_id_calibrations_id_fk" FOREIGN KEY ("calibration_id") REFERENCES "public"."calibrations"("id") ON DELETE no action ON UPDATE no action;