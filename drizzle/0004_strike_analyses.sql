CREATE TABLE "reanalysis_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"set_id" uuid NOT NULL,
	"piece_id" uuid,
	"scope" text NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"engine_version" text,
	"job_id" text,
	"result" jsonb,
	"error" text,
	"requested_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "strike_analyses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"strike_id" uuid NOT NULL,
	"engine_version" text NOT NULL,
	"analysis" jsonb NOT NULL,
	"verdict" text,
	"worst_cents" double precision,
	"fundamental_hz" double precision,
	"applied" boolean DEFAULT true NOT NULL,
	"reason" text NOT NULL,
	"run_id" uuid,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "reanalysis_runs" ADD CONSTRAINT "reanalysis_runs_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reanalysis_runs" ADD CONSTRAINT "reanalysis_runs_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reanalysis_runs" ADD CONSTRAINT "reanalysis_runs_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reanalysis_runs" ADD CONSTRAINT "reanalysis_runs_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strike_analyses" ADD CONSTRAINT "strike_analyses_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strike_analyses" ADD CONSTRAINT "strike_analyses_strike_id_strikes_id_fk" FOREIGN KEY ("strike_id") REFERENCES "public"."strikes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strike_analyses" ADD CONSTRAINT "strike_analyses_run_id_reanalysis_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."reanalysis_runs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strike_analyses" ADD CONSTRAINT "strike_analyses_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "reanalysis_runs_active_set_key" ON "reanalysis_runs" USING btree ("set_id") WHERE status in ('queued', 'running');--> statement-breakpoint
CREATE INDEX "reanalysis_runs_workshop_idx" ON "reanalysis_runs" USING btree ("workshop_id","created_at");--> statement-breakpoint
CREATE INDEX "reanalysis_runs_status_idx" ON "reanalysis_runs" USING btree ("status","job_id");--> statement-breakpoint
CREATE INDEX "strike_analyses_strike_idx" ON "strike_analyses" USING btree ("strike_id","created_at");--> statement-breakpoint
CREATE INDEX "strike_analyses_workshop_idx" ON "strike_analyses" USING btree ("workshop_id","created_at");--> statement-breakpoint
-- Hand-written: every stored strike's current result becomes the first row of its history.
INSERT INTO "strike_analyses" ("workshop_id", "strike_id", "engine_version", "analysis", "verdict", "worst_cents", "fundamental_hz", "applied", "reason", "created_by", "created_at")
SELECT "workshop_id", "id", "engine_version", "analysis", "verdict", "worst_cents", "fundamental_hz", true, 'recorded', "user_id", "created_at" FROM "strikes";
