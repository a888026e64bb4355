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
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_strike_id_strikes_id_fk" FOREIGN KEY ("strike_id") REFERENCES "public"."strikes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_plans" ADD CONSTRAINT "cut_plans_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "cut_plans_strike_key" ON "cut_plans" USING btree ("strike_id");--> statement-breakpoint
CREATE INDEX "cut_plans_piece_idx" ON "cut_plans" USING btree ("piece_id","created_at");--> statement-breakpoint
CREATE INDEX "cut_plans_hand_idx" ON "cut_plans" USING btree ("workshop_id","family","material","created_at");