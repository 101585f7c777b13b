CREATE TABLE "analyses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"sweep_id" uuid NOT NULL,
	"params_key" text NOT NULL,
	"params" jsonb NOT NULL,
	"readings_revision" integer NOT NULL,
	"result" jsonb NOT NULL,
	"field_width" integer NOT NULL,
	"field_height" integer NOT NULL,
	"cell_size" double precision NOT NULL,
	"field_values" "bytea" NOT NULL,
	"field_confidence" "bytea" NOT NULL,
	"duration_ms" integer NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "analyses_sweep_params" ON "analyses" USING btree ("sweep_id","params_key");--> statement-breakpoint
CREATE INDEX "analyses_company" ON "analyses" USING btree ("company_id");