CREATE TABLE "calibrations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"device" text NOT NULL,
	"reference_hz" double precision NOT NULL,
	"reference_uncertainty_ppm" double precision DEFAULT 0 NOT NULL,
	"measured_hz" double precision NOT NULL,
	"offset_ppm" double precision NOT NULL,
	"uncertainty_ppm" double precision NOT NULL,
	"operator_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "calibrations" ADD CONSTRAINT "calibrations_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calibrations" ADD CONSTRAINT "calibrations_operator_id_users_id_fk" FOREIGN KEY ("operator_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "calibrations_device_idx" ON "calibrations" USING btree ("workshop_id","device","created_at");