ALTER TABLE "pieces" ADD COLUMN "geometry" jsonb;--> statement-breakpoint
ALTER TABLE "pieces" ADD COLUMN "material" text;