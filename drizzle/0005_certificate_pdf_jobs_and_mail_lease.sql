ALTER TABLE "certificates" ADD COLUMN "pdf_status" text DEFAULT 'ready' NOT NULL;--> statement-breakpoint
ALTER TABLE "certificates" ADD COLUMN "pdf_job_id" text;--> statement-breakpoint
ALTER TABLE "certificates" ADD COLUMN "pdf_requested_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "certificates" ADD COLUMN "reissue_reason" text;--> statement-breakpoint
ALTER TABLE "mail_messages" ADD COLUMN "claimed_by" text;--> statement-breakpoint
ALTER TABLE "mail_messages" ADD COLUMN "claimed_until" timestamp with time zone;--> statement-breakpoint
CREATE UNIQUE INDEX "certificates_set_valid_key" ON "certificates" USING btree ("set_id") WHERE "certificates"."status" = 'valid';--> statement-breakpoint
CREATE INDEX "certificates_pdf_pending_idx" ON "certificates" USING btree ("pdf_status","pdf_job_id");