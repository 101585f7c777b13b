CREATE TABLE "detectors" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"name" text NOT NULL,
	"principle" text NOT NULL,
	"transport_delay_s" real DEFAULT 5 NOT NULL,
	"time_constant_s" real DEFAULT 1.5 NOT NULL,
	"alarm_ppm" real DEFAULT 2 NOT NULL,
	"last_checked_on" date,
	"level_scale" jsonb,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "detectors" ADD CONSTRAINT "detectors_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "detectors_company" ON "detectors" USING btree ("company_id");