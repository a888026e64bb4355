CREATE TABLE "cut_plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"piece_id" uuid NOT NULL,
	"strike_id" uuid NOT NULL,
	"family" text NOT NULL,
	"material" text NOT NULL,
	"geometry" jsonb NOT NULL,
	"modes_hz" jsonb NOT NULL,
	"stations" jsonb NOT NULL,
	"predicted" jsonb NOT NULL,
	"feasible" boolean NOT NULL,
	"note" text,
	"hand_factor" double precision NOT NULL,
	"hand_factor_plans" integer NOT NULL,
	"model_fundamental_change_cents" double precision NOT NULL,
	"model_version" text NOT NULL,
	"engine_version" text NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "blanks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"lot_id" uuid,
	"species" text NOT NULL,
	"length_mm" double precision NOT NULL,
	"width_mm" double precision NOT NULL,
	"thickness_mm" double precision NOT NULL,
	"mass_g" double precision NOT NULL,
	"f1_hz" double precision NOT NULL,
	"decay_db_per_s" double precision,
	"density_kg_m3" double precision NOT NULL,
	"youngs_modulus_gpa" double precision NOT NULL,
	"youngs_modulus_timoshenko_gpa" double precision NOT NULL,
	"specific_modulus" double precision NOT NULL,
	"loss_factor" double precision,
	"rank" text NOT NULL,
	"grade" jsonb NOT NULL,
	"piece_id" uuid,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "pieces" ADD COLUMN "geometry" jsonb;--> statement-breakpoint
ALTER TABLE "pieces" ADD COLUMN "material" text;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_strike_id_strikes_id_fk" FOREIGN KEY ("strike_id") REFERENCES "public"."strikes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "blanks" ADD CONSTRAINT "blanks_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "blanks" ADD CONSTRAINT "blanks_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "blanks" ADD CONSTRAINT "blanks_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "blanks" ADD CONSTRAINT "blanks_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "cut_plans_strike_key" ON "cut_plans" USING btree ("strike_id");--> statement-breakpoint
CREATE INDEX "cut_plans_piece_idx" ON "cut_plans" USING btree ("piece_id","created_at");--> statement-breakpoint
CREATE INDEX "cut_plans_hand_idx" ON "cut_plans" USING btree ("workshop_id","family","material","created_at");--> statement-breakpoint
CREATE INDEX "blanks_workshop_species_idx" ON "blanks" USING btree ("workshop_id","species","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "blanks_piece_key" ON "blanks" USING btree ("piece_id");