CREATE TABLE "leak_detection_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"system_id" uuid NOT NULL,
	"checked_on" date NOT NULL,
	"working" boolean NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"by_id" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "hermetically_sealed" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retired_on" date;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retire_reason_kind" text;--> statement-breakpoint
ALTER TABLE "leak_detection_checks" ADD CONSTRAINT "leak_detection_checks_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_detection_checks" ADD CONSTRAINT "leak_detection_checks_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_detection_checks" ADD CONSTRAINT "leak_detection_checks_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "leak_detection_checks_system" ON "leak_detection_checks" USING btree ("system_id");