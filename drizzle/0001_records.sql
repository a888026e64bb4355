CREATE TABLE "lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"code" text NOT NULL,
	"material" text NOT NULL,
	"species" text DEFAULT '' NOT NULL,
	"supplier" text DEFAULT '' NOT NULL,
	"received_on" text,
	"moisture_pct" double precision,
	"documents" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "pieces" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"set_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"note" text NOT NULL,
	"midi" integer NOT NULL,
	"target_hz" double precision NOT NULL,
	"template_version_id" uuid NOT NULL,
	"lot_id" uuid,
	"stage" text DEFAULT 'blank' NOT NULL,
	"assignee_id" uuid,
	"strike_count" integer DEFAULT 0 NOT NULL,
	"rework_count" integer DEFAULT 0 NOT NULL,
	"latest_strike_id" uuid,
	"latest_verdict" text,
	"latest_worst_cents" double precision,
	"latest_fundamental_hz" double precision,
	"latest_strike_at" timestamp with time zone,
	"approved_strike_id" uuid,
	"approved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ratio_templates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"family" text NOT NULL,
	"name" text NOT NULL,
	"current_version" integer DEFAULT 1 NOT NULL,
	"archived" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reviews" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"piece_id" uuid NOT NULL,
	"strike_id" uuid,
	"supervisor_id" uuid,
	"decision" text NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"override_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"name" text NOT NULL,
	"model" text NOT NULL,
	"serial" text NOT NULL,
	"buyer_name" text NOT NULL,
	"buyer_organisation" text DEFAULT '' NOT NULL,
	"buyer_email" text NOT NULL,
	"reference_hz" double precision DEFAULT 440 NOT NULL,
	"temperament" text DEFAULT 'equal' NOT NULL,
	"note_offsets_cents" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"from_note" text NOT NULL,
	"to_note" text NOT NULL,
	"chromatic" boolean DEFAULT true NOT NULL,
	"template_id" uuid,
	"registers" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"due_on" text,
	"shipped_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "strikes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"piece_id" uuid NOT NULL,
	"user_id" uuid,
	"stage" text NOT NULL,
	"temperature_c" double precision,
	"humidity_pct" double precision,
	"audio_key" text NOT NULL,
	"audio_bytes" integer NOT NULL,
	"audio_type" text NOT NULL,
	"audio_name" text DEFAULT '' NOT NULL,
	"engine_version" text NOT NULL,
	"analysis" jsonb NOT NULL,
	"template_version_id" uuid,
	"fundamental_hz" double precision,
	"worst_cents" double precision,
	"verdict" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "template_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"template_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"name" text NOT NULL,
	"family" text NOT NULL,
	"partials" jsonb NOT NULL,
	"search_window_cents" double precision DEFAULT 80 NOT NULL,
	"reference_temperature_c" double precision DEFAULT 20 NOT NULL,
	"temperature_coefficient_cents_per_c" double precision DEFAULT 0 NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"source" text DEFAULT '' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "lots" ADD CONSTRAINT "lots_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pieces" ADD CONSTRAINT "pieces_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pieces" ADD CONSTRAINT "pieces_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pieces" ADD CONSTRAINT "pieces_template_version_id_template_versions_id_fk" FOREIGN KEY ("template_version_id") REFERENCES "public"."template_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pieces" ADD CONSTRAINT "pieces_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pieces" ADD CONSTRAINT "pieces_assignee_id_users_id_fk" FOREIGN KEY ("assignee_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ratio_templates" ADD CONSTRAINT "ratio_templates_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviews" ADD CONSTRAINT "reviews_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviews" ADD CONSTRAINT "reviews_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviews" ADD CONSTRAINT "reviews_strike_id_strikes_id_fk" FOREIGN KEY ("strike_id") REFERENCES "public"."strikes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviews" ADD CONSTRAINT "reviews_supervisor_id_users_id_fk" FOREIGN KEY ("supervisor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sets" ADD CONSTRAINT "sets_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sets" ADD CONSTRAINT "sets_template_id_ratio_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."ratio_templates"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strikes" ADD CONSTRAINT "strikes_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strikes" ADD CONSTRAINT "strikes_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strikes" ADD CONSTRAINT "strikes_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "strikes" ADD CONSTRAINT "strikes_template_version_id_template_versions_id_fk" FOREIGN KEY ("template_version_id") REFERENCES "public"."template_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_versions" ADD CONSTRAINT "template_versions_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_versions" ADD CONSTRAINT "template_versions_template_id_ratio_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."ratio_templates"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_versions" ADD CONSTRAINT "template_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "lots_workshop_code_key" ON "lots" USING btree ("workshop_id","code");--> statement-breakpoint
CREATE UNIQUE INDEX "pieces_set_position_key" ON "pieces" USING btree ("set_id","position");--> statement-breakpoint
CREATE INDEX "pieces_workshop_set_idx" ON "pieces" USING btree ("workshop_id","set_id","position");--> statement-breakpoint
CREATE INDEX "pieces_workshop_stage_idx" ON "pieces" USING btree ("workshop_id","stage","updated_at");--> statement-breakpoint
CREATE INDEX "pieces_workshop_verdict_idx" ON "pieces" USING btree ("workshop_id","latest_verdict");--> statement-breakpoint
CREATE INDEX "pieces_workshop_assignee_idx" ON "pieces" USING btree ("workshop_id","assignee_id");--> statement-breakpoint
CREATE INDEX "ratio_templates_workshop_idx" ON "ratio_templates" USING btree ("workshop_id");--> statement-breakpoint
CREATE INDEX "reviews_piece_idx" ON "reviews" USING btree ("piece_id","created_at");--> statement-breakpoint
CREATE INDEX "sets_workshop_idx" ON "sets" USING btree ("workshop_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "sets_workshop_serial_key" ON "sets" USING btree ("workshop_id","serial");--> statement-breakpoint
CREATE INDEX "strikes_piece_idx" ON "strikes" USING btree ("piece_id","created_at");--> statement-breakpoint
CREATE INDEX "strikes_workshop_user_idx" ON "strikes" USING btree ("workshop_id","user_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "template_versions_template_version_key" ON "template_versions" USING btree ("template_id","version");