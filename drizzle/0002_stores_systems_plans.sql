CREATE TABLE "systems" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"store_id" uuid NOT NULL,
	"name" text NOT NULL,
	"refrigerant_id" text NOT NULL,
	"full_charge_kg" double precision NOT NULL,
	"appliance_type" text NOT NULL,
	"automatic_leak_detection" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fixtures" (
	"plan_id" uuid NOT NULL,
	"id" uuid NOT NULL,
	"kind" text NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"system_id" uuid,
	"has_fans" boolean DEFAULT false NOT NULL,
	"polygon" jsonb,
	"point_x" double precision,
	"point_y" double precision,
	"door_count" integer,
	"door" jsonb,
	"note" text,
	"typical_ppm" double precision,
	"position" integer NOT NULL,
	CONSTRAINT "fixtures_plan_id_id_pk" PRIMARY KEY("plan_id","id")
);
--> statement-breakpoint
CREATE TABLE "plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"store_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"source" text NOT NULL,
	"original_key" text,
	"display_key" text,
	"thumb_key" text,
	"original_mime" text,
	"original_width_px" integer,
	"original_height_px" integer,
	"image_width_px" integer,
	"image_height_px" integer,
	"metres_per_pixel" double precision,
	"calibration" jsonb,
	"width_m" double precision,
	"height_m" double precision,
	"previous_plan_id" uuid,
	"alignment" jsonb,
	"alignment_matched" boolean DEFAULT false NOT NULL,
	"layout_revision" integer DEFAULT 0 NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "stores" ADD COLUMN "updated_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "systems" ADD CONSTRAINT "systems_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "systems" ADD CONSTRAINT "systems_store_id_stores_id_fk" FOREIGN KEY ("store_id") REFERENCES "public"."stores"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fixtures" ADD CONSTRAINT "fixtures_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fixtures" ADD CONSTRAINT "fixtures_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_store_id_stores_id_fk" FOREIGN KEY ("store_id") REFERENCES "public"."stores"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "systems_store" ON "systems" USING btree ("store_id");--> statement-breakpoint
CREATE INDEX "fixtures_system" ON "fixtures" USING btree ("system_id");--> statement-breakpoint
CREATE UNIQUE INDEX "plans_store_version" ON "plans" USING btree ("store_id","version");--> statement-breakpoint
CREATE INDEX "plans_company" ON "plans" USING btree ("company_id");