ALTER TABLE "workshops" ADD COLUMN "time_zone" text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "locale" text DEFAULT 'en-GB' NOT NULL;